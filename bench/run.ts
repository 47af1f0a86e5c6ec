// `npm run bench`: every benchmark, each reporting ratios against a baseline measured in the same run.
// Prints a table and the machine it ran on. Not a test: figures vary with the machine's load.
import { cpus, totalmem } from 'node:os';
import type { BenchResult } from './types.js';
import { benchCachedOrbit } from './cached-orbit.js';
import { benchEclipses } from './eclipses.js';
import { benchEphemeris } from './ephemeris.js';
import { benchFrames } from './frames.js';
import { benchJobs } from './jobs.js';
import { benchJobsMemory } from './jobs-memory.js';
import { benchKepler } from './kepler.js';
import { benchPasses } from './passes.js';
import { benchSgp4 } from './sgp4.js';
import { benchTrackHttp } from './track-http.js';
import { benchTrackKernel } from './track-kernel.js';

const suites: Array<[string, () => Promise<BenchResult[]>]> = [
  ['kepler', benchKepler],
  ['track-kernel', benchTrackKernel],
  ['track-http', benchTrackHttp],
  ['cached-orbit', benchCachedOrbit],
  ['passes', benchPasses],
  ['sgp4', benchSgp4],
  ['eclipses', benchEclipses],
  ['frames', benchFrames],
  ['ephemeris', benchEphemeris],
  ['jobs', benchJobs],
  ['jobs-memory', benchJobsMemory],
];

const only = process.argv[2];
console.log(`node ${process.version}, ${cpus().length} x ${cpus()[0]?.model ?? 'unknown cpu'}, ${(totalmem() / 2 ** 30).toFixed(0)} GiB, ${new Date().toISOString()}`);
for (const [name, run] of suites) {
  if (only && only !== name) continue;
  console.log(`\n## ${name}`);
  for (const r of await run()) {
    console.log(`${r.name.padEnd(60)} ${r.opsPerSecond.toExponential(3).padStart(10)} /s   ${r.ratioToBaseline.toFixed(2).padStart(7)} x baseline${r.note ? `   (${r.note})` : ''}`);
  }
}
