// In-process jobs bounded in bytes (JOBS_MAX_BYTES): the RSS of this process while 6 jobs of 30
// 10,000-sample tracks (about 30 MB of result lines each) are submitted one after another, with a
// 64 MiB bound and then without one (1 GiB, never reached). Test-sized; the figure that matters is
// the growth of RSS, what stays held at the end (run `node --expose-gc --import tsx bench/run.ts
// jobs-memory` for a figure after a full collection; the in-process answer cache, CACHE_MAX_BYTES,
// holds up to 64 MiB of its own), and how many jobs finished, were refused (503) or failed on the bound.
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../src/app.js';
import { baselineLoop, nsPerIteration } from './baseline.js';
import type { BenchResult } from './types.js';

const JOBS = 6;
const ITEMS = 30;
const MIB = 1024 * 1024;
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

const items = (tag: number) => Array.from({ length: ITEMS }, (_, i) => ({
  id: `t${i}`,
  kind: 'track',
  request: {
    centralBody: 'earth',
    elements: { epoch: '2026-12-01T00:00:00Z', semiMajorAxis: 6928.137 + tag, eccentricity: 0.0012, inclination: 97.6, raan: i, argPeriapsis: 90, trueAnomaly: 10 },
    grid: { start: '2026-12-01T00:00:00Z', stop: '2026-12-01T05:33:18Z', step: 2 },
  },
}));

async function run(maxBytes: number): Promise<{ rssGrowthMiB: number; heldMiB: number; keptMiB: number; done: number; refused: number; failed: number; itemsPerS: number }> {
  const app: FastifyInstance = await buildApp({ logger: false, config: { JOBS_MAX_BYTES: maxBytes, JOBS_MAX_KEPT: 100, RATE_LIMIT_PER_MIN: 0, RATE_LIMIT_HEAVY_PER_MIN: 0 } });
  await app.ready();
  const rss0 = process.memoryUsage().rss;
  let peak = rss0;
  let done = 0;
  let refused = 0;
  let failed = 0;
  const t0 = performance.now();
  const ids: string[] = [];
  for (let j = 0; j < JOBS; j++) {
    const res = await app.inject({ method: 'POST', url: '/v1/jobs', payload: { items: items(j + maxBytes / MIB) } });
    if (res.statusCode === 503) { refused++; continue; }
    const id = (res.json() as { id: string }).id;
    ids.push(id);
    for (;;) {
      const job = (await app.inject({ url: `/v1/jobs/${id}` })).json() as { status: string; counts: { failed: number } };
      const status = job.status;
      if (job.counts.failed > 0) throw new Error(`job ${id}: ${job.counts.failed} items answered a problem; the benchmark needs answers`);
      peak = Math.max(peak, process.memoryUsage().rss);
      if (status === 'done') { done++; break; }
      if (status === 'failed') { failed++; break; }
      await sleep(20);
    }
  }
  const seconds = (performance.now() - t0) / 1000;
  // What stays held with the jobs kept (after a full collection when node runs with --expose-gc).
  const gc = (globalThis as { gc?: () => void }).gc;
  gc?.(); gc?.();
  const heldMiB = (process.memoryUsage().heapUsed + process.memoryUsage().arrayBuffers) / MIB;
  // The result lines the queue still keeps (jobs not dropped), read back through the API.
  let kept = 0;
  for (const id of ids) {
    const res = await app.inject({ url: `/v1/jobs/${id}/results` });
    if (res.statusCode === 200) kept += res.rawPayload.length;
  }
  await app.close();
  return { rssGrowthMiB: (peak - rss0) / MIB, heldMiB, keptMiB: kept / MIB, done, refused, failed, itemsPerS: (done * ITEMS) / seconds };
}

export async function benchJobsMemory(): Promise<BenchResult[]> {
  const base = nsPerIteration(baselineLoop, 1_000_000);
  const out: BenchResult[] = [];
  await run(8 * MIB); // warm-up: modules, worker threads, JIT (not reported)
  for (const [label, bound] of [['JOBS_MAX_BYTES 64 MiB', 64 * MIB], ['JOBS_MAX_BYTES 1 GiB (no bound reached)', 1024 * MIB]] as const) {
    const r = await run(bound);
    out.push({
      name: `${JOBS} jobs x ${ITEMS} tracks of 10000 samples, ${label}`,
      opsPerSecond: r.itemsPerS,
      ratioToBaseline: 1e9 / r.itemsPerS / base.ns,
      note: `result lines kept ${r.keptMiB.toFixed(0)} MiB; RSS grew ${r.rssGrowthMiB.toFixed(0)} MiB at most, heap + buffers held at the end ${r.heldMiB.toFixed(0)} MiB${(globalThis as { gc?: unknown }).gc ? ' (after gc)' : ' (no --expose-gc)'}; ${r.done} done, ${r.failed} failed on the bound, ${r.refused} refused`,
    });
  }
  return out;
}
