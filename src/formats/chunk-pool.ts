// Output chunks of the ASCII writer, reused from one streamed answer to the next: a chunk handed
// to a response is returned here only once the response has finished, that is once its last byte
// has been handed to the operating system (Node's 'finish' of http.ServerResponse: every earlier
// write has completed, so no socket, compression stream or cache copy still reads the chunk).
// Bounded: at most maxChunks wait here; chunks not returned (an answer cut short, a chunk kept by
// other code) are left to the garbage collector, and then a new chunk is allocated instead.

export class ChunkPool {
  readonly #free: ArrayBufferLike[] = [];
  /** Buffers this pool made and has not been given back: only these may return, once each. */
  readonly #out = new WeakSet<ArrayBufferLike>();

  constructor(readonly chunkBytes: number, readonly maxChunks: number, readonly allocate: (bytes: number) => ArrayBufferLike = (bytes) => Buffer.allocUnsafe(bytes).buffer) {
    if (!(Number.isInteger(chunkBytes) && chunkBytes > Buffer.poolSize)) throw new RangeError('chunkBytes must exceed Buffer.poolSize (a chunk of its own, never a slice of the shared pool)');
  }

  /** A chunk of chunkBytes (its content is whatever was there: write before reading). */
  acquire(): Buffer {
    const reused = this.#free.pop();
    const buffer = reused ?? this.allocate(this.chunkBytes);
    this.#out.add(buffer);
    return Buffer.from(buffer, 0, this.chunkBytes);
  }

  /** Give back the chunks behind these views once nothing reads them; views of other memory are ignored. */
  release(views: Iterable<Uint8Array>): void {
    for (const v of views) {
      const buffer = v.buffer;
      if (!this.#out.has(buffer)) continue;
      this.#out.delete(buffer);
      if (this.#free.length < this.maxChunks) this.#free.push(buffer);
    }
  }

  /** True for a view of a chunk this pool handed out and has not had back. */
  owns(view: Uint8Array): boolean {
    return this.#out.has(view.buffer);
  }

  /** Chunks waiting to be reused. */
  get size(): number {
    return this.#free.length;
  }
}

/** The chunks of the formatters' default size (64 KiB): up to 256 of them (16 MiB) kept. */
export const OUTPUT_CHUNKS = new ChunkPool(65_536, 256);

/** Samples whose grid and states a tail arena holds at its start (56 bytes each: 5.6 MB for the default MAX_TRACK_SAMPLES). */
export const TAIL_ARENA_STATES_MAX = 100_000;

/**
 * Shared memory a long track is computed into (SolverPool.trackWithTail): its regular grid at
 * the start (written by the route), its states after it (the solver thread; up to
 * TAIL_ARENA_STATES_MAX samples, for the models that can write them there), then the last records
 * of the answer. 14 MiB each (0.8 MB of grid, 4.8 MB of states and the last 55 % of 100,000 JSON
 * samples, 7.7 MB, estimated 8.3), up to 2 kept: an arena goes back only once every
 * answer made from it has finished on a socket and the thread has ended normally (TailBytes in
 * src/formats/track-output.ts); else it is left to the collector. Pages written once are not
 * faulted in again: fresh memory for the states cost a page fault each 4 KiB on the solver
 * thread (100,000 samples took 17 ms instead of 5 on a 2-core virtual machine).
 */
export const TAIL_ARENAS = new ChunkPool(14 * 2 ** 20, 2, (bytes) => new SharedArrayBuffer(bytes));
