// The request memo: exact request bytes -> the scenario hash they were answered under, so a repeated
// request is answered from the cache without parsing into a scenario, validating, canonicalising
// and hashing again. The key is every input the answer depends on, each part length-prefixed so
// that two different requests never make the same key (a prefix code: the parts can be read back
// from the key), and the map compares whole keys (no digest of them, so no collision). Every entry
// records the solver version it was made under; one made under another version is never returned.
// Bounded in entries and in bytes (keys counted at 2 bytes a character), least recently used first out.
import { LRUCache } from 'lru-cache';

/** Bytes an entry costs beyond its key: the hash, the version and the map's bookkeeping, roughly. */
const ENTRY_OVERHEAD_BYTES = 200;

export interface RequestMemoOptions {
  /** Most entries kept. */
  readonly maxEntries: number;
  /** Most bytes kept (keys and entries); a key alone larger than an eighth of it is not kept. */
  readonly maxBytes: number;
  /** The solver version in force now (read on every look-up). */
  readonly solverVersion: () => string;
}

interface Entry {
  readonly hash: string;
  readonly solverVersion: string;
}

/** One key from its parts: each as `<length>:<text>`, so different part lists give different keys. */
export function memoKey(parts: readonly string[]): string {
  let key = '';
  for (const part of parts) key += `${part.length}:${part}`;
  return key;
}

export class RequestMemo {
  readonly #lru: LRUCache<string, Entry>;
  readonly #version: () => string;
  readonly #maxKeyChars: number;
  #hits = 0;
  #misses = 0;

  constructor(options: RequestMemoOptions) {
    if (!(options.maxEntries >= 1) || !(options.maxBytes >= 1)) throw new RangeError('a request memo needs maxEntries and maxBytes >= 1');
    this.#version = options.solverVersion;
    this.#maxKeyChars = Math.floor(options.maxBytes / 16);
    this.#lru = new LRUCache<string, Entry>({
      max: options.maxEntries,
      maxSize: options.maxBytes,
      sizeCalculation: (_entry, key) => 2 * key.length + ENTRY_OVERHEAD_BYTES,
    });
  }

  /** True when a key of this many characters may be kept (callers skip building longer ones). */
  fits(chars: number): boolean {
    return chars <= this.#maxKeyChars;
  }

  /** The scenario hash remembered for this exact key under the current solver version, or undefined. */
  get(key: string): string | undefined {
    const entry = this.#lru.get(key);
    if (entry === undefined) {
      this.#misses++;
      return undefined;
    }
    if (entry.solverVersion !== this.#version()) {
      this.#lru.delete(key);
      this.#misses++;
      return undefined;
    }
    this.#hits++;
    return entry.hash;
  }

  set(key: string, hash: string): void {
    if (!this.fits(key.length)) return;
    this.#lru.set(key, { hash, solverVersion: this.#version() });
  }

  stats(): { hits: number; misses: number; entries: number; bytes: number } {
    return { hits: this.#hits, misses: this.#misses, entries: this.#lru.size, bytes: this.#lru.calculatedSize };
  }

  clear(): void {
    this.#lru.clear();
  }
}
