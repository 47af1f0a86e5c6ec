// `npm start` builds once and reuses the build: the build step is `tsc -b --verbose` on
// tsconfig.build.json (incremental, build information in dist/tsconfig.build.tsbuildinfo), which
// compares the inputs' times with the build information and compiles nothing when no input changed.
// The test makes sure the build exists, then runs `npm start` twice: each says the project is up to
// date (tsc -b's own verdict: it did not create a program, so nothing was parsed or checked), answers
// /healthz, and touches no file in dist/ (a compile rewrites the build information). Not timed.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import { readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterEach, describe, expect, it } from 'vitest';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const DIST = join(ROOT, 'dist');
let running: ChildProcess | undefined;

/** Every file under dist/ with its modification time in nanoseconds. */
function snapshot(dir = DIST, out = new Map<string, bigint>()): Map<string, bigint> {
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) snapshot(path, out);
    else out.set(path, statSync(path, { bigint: true }).mtimeNs);
  }
  return out;
}

/** `npm start` on a free port; resolves with its origin once it logs that it listens. */
async function start(): Promise<{ origin: string; output: () => string }> {
  const env: NodeJS.ProcessEnv = { ...process.env, PORT: '0', HOST: '127.0.0.1', LOG_LEVEL: 'info', WORKER_THREADS: '1' };
  delete env.REDIS_URL;
  delete env.API_KEYS;
  // Its own process group (npm -> sh -> node), so the whole group is stopped afterwards.
  const child = spawn('npm', ['start'], { cwd: ROOT, env, stdio: ['ignore', 'pipe', 'pipe'], detached: true });
  running = child;
  let log = '';
  child.stderr!.on('data', (d: Buffer) => { log += d.toString(); });
  const origin = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`npm start did not listen: ${log}`)), 90_000);
    child.once('exit', (code) => { clearTimeout(timer); reject(new Error(`npm start exited (${code}): ${log}`)); });
    child.stdout!.on('data', (d: Buffer) => {
      log += d.toString();
      const m = /listening at (http:\/\/127\.0\.0\.1:\d+)/.exec(log);
      if (m) { clearTimeout(timer); resolve(m[1]!); }
    });
  });
  return { origin, output: () => log };
}

async function stop(): Promise<void> {
  const child = running;
  running = undefined;
  if (!child || child.exitCode !== null || child.signalCode !== null) return;
  const exited = once(child, 'exit');
  process.kill(-child.pid!, 'SIGTERM');
  await exited;
}

afterEach(stop);

describe('npm start reuses the build', () => {
  it('a start after a build compiles nothing, twice in a row, and answers /healthz', async () => {
    const build = spawnSync('npm', ['run', '-s', 'build'], { cwd: ROOT, encoding: 'utf8' });
    expect(build.status, build.stdout + build.stderr).toBe(0);
    const before = snapshot();
    expect([...before.keys()]).toContain(join(DIST, 'tsconfig.build.tsbuildinfo'));
    expect([...before.keys()]).toContain(join(DIST, 'src', 'server.js'));

    for (let round = 0; round < 2; round++) {
      const { origin, output } = await start();
      const res = await fetch(`${origin}/healthz`, { signal: AbortSignal.timeout(10_000) });
      expect(res.status, output()).toBe(200);
      expect(output()).toMatch(/Project 'tsconfig\.build\.json' is up to date because/);
      expect(output()).not.toMatch(/Building project/);
      await stop();
      const after = snapshot();
      expect([...after.keys()].sort()).toEqual([...before.keys()].sort());
      const touched = [...after].filter(([path, mtime]) => before.get(path) !== mtime).map(([path]) => path);
      expect(touched, `start ${round + 1} rewrote files in dist/`).toEqual([]);
    }
  }, 240_000);

  it('the build information is where tsc -b looks for it, so the up-to-date check can succeed', () => {
    // tsc -b --dry reports what it would do without doing it: after the build above, nothing.
    const dry = spawnSync('npx', ['tsc', '-b', 'tsconfig.build.json', '--dry', '--verbose'], { cwd: ROOT, encoding: 'utf8' });
    expect(dry.status, dry.stdout + dry.stderr).toBe(0);
    expect(dry.stdout).toMatch(/is up to date/);
    expect(dry.stdout).not.toMatch(/would build/i);
  }, 60_000);
});
