// Worker-thread entry of the solver pool: runs one job (src/workers/jobs.ts) and sends the result
// back in its wire form, the Float64Array buffers transferred rather than copied. Loads the solver
// and the pool's transfer marker only: no HTTP stack, schemas or caches in the thread.
import { move, transferableSymbol, valueSymbol } from 'piscina';
import { runJob, toWire, type Job } from './jobs.js';

export default function solveJob(job: Job): unknown {
  const wire = toWire(job.kind, runJob(job));
  return move({ [transferableSymbol]: wire.transfer, [valueSymbol]: wire.value } as Parameters<typeof move>[0]);
}
