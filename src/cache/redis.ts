// The shared answer tier: Redis, so that replicas serve each other's answers. Never an error to the
// caller: a failing or unreachable Redis is a miss (get) or a skipped write (set), counted in stats.
import { Redis } from 'ioredis';
import type { AnswerCache, CachedAnswer, CacheStats } from './types.js';

export interface RedisCacheOptions {
  keyPrefix?: string;
  /** Seconds an answer is kept (answers never go stale within a solver version; this bounds memory). */
  ttlSeconds?: number;
  /** Per-command timeout, ms: past it the lookup counts as a miss. */
  commandTimeoutMs?: number;
}

const SEPARATOR = 0x0a; // media type, newline, then the body bytes

export class RedisCache implements AnswerCache {
  readonly #redis: Redis;
  readonly #prefix: string;
  readonly #ttl: number;
  #hits = 0;
  #misses = 0;
  #errors = 0;

  constructor(url: string, opts: RedisCacheOptions = {}) {
    this.#prefix = opts.keyPrefix ?? 'apsides:answer:';
    this.#ttl = opts.ttlSeconds ?? 7 * 86_400;
    this.#redis = new Redis(url, {
      // Fail fast while disconnected instead of queueing: a slow cache must not slow the answer.
      enableOfflineQueue: false,
      maxRetriesPerRequest: 0,
      commandTimeout: opts.commandTimeoutMs ?? 250,
      connectTimeout: 2000,
      lazyConnect: false,
    });
    // Connection errors are expected when Redis is down; they are counted, not thrown.
    this.#redis.on('error', () => { this.#errors++; });
  }

  /** Resolves true once connected, false after timeoutMs (the cache works either way). */
  async ready(timeoutMs = 2000): Promise<boolean> {
    if (this.#redis.status === 'ready') return true;
    return new Promise((resolve) => {
      const timer = setTimeout(() => { this.#redis.off('ready', onReady); resolve(false); }, timeoutMs);
      const onReady = () => { clearTimeout(timer); resolve(true); };
      this.#redis.once('ready', onReady);
    });
  }

  async get(hash: string): Promise<CachedAnswer | undefined> {
    try {
      const stored = await this.#redis.getBuffer(this.#prefix + hash);
      const cut = stored ? stored.indexOf(SEPARATOR) : -1;
      if (!stored || cut < 0) {
        this.#misses++;
        return undefined;
      }
      this.#hits++;
      return { contentType: stored.subarray(0, cut).toString('latin1'), body: stored.subarray(cut + 1) };
    } catch {
      this.#errors++;
      this.#misses++;
      return undefined;
    }
  }

  async set(hash: string, answer: CachedAnswer): Promise<void> {
    try {
      const value = Buffer.concat([Buffer.from(answer.contentType, 'latin1'), Buffer.of(SEPARATOR), answer.body]);
      await this.#redis.set(this.#prefix + hash, value, 'EX', this.#ttl);
    } catch {
      this.#errors++;
    }
  }

  stats(): CacheStats & { errors: number } {
    return { hits: this.#hits, misses: this.#misses, entries: 0, bytes: 0, errors: this.#errors };
  }

  async close(): Promise<void> {
    this.#redis.disconnect();
  }
}

/** The in-process LRU in front of the shared tier: a shared hit is copied into the local one. */
export class TieredCache implements AnswerCache {
  constructor(readonly local: AnswerCache, readonly shared: AnswerCache) {}

  async get(hash: string): Promise<CachedAnswer | undefined> {
    const near = await this.local.get(hash);
    if (near) return near;
    const far = await this.shared.get(hash);
    if (far) await this.local.set(hash, far);
    return far;
  }

  async set(hash: string, answer: CachedAnswer): Promise<void> {
    await Promise.all([this.local.set(hash, answer), this.shared.set(hash, answer)]);
  }

  /** The local tier's figures (what /metrics reports as the in-process cache). */
  stats(): CacheStats {
    return this.local.stats();
  }

  async close(): Promise<void> {
    await Promise.all([this.local.close(), this.shared.close()]);
  }
}
