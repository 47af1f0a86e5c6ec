// A queue worker as its own process (src/queue-worker.ts under tsx), as operators run it.
import { spawn, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import { fileURLToPath } from 'node:url';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));

export interface WorkerProcess {
  readonly child: ChildProcess;
  readonly pid: number;
  /** Resolves once the worker logged that it started taking jobs. */
  readonly started: Promise<void>;
  /** Resolves with the exit code (null when killed by a signal) and the signal. */
  readonly exited: Promise<[number | null, NodeJS.Signals | null]>;
  /** What it wrote to stderr (a failing test shows it). */
  readonly stderr: () => string;
}

export function startWorker(env: Record<string, string>): WorkerProcess {
  const child = spawn(process.execPath, ['--import', 'tsx', 'src/queue-worker.ts'], {
    cwd: ROOT,
    env: { ...process.env, LOG_LEVEL: 'info', WORKER_THREADS: '1', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let err = '';
  child.stderr!.on('data', (chunk: Buffer) => { err += chunk.toString(); });
  const started = new Promise<void>((resolve, reject) => {
    let out = '';
    child.stdout!.on('data', (chunk: Buffer) => {
      out += chunk.toString();
      if (out.includes('queue worker started')) resolve();
    });
    child.once('exit', (code) => reject(new Error(`worker exited (${code}) before it started: ${err}`)));
  });
  started.catch(() => {});
  const exited = once(child, 'exit') as Promise<[number | null, NodeJS.Signals | null]>;
  return { child, pid: child.pid!, started, exited, stderr: () => err };
}
