// In-process LRU bounded in bytes (lru-cache's maxSize with a byte-size calculation).
import { LRUCache } from 'lru-cache';
import type { AnswerCache, CachedAnswer, CacheStats } from './types.js';

const ENTRY_OVERHEAD_BYTES = 200; // key, media type and bookkeeping, roughly

export class MemoryCache implements AnswerCache {
  readonly #lru: LRUCache<string, CachedAnswer> | undefined;
  #hits = 0;
  #misses = 0;

  constructor(maxBytes: number) {
    this.#lru = maxBytes > 0
      ? new LRUCache<string, CachedAnswer>({
        maxSize: maxBytes,
        // Entries larger than a quarter of the cache are not kept: one huge track must not flush everything.
        maxEntrySize: Math.max(1, Math.floor(maxBytes / 4)),
        sizeCalculation: (a) => a.body.length + a.contentType.length + ENTRY_OVERHEAD_BYTES,
      })
      : undefined;
  }

  async get(hash: string): Promise<CachedAnswer | undefined> {
    const hit = this.#lru?.get(hash);
    if (hit) this.#hits++;
    else this.#misses++;
    return hit;
  }

  async set(hash: string, answer: CachedAnswer): Promise<void> {
    this.#lru?.set(hash, answer);
  }

  stats(): CacheStats {
    return { hits: this.#hits, misses: this.#misses, entries: this.#lru?.size ?? 0, bytes: this.#lru?.calculatedSize ?? 0 };
  }

  async close(): Promise<void> {
    this.#lru?.clear();
  }
}
