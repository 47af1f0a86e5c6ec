// app.eop: the Earth orientation table of EOP_FILE (an IERS finals2000A file, parsed by
// src/solver/time/eop.ts), shared by every route. Loaded when the app is built (a bad file stops the
// start with its line); reloaded on reload() (server.ts calls it on SIGHUP) and, every
// EOP_CHECK_INTERVAL_S, when the file's modification time or size changed. A reload that fails
// (unreadable, malformed) keeps the table in force and logs why; /readyz shows it.
// The table's digest (SHA-256 of its rows) enters the scenario hash of every answer about the Earth
// (src/api/earth-orientation.ts), and the request memo's version, so an answer computed with one
// table is never served for another.
import { createHash } from 'node:crypto';
import { readFile, stat } from 'node:fs/promises';
import fp from 'fastify-plugin';
import type { FastifyInstance } from 'fastify';
import { eopLastMjd, mjdToIsoDate, parseFinals2000A, type EopTable } from '../solver/time/eop.js';

export interface EopState {
  readonly table: EopTable;
  /** SHA-256 (hex) of the table's first day and rows: what the answers depend on. */
  readonly digest: string;
  readonly file: string;
  readonly loadedAt: string;
  readonly mtimeMs: number;
  readonly size: number;
}

export interface EopStatus {
  readonly file: string;
  readonly firstDate: string;
  /** Last day whose polar motion and UT1-UTC are observed (IERS flag I); null when none is. */
  readonly lastObservedDate: string | null;
  /** Last day of the table (predictions). */
  readonly lastPredictedDate: string;
  readonly days: number;
  readonly digest: string;
  readonly loadedAt: string;
  /** Why the last reload failed (the table above stays in force), or null. */
  readonly lastReloadError: string | null;
}

export interface EopService {
  /** The table in force, or undefined without EOP_FILE. */
  current(): EopState | undefined;
  /** Read the file again; on failure keep the table in force. Resolves true when a new table was taken. */
  reload(): Promise<boolean>;
  status(): EopStatus | null;
}

declare module 'fastify' {
  interface FastifyInstance {
    eop: EopService;
  }
}

export const tableDigest = (t: EopTable): string =>
  createHash('sha256').update(`${t.firstMjd};${t.lastObservedMjd};`).update(new Uint8Array(t.rows.buffer, t.rows.byteOffset, t.rows.byteLength)).digest('hex');

/** Read and parse an EOP file; throws an Error naming the file and the line. */
export async function loadEopFile(file: string): Promise<EopState> {
  const [info, text] = await Promise.all([stat(file), readFile(file, 'utf8')]);
  const parsed = parseFinals2000A(text);
  if (!parsed.ok) throw new Error(`EOP_FILE ${file}: ${parsed.message}`);
  return { table: parsed.value, digest: tableDigest(parsed.value), file, loadedAt: new Date().toISOString(), mtimeMs: info.mtimeMs, size: info.size };
}

export default fp(async function eop(app: FastifyInstance) {
  const file = app.config.EOP_FILE;
  let state: EopState | undefined;
  let lastError: string | null = null;
  if (file !== undefined) {
    try {
      state = await loadEopFile(file);
    } catch (error) {
      // A bad file at start stops the start, naming the file (and the line when it was read).
      const message = (error as Error).message;
      throw new Error(message.startsWith('EOP_FILE') ? message : `EOP_FILE ${file}: ${message}`, { cause: error });
    }
    app.log.info({ file, days: state.table.rows.length / 6, digest: state.digest }, 'EOP table loaded');
  }
  const reload = async (): Promise<boolean> => {
    if (file === undefined) return false;
    try {
      const next = await loadEopFile(file);
      lastError = null;
      if (state && next.digest === state.digest) {
        state = { ...state, mtimeMs: next.mtimeMs, size: next.size };
        return false;
      }
      state = next;
      app.log.info({ file, digest: next.digest }, 'EOP table reloaded');
      return true;
    } catch (error) {
      lastError = `${(error as Error).message} (at ${new Date().toISOString()}; the table loaded ${state?.loadedAt} stays in force)`;
      app.log.error({ file, err: error }, 'EOP table reload failed: the table in force is kept');
      return false;
    }
  };
  const intervalS = app.config.EOP_CHECK_INTERVAL_S;
  if (file !== undefined && intervalS > 0) {
    let checking = false;
    const timer = setInterval(() => {
      if (checking) return;
      checking = true;
      stat(file).then((info) => (state && info.mtimeMs === state.mtimeMs && info.size === state.size ? false : reload()), (error: unknown) => {
        lastError = `${(error as Error).message} (the table loaded ${state?.loadedAt} stays in force)`;
        return false;
      }).finally(() => { checking = false; });
    }, intervalS * 1000);
    timer.unref();
    app.addHook('onClose', async () => clearInterval(timer));
  }
  app.decorate('eop', {
    current: () => state,
    reload,
    status: () => state
      ? {
        file: state.file,
        firstDate: mjdToIsoDate(state.table.firstMjd),
        lastObservedDate: Number.isNaN(state.table.lastObservedMjd) ? null : mjdToIsoDate(state.table.lastObservedMjd),
        lastPredictedDate: mjdToIsoDate(eopLastMjd(state.table)),
        days: state.table.rows.length / 6,
        digest: state.digest,
        loadedAt: state.loadedAt,
        lastReloadError: lastError,
      }
      : null,
  } satisfies EopService);
}, { name: 'eop' });
