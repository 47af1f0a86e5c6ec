// Worker-thread entry of the solver pool: runs one job (src/workers/jobs.ts) and sends the result
// back in its wire form, the Float64Array buffers transferred rather than copied. Loads the solver
// and the pool's transfer marker only: no HTTP stack, schemas or caches in the thread.
// On start the thread lowers its own scheduling priority (Linux nice, per thread) by the pool's
// `nice`, so that the thread answering requests gets the CPU first when both want it.
import { readlinkSync } from 'node:fs';
import { getPriority, setPriority } from 'node:os';
import type { MessagePort } from 'node:worker_threads';
import { move, transferableSymbol, valueSymbol, workerData } from 'piscina';
import { runJob, runTrackWithTail, toWire, type Job, type TrackJob, type TrackTail, type Wire } from './jobs.js';

/** What the pool tells each of its threads (piscina's workerData). */
export interface WorkerSettings {
  /** Nice increment of this thread over the process, 0-19. */
  readonly nice: number;
}

/**
 * This thread's kernel task id on Linux (/proc/thread-self names it: "<pid>/task/<tid>"), else
 * undefined. On Linux every thread is a task with its own nice value: setpriority on the tid
 * changes this thread only (man 2 setpriority, NOTES).
 */
function linuxThreadId(): number | undefined {
  if (process.platform !== 'linux') return undefined;
  try {
    const tid = Number(readlinkSync('/proc/thread-self').split('/').pop());
    return Number.isInteger(tid) && tid > 0 ? tid : undefined;
  } catch {
    return undefined;
  }
}

/** Lower this thread's priority by `nice` (capped at 19); where that cannot be done the thread keeps the process priority. */
function lowerThreadPriority(nice: number): void {
  const tid = linuxThreadId();
  if (tid === undefined || nice <= 0) return;
  try {
    setPriority(tid, Math.min(19, getPriority(tid) + nice));
  } catch {
    // Refused (a limit on nice values, a sandbox): the thread keeps the process priority.
  }
}

const settings = workerData as WorkerSettings | undefined;
if (settings) lowerThreadPriority(settings.nice);

/** A track job whose last records this thread writes after it has sent the track on `port` (SolverPool.trackWithTail). */
export interface TrackTailTask {
  readonly kind: 'track-tail';
  readonly job: TrackJob;
  readonly tail: TrackTail;
  readonly port: MessagePort;
  /** The main thread's shared memory for the records (TAIL_ARENAS), when it lent one. */
  readonly arena?: SharedArrayBuffer;
}

/** A wire form for piscina: its buffers transferred, not copied. */
const moved = (wire: Wire): unknown => move({ [transferableSymbol]: wire.transfer, [valueSymbol]: wire.value } as Parameters<typeof move>[0]);

export default function solveJob(task: Job | TrackTailTask): unknown {
  if (task.kind !== 'track-tail') return moved(toWire(task.kind, runJob(task)));
  // The main thread closes the channel once it has the track (closing here could race the message).
  const records = runTrackWithTail(task.job, task.tail, (wire) => task.port.postMessage(wire.value, wire.transfer), task.arena);
  // Shared memory (the arena) is shared, not moved: only the thread's own buffers are transferred.
  return records === null ? null : moved({ value: records, transfer: [...new Set(records.map((r) => r.buffer).filter((b): b is ArrayBuffer => b instanceof ArrayBuffer))] });
}
