// GET /v1/jobs/{id}/archive: every item's product of a job as one .tar.gz, for the nightly
// publication. `job-<id>/manifest.json` first (the job, and per item its index, id, kind, status,
// scenario hash, format, media type, file and size), then one file per item in input order:
// `<index>-<item id or kind>.<format>` for a product, `<index>-<item id or kind>.problem.json` for a
// problem. Lines are read twice (once to size and name them, once to stream them), so memory holds
// one item at a time; every entry carries the job's finish time, so one job gives the same bytes.
import { Readable } from 'node:stream';
import { createGzip } from 'node:zlib';
import { pack as tarPack } from 'tar-stream';
import type { BatchLine } from '../schemas/batch.js';
import { lineProduct, productExtension } from './products.js';
import type { JobRecord } from './queue.js';

export interface ArchiveEntry {
  readonly index: number;
  readonly id: string | null;
  readonly kind: string;
  readonly status: number;
  readonly scenarioHash: string | null;
  readonly format: string | null;
  readonly mediaType: string | null;
  readonly file: string;
  readonly bytes: number;
}

/** A file name part from an item id: letters, digits, `.`, `_`, `-`, at most 60 characters. */
const safeName = (text: string): string => text.replace(/[^A-Za-z0-9._-]/g, '_').replace(/^\.+/, '_').slice(0, 60);

/** What a line becomes in the archive: its manifest entry and its bytes. */
function entryOf(line: Buffer, index: number, width: number): { entry: ArchiveEntry; body: Buffer } {
  const head = JSON.parse(line.toString('utf8')) as BatchLine; // lines are at most BATCH_MAX_ANSWER_BYTES
  const base = `${String(index).padStart(width, '0')}-${safeName(head.id ?? head.kind)}`;
  const product = head.status === 200 ? lineProduct(line) : undefined;
  const body = product ? product.bytes : Buffer.from(`${JSON.stringify(head.problem ?? null, null, 2)}\n`);
  const file = product ? `${base}.${productExtension(product.format)}` : `${base}.problem.json`;
  return {
    entry: {
      index, id: head.id, kind: head.kind, status: head.status, scenarioHash: head.scenarioHash ?? null,
      format: product?.format ?? null, mediaType: product?.mediaType ?? null, file, bytes: body.length,
    },
    body,
  };
}

/** The manifest entries of a job's lines and their total size, bytes (first pass). */
export async function archiveEntries(job: JobRecord, lines: AsyncIterable<Buffer>): Promise<{ entries: ArchiveEntry[]; bytes: number }> {
  const width = String(Math.max(job.items - 1, 0)).length;
  const entries: ArchiveEntry[] = [];
  let bytes = 0;
  let index = 0;
  for await (const line of lines) {
    const { entry } = entryOf(line, index++, width);
    entries.push(entry);
    bytes += entry.bytes;
  }
  return { entries, bytes };
}

export function manifestOf(job: JobRecord, entries: readonly ArchiveEntry[]): Buffer {
  const manifest = {
    job: { id: job.id, label: job.label, status: job.status, items: job.items, done: job.done, failed: job.failed, createdAt: job.createdAt, finishedAt: job.finishedAt },
    files: entries,
  };
  return Buffer.from(`${JSON.stringify(manifest, null, 2)}\n`);
}

/** The .tar.gz stream (second pass over the lines). */
export function archiveStream(job: JobRecord, entries: readonly ArchiveEntry[], lines: AsyncIterable<Buffer>): Readable {
  const pack = tarPack();
  const dir = `job-${job.id}`;
  const mtime = new Date(job.finishedAt ?? job.createdAt);
  const add = (name: string, body: Buffer) => new Promise<void>((resolve, reject) => {
    pack.entry({ name: `${dir}/${name}`, size: body.length, mtime, mode: 0o644 }, body, (error) => (error ? reject(error) : resolve()));
  });
  const width = String(Math.max(job.items - 1, 0)).length;
  void (async () => {
    try {
      await add('manifest.json', manifestOf(job, entries));
      let index = 0;
      for await (const line of lines) {
        if (index >= entries.length) break; // only what the manifest lists
        const { entry, body } = entryOf(line, index++, width);
        await add(entry.file, body);
      }
      pack.finalize();
    } catch (error) {
      pack.destroy(error as Error);
    }
  })();
  return pack.pipe(createGzip());
}
