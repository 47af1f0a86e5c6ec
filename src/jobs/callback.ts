// Completion callbacks of jobs: when a job is done, failed or cancelled, its status (the answer of
// GET /v1/jobs/{id}) is POSTed to the callbackUrl given at submission. Only hosts named in
// JOB_CALLBACK_HOSTS are ever called (checked at submission and again before every attempt);
// redirects are not followed (a 3xx is a failed attempt), so a callback never reaches an address
// outside the allow-list. Each request is signed with HMAC-SHA256 (RFC 2104) under
// JOB_CALLBACK_SECRET over `<timestamp>.<body>`; failed attempts are retried with exponential backoff.
import { createHmac, randomUUID } from 'node:crypto';
import { setTimeout as sleep } from 'node:timers/promises';
import type { Config } from '../config.js';

export const SIGNATURE_HEADER = 'apsides-signature';
export const TIMESTAMP_HEADER = 'apsides-signature-timestamp';
export const DELIVERY_HEADER = 'apsides-delivery';

export interface CallbackSettings {
  /** Allowed `host` or `host:port` entries, lower case (JOB_CALLBACK_HOSTS). */
  readonly hosts: readonly string[];
  /** HMAC key (JOB_CALLBACK_SECRET); callbacks are off without it. */
  readonly secret: string | undefined;
  readonly attempts: number;
  readonly backoffMs: number;
  readonly timeoutMs: number;
}

/** JOB_CALLBACK_HOSTS ("a.example, 127.0.0.1:9000") as entries. */
export const parseHosts = (text: string | undefined): string[] =>
  (text ?? '').split(',').map((h) => h.trim().toLowerCase()).filter((h) => h.length > 0);

/** Why `url` may not be called back, or null when it may. */
export function callbackRefusal(url: string, settings: CallbackSettings): string | null {
  if (settings.hosts.length === 0 || !settings.secret) return 'callbacks are off on this service (JOB_CALLBACK_HOSTS and JOB_CALLBACK_SECRET are not both set)';
  let parsed: URL;
  try {
    parsed = new URL(url);
  } catch {
    return 'callbackUrl is not an absolute URL';
  }
  if (parsed.protocol !== 'https:' && parsed.protocol !== 'http:') return `callbackUrl must be http or https, not ${parsed.protocol.replace(':', '')}`;
  if (parsed.username || parsed.password) return 'callbackUrl must not carry credentials';
  const host = parsed.hostname.toLowerCase();
  const port = parsed.port || (parsed.protocol === 'https:' ? '443' : '80');
  const hostPort = `${host}:${port}`;
  if (settings.hosts.includes(host) || settings.hosts.includes(hostPort)) return null;
  return `callbackUrl host ${hostPort} is not in JOB_CALLBACK_HOSTS`;
}

/** The signature header value: `sha256=<hex HMAC-SHA256 of "<timestamp>.<body>">`. */
export const signature = (secret: string, timestamp: string, body: string): string =>
  `sha256=${createHmac('sha256', secret).update(`${timestamp}.${body}`).digest('hex')}`;

export interface CallbackLog {
  info(obj: object, msg: string): void;
  warn(obj: object, msg: string): void;
}

/** Sends callbacks in the background; `idle()` resolves when none is pending (tests, shutdown). */
export class CallbackSender {
  readonly #settings: CallbackSettings;
  readonly #log: CallbackLog;
  readonly #pending = new Set<Promise<boolean>>();
  readonly #stop = new AbortController();

  constructor(settings: CallbackSettings, log: CallbackLog) {
    this.#settings = settings;
    this.#log = log;
  }

  /** Queue the delivery of `payload` (JSON) to `url`; answers whether it was delivered. */
  send(url: string, payload: unknown, context: object = {}): Promise<boolean> {
    const delivery = this.#deliver(url, JSON.stringify(payload), { ...context, delivery: randomUUID() });
    this.#pending.add(delivery);
    void delivery.finally(() => this.#pending.delete(delivery));
    return delivery;
  }

  async idle(): Promise<void> {
    await Promise.allSettled([...this.#pending]);
  }

  /** Stop retrying (shutdown); attempts in flight end at their timeout. */
  close(): void {
    this.#stop.abort();
  }

  async #deliver(url: string, body: string, context: { delivery: string }): Promise<boolean> {
    const s = this.#settings;
    for (let attempt = 1; attempt <= s.attempts && !this.#stop.signal.aborted; attempt++) {
      const refusal = callbackRefusal(url, s); // the allow-list may have changed since submission
      if (refusal) {
        this.#log.warn({ ...context, url, refusal }, 'job callback refused');
        return false;
      }
      const timestamp = String(Math.floor(Date.now() / 1000));
      let outcome: string;
      try {
        const res = await fetch(url, {
          method: 'POST',
          body,
          redirect: 'manual',
          headers: {
            'content-type': 'application/json',
            [TIMESTAMP_HEADER]: timestamp,
            [SIGNATURE_HEADER]: signature(s.secret!, timestamp, body),
            [DELIVERY_HEADER]: context.delivery,
          },
          signal: AbortSignal.any([AbortSignal.timeout(s.timeoutMs), this.#stop.signal]),
        });
        await res.arrayBuffer().catch(() => undefined);
        if (res.status >= 200 && res.status < 300) {
          this.#log.info({ ...context, url, attempt, status: res.status }, 'job callback delivered');
          return true;
        }
        outcome = `answered ${res.status}`;
      } catch (error) {
        outcome = error instanceof Error ? error.message : String(error);
      }
      this.#log.warn({ ...context, url, attempt, outcome }, 'job callback attempt failed');
      if (attempt < s.attempts) await sleep(s.backoffMs * 2 ** (attempt - 1), undefined, { signal: this.#stop.signal }).catch(() => {});
    }
    this.#log.warn({ ...context, url }, 'job callback given up');
    return false;
  }
}

/** The settings from the environment. */
export const callbackSettings = (config: Config): CallbackSettings => ({
  hosts: parseHosts(config.JOB_CALLBACK_HOSTS),
  secret: config.JOB_CALLBACK_SECRET,
  attempts: config.JOB_CALLBACK_ATTEMPTS,
  backoffMs: config.JOB_CALLBACK_BACKOFF_MS,
  timeoutMs: config.JOB_CALLBACK_TIMEOUT_MS,
});

export const callbackSender = (config: Config, log: CallbackLog): CallbackSender => new CallbackSender(callbackSettings(config), log);

