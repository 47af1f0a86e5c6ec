// API keys. A key is `<id>.<secret>` (secret: 32 random bytes, base64url); API_KEYS holds only
// entries `<id>:scrypt:<N>:<r>:<p>:<salt>:<hash>` (scrypt of the secret with a random 16-byte salt
// per key, RFC 7914), comma-separated. The id names the caller (jobs and results belong to it);
// the secret is never stored. A presented key is checked against its id's entry only, with a
// constant-time comparison of the derived bytes.
import { createHash, randomBytes, scrypt, timingSafeEqual, type ScryptOptions } from 'node:crypto';
import { LRUCache } from 'lru-cache';

/** Key ids: what `npm run apikey -- <id>` accepts, and what a job's owner is. */
export const KEY_ID_PATTERN = /^[A-Za-z0-9_-]{1,64}$/;
const SECRET_BYTES = 32;
const SALT_BYTES = 16;
const HASH_BYTES = 32;
/** scrypt cost for new keys (Node's default N; about 30 ms here). Kept in each entry, so it can be raised later. */
const NEW_KEY_COST = { N: 16_384, r: 8, p: 1 } as const;
/** Longest Authorization value looked at; longer ones are refused without hashing. */
const MAX_KEY_CHARS = 200;
/** Verified keys remembered (by their SHA-256), so that scrypt runs once per key, not per request. */
const VERIFIED_KEPT = 10_000;

export interface KeyEntry {
  readonly id: string;
  readonly N: number;
  readonly r: number;
  readonly p: number;
  readonly salt: Buffer;
  readonly hash: Buffer;
}

const derive = (secret: string, salt: Buffer, length: number, cost: ScryptOptions): Promise<Buffer> =>
  new Promise((resolve, reject) => {
    // 128 * N * r bytes of memory (RFC 7914 sec. 6); Node's default maxmem allows only 32 MiB.
    const maxmem = 256 * (cost.N ?? NEW_KEY_COST.N) * (cost.r ?? NEW_KEY_COST.r) + 1024 * 1024;
    scrypt(secret, salt, length, { ...cost, maxmem }, (error, key) => (error ? reject(error) : resolve(key)));
  });

const b64 = (bytes: Buffer) => bytes.toString('base64url');

/** A new key for `id` and its API_KEYS entry. */
export async function newKey(id: string): Promise<{ id: string; key: string; entry: string }> {
  if (!KEY_ID_PATTERN.test(id)) throw new Error(`key id "${id}": use 1-64 letters, digits, _ or -`);
  const secret = b64(randomBytes(SECRET_BYTES));
  const salt = randomBytes(SALT_BYTES);
  const hash = await derive(secret, salt, HASH_BYTES, NEW_KEY_COST);
  const { N, r, p } = NEW_KEY_COST;
  return { id, key: `${id}.${secret}`, entry: [id, 'scrypt', N, r, p, b64(salt), b64(hash)].join(':') };
}

const isPowerOfTwo = (n: number) => Number.isInteger(n) && n > 1 && (n & (n - 1)) === 0;

/** API_KEYS parsed; throws an Error naming the bad entry (by position and id, never its hash). */
export function parseKeyEntries(text: string): KeyEntry[] {
  const entries = text.split(',').map((e) => e.trim()).filter((e) => e !== '');
  const seen = new Set<string>();
  return entries.map((entry, i) => {
    const parts = entry.split(':');
    const [id = '', scheme, n, r, p, salt, hash] = parts;
    const where = `API_KEYS entry ${i + 1}${KEY_ID_PATTERN.test(id) ? ` (${id})` : ''}`;
    if (parts.length !== 7 || scheme !== 'scrypt') throw new Error(`${where}: expected id:scrypt:N:r:p:salt:hash as printed by npm run apikey (plain keys are never accepted)`);
    if (!KEY_ID_PATTERN.test(id)) throw new Error(`${where}: the id must be 1-64 letters, digits, _ or -`);
    if (seen.has(id)) throw new Error(`${where}: the id appears twice`);
    seen.add(id);
    const cost = { N: Number(n), r: Number(r), p: Number(p) };
    if (!isPowerOfTwo(cost.N) || cost.N > 2 ** 20 || !Number.isInteger(cost.r) || cost.r < 1 || cost.r > 32 || !Number.isInteger(cost.p) || cost.p < 1 || cost.p > 16) {
      throw new Error(`${where}: scrypt parameters N=${n} r=${r} p=${p} are out of range`);
    }
    const saltBytes = Buffer.from(salt ?? '', 'base64url');
    const hashBytes = Buffer.from(hash ?? '', 'base64url');
    if (saltBytes.length < 16 || hashBytes.length < 16) throw new Error(`${where}: the salt and the hash must be at least 16 bytes (base64url)`);
    return { id, ...cost, salt: saltBytes, hash: hashBytes };
  });
}

const sha256 = (text: string) => createHash('sha256').update(text).digest('base64url');

/** Checks presented keys against the entries; remembers the verified ones (and recent failures) by their SHA-256. */
export class KeyVerifier {
  readonly #entries: Map<string, KeyEntry>;
  readonly #verified = new LRUCache<string, string>({ max: VERIFIED_KEPT });
  readonly #refused = new LRUCache<string, true>({ max: VERIFIED_KEPT, ttl: 60_000 });

  constructor(entries: readonly KeyEntry[]) {
    this.#entries = new Map(entries.map((e) => [e.id, e]));
  }

  get size(): number {
    return this.#entries.size;
  }

  /** The key's id when the key is valid, else null. `beforeHashing` runs (and may throw) before scrypt on a key not seen before. */
  async verify(key: string, beforeHashing: () => Promise<void> = async () => {}): Promise<string | null> {
    if (key.length === 0 || key.length > MAX_KEY_CHARS) return null;
    const digest = sha256(key);
    const known = this.#verified.get(digest);
    if (known !== undefined) return known;
    if (this.#refused.has(digest)) return null;
    const dot = key.indexOf('.');
    const entry = dot > 0 ? this.#entries.get(key.slice(0, dot)) : undefined;
    let ok = false;
    if (entry) {
      await beforeHashing();
      const derived = await derive(key.slice(dot + 1), entry.salt, entry.hash.length, { N: entry.N, r: entry.r, p: entry.p });
      ok = timingSafeEqual(derived, entry.hash);
    }
    if (!ok || !entry) {
      this.#refused.set(digest, true);
      return null;
    }
    this.#verified.set(digest, entry.id);
    return entry.id;
  }
}

/** Constant-time equality of two secrets of any length (compares their SHA-256 digests). */
export function sameSecret(given: string, expected: string): boolean {
  const a = createHash('sha256').update(given).digest();
  const b = createHash('sha256').update(expected).digest();
  return timingSafeEqual(a, b);
}
