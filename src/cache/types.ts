// A stored answer: the exact bytes sent, and their media type.
export interface CachedAnswer {
  readonly body: Buffer;
  readonly contentType: string;
}

export interface CacheStats {
  hits: number;
  misses: number;
  entries: number;
  bytes: number;
}

/** Answer cache keyed by scenario hash. Implementations never throw to the caller: a failing tier is a miss. */
export interface AnswerCache {
  get(hash: string): Promise<CachedAnswer | undefined>;
  set(hash: string, answer: CachedAnswer): Promise<void>;
  stats(): CacheStats;
  close(): Promise<void>;
}
