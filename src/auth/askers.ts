// Who asked which scenario: GET /v1/results/{hash} answers a key only when that key has sent the
// scenario (or got it in a batch or job line) before. The answers themselves stay in the one shared
// cache; this is only the list of callers per scenario hash. In process: an LRU bounded in entries;
// with REDIS_URL also a Redis set per hash (so any replica knows), kept as long as cached answers.
import { Redis } from 'ioredis';
import { LRUCache } from 'lru-cache';

export interface AskerStore {
  add(hash: string, caller: string): Promise<void>;
  has(hash: string, caller: string): Promise<boolean>;
  close(): Promise<void>;
}

/** Scenario hashes whose askers are remembered in process (each a small set of key ids). */
const KEPT_HASHES = 200_000;

export class MemoryAskers implements AskerStore {
  readonly #askers = new LRUCache<string, Set<string>>({ max: KEPT_HASHES });

  async add(hash: string, caller: string): Promise<void> {
    const set = this.#askers.get(hash);
    if (set) set.add(caller);
    else this.#askers.set(hash, new Set([caller]));
  }

  async has(hash: string, caller: string): Promise<boolean> {
    return this.#askers.get(hash)?.has(caller) ?? false;
  }

  async close(): Promise<void> {}
}

/** The in-process list in front of a Redis set per hash. A Redis that does not answer counts as "not asked" (404), never an error. */
export class SharedAskers implements AskerStore {
  readonly #local = new MemoryAskers();
  readonly #redis: Redis;

  constructor(url: string, readonly prefix: string, readonly ttlS: number) {
    this.#redis = new Redis(url, { enableOfflineQueue: false, maxRetriesPerRequest: 0, commandTimeout: 250, connectTimeout: 2000 });
    this.#redis.on('error', () => {});
  }

  async add(hash: string, caller: string): Promise<void> {
    await this.#local.add(hash, caller);
    try {
      await this.#redis.multi().sadd(this.prefix + hash, caller).expire(this.prefix + hash, this.ttlS).exec();
    } catch {
      // Redis down: this replica still knows
    }
  }

  async has(hash: string, caller: string): Promise<boolean> {
    if (await this.#local.has(hash, caller)) return true;
    try {
      return (await this.#redis.sismember(this.prefix + hash, caller)) === 1;
    } catch {
      return false;
    }
  }

  async close(): Promise<void> {
    this.#redis.disconnect();
  }
}
