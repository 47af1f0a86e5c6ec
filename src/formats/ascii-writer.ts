// Writes ASCII text straight into fixed-size byte chunks: numbers and epochs are turned into
// digits once, in place, with no intermediate string per sample. The formatters of big answers
// (CSV, OEM, JSON tracks) write through it and yield each full chunk.
import { newUtcFields, utcSplitter, type UtcFields, EPOCH_FRACTION_DIGITS } from '../solver/time/time.js';
import { fixed, scaledForFixed, SCALES } from './track-table.js';
import { quotient } from '../solver/core/math.js';
import { OUTPUT_CHUNKS, type ChunkPool } from './chunk-pool.js';

const EMPTY = Buffer.alloc(0);
const EMPTY_VIEW = new DataView(new ArrayBuffer(0));

const ZERO = 48;
/** "00".."99" as byte pairs: two digits per division. */
const PAIRS = Uint8Array.from({ length: 200 }, (_, i) => ZERO + (i & 1 ? (i >> 1) % 10 : Math.floor((i >> 1) / 10)));
const INT32_LIMIT = 2_147_483_648;

/** Decimal digits of a non-negative int32. */
const digitCount = (n: number): number =>
  n < 1e4 ? (n < 100 ? (n < 10 ? 1 : 2) : n < 1000 ? 3 : 4)
    : n < 1e6 ? (n < 1e5 ? 5 : 6) : n < 1e8 ? (n < 1e7 ? 7 : 8) : n < 1e9 ? 9 : 10;

/** "0000".."9999" as byte quadruples: four digits per division. */
const QUADS = Uint8Array.from({ length: 40_000 }, (_, i) => ZERO + (Math.floor((i >> 2) / 10 ** (3 - (i & 3))) % 10));

// Quotients by 100 and 10^4 as products: (m * 0.01) | 0 and (m * 1e-4) | 0 equal floor(m / 100)
// and floor(m / 10^4) for every integer 0 <= m < 2^31 (both constants round above their exact
// values, and the products' rounding error stays far below the gap to the next integer; checked
// for all 2^31 values once, and at the quotient boundaries in test/formats/ascii-writer.test.ts).
// A float64 division costs several multiplications here, and the digits are most of a track's work.

/** "0000".."9999" as little-endian 32-bit words: four digit bytes in one store (DataView#setUint32, any alignment). */
const QUAD_WORDS = Uint32Array.from({ length: 10_000 }, (_, i) => QUADS[4 * i]! | (QUADS[4 * i + 1]! << 8) | (QUADS[4 * i + 2]! << 16) | (QUADS[4 * i + 3]! << 24));
/** "00".."99" as little-endian 16-bit words. */
const PAIR_WORDS = Uint16Array.from({ length: 100 }, (_, i) => PAIRS[2 * i]! | (PAIRS[2 * i + 1]! << 8));

/** Writes a non-negative int32 in exactly `width` digits (zero-padded; n has at most that many) ending before `end`. */
function writeDigitsBefore(buf: Uint8Array, view: DataView, end: number, n: number, width: number): void {
  let p = end;
  const stop = end - width;
  let m = n;
  while (m >= 10_000) {
    const q = (m * 1e-4) | 0;
    view.setUint32(p - 4, QUAD_WORDS[m - q * 10_000]!, true);
    p -= 4;
    m = q;
  }
  if (m >= 100) {
    const q = (m * 0.01) | 0;
    view.setUint16(p - 2, PAIR_WORDS[m - q * 100]!, true);
    p -= 2;
    m = q;
  }
  if (m >= 10) {
    view.setUint16(p - 2, PAIR_WORDS[m]!, true);
    p -= 2;
  } else {
    buf[--p] = ZERO + m;
  }
  while (p > stop) buf[--p] = ZERO;
}

/** Writes a non-negative int32 with at least `width` digits at pos; returns the end. */
function writeInt32(buf: Uint8Array, view: DataView, pos: number, n: number, width: number): number {
  const digits = Math.max(digitCount(n), width);
  writeDigitsBefore(buf, view, pos + digits, n, digits);
  return pos + digits;
}

/** Two digits of 0 <= n < 100 at pos. */
function writeTwo(buf: Uint8Array, pos: number, n: number): void {
  buf[pos] = PAIRS[n << 1]!;
  buf[pos + 1] = PAIRS[(n << 1) + 1]!;
}

/** 1 / 10^d: the whole part is quotient(scaled, 10^d, INV_SCALES[d]), the division's quotient without a division. */
const INV_SCALES = SCALES.map((s) => 1 / s);

/**
 * fixed(values[index], decimals) written at pos (40 bytes of room), in one pass with no call per
 * digit group: the common case of track numbers (whole part below 2^31, 1 to 9 decimals). Returns
 * the end, or -1 where the general path must decide (ties, large magnitudes, other decimals): the
 * same test as scaledForFixed, so both give the same digits. The number is read here, not passed:
 * a float64 argument of a call that is not inlined is boxed on the heap (16 bytes a number, six a
 * track sample, measured with V8's sampling heap profiler).
 */
function writeFixed(buf: Uint8Array, view: DataView, pos: number, values: Float64Array, index: number, decimals: number): number {
  if (decimals < 1 || decimals > 9) return -1;
  const value = values[index]!;
  const scale = SCALES[decimals]!;
  const magnitude = Math.abs(value) * scale;
  const floor = Math.floor(magnitude);
  if (!(magnitude < 9e15) || !(Math.abs(magnitude - floor - 0.5) > 1e-6)) return -1;
  const scaled = Math.round(magnitude);
  const whole = quotient(scaled, scale, INV_SCALES[decimals]!);
  const frac = scaled - whole * scale;
  if (whole >= INT32_LIMIT) return -1;
  let p = pos;
  if (value < 0 && scaled !== 0) buf[p++] = 45;
  const wholeDigits = digitCount(whole);
  writeDigitsBefore(buf, view, p + wholeDigits, whole, wholeDigits);
  p += wholeDigits;
  buf[p++] = 46;
  writeDigitsBefore(buf, view, p + decimals, frac, decimals);
  return p + decimals;
}

export class AsciiWriter {
  readonly #chunkBytes: number;
  readonly #pool: ChunkPool | null;
  /** The chunk being written; empty until the first write after a take (so that no chunk is taken and left unused). */
  #buf: Buffer;
  #view: DataView;
  #pos = 0;
  readonly #split: (tt: number, out: UtcFields) => void;
  readonly #fields = newUtcFields();
  readonly #fractionDigits: number;
  #prefixText = '';
  #prefixBytes = Buffer.alloc(0);
  /** fixed()'s number, read by writeFixed like a record's. */
  readonly #one = new Float64Array(1);

  /**
   * Chunks of the default size come from OUTPUT_CHUNKS (given back when a response finishes,
   * src/plugins/answers.ts). `first`: memory for the first chunk (it is then the chunk size).
   */
  constructor(epochFractionDigits = EPOCH_FRACTION_DIGITS, chunkBytes = 65_536, first?: Buffer) {
    this.#chunkBytes = first ? first.length : chunkBytes;
    this.#pool = this.#chunkBytes === OUTPUT_CHUNKS.chunkBytes ? OUTPUT_CHUNKS : null;
    this.#buf = first ?? EMPTY;
    this.#view = first ? new DataView(first.buffer, first.byteOffset, first.byteLength) : EMPTY_VIEW;
    this.#fractionDigits = epochFractionDigits;
    this.#split = utcSplitter(epochFractionDigits);
  }

  /** Bytes written and not yet taken. */
  get size(): number {
    return this.#pos;
  }

  /** True once the current chunk is full enough to be taken (leaves room for one long line). */
  get full(): boolean {
    return this.#pos >= this.#chunkBytes - 1024;
  }

  /** The bytes written so far (the next write starts a new chunk). */
  take(): Buffer {
    const out = this.#buf.subarray(0, this.#pos);
    this.#buf = EMPTY;
    this.#view = EMPTY_VIEW;
    this.#pos = 0;
    return out;
  }

  #room(n: number): void {
    if (this.#pos + n <= this.#buf.length) return;
    if (this.#pos === 0 && n <= this.#chunkBytes) {
      this.#buf = this.#pool ? this.#pool.acquire() : Buffer.allocUnsafe(this.#chunkBytes);
    } else {
      const bigger = Buffer.allocUnsafe(Math.max(this.#buf.length * 2, this.#pos + n, this.#chunkBytes));
      this.#buf.copy(bigger, 0, 0, this.#pos);
      this.#buf = bigger;
    }
    this.#view = new DataView(this.#buf.buffer, this.#buf.byteOffset, this.#buf.byteLength);
  }

  /** ASCII text (callers pass ASCII only: JSON they have escaped, keywords, separators). */
  text(s: string): this {
    this.#room(s.length);
    for (let i = 0; i < s.length; i++) this.#buf[this.#pos++] = s.charCodeAt(i);
    return this;
  }

  /** Bytes prepared once (constant fragments of a line). */
  bytes(b: Uint8Array): this {
    this.#room(b.length);
    this.#buf.set(b, this.#pos);
    this.#pos += b.length;
    return this;
  }

  /** One ASCII character by code. */
  char(code: number): this {
    this.#room(1);
    this.#buf[this.#pos++] = code;
    return this;
  }

  /** A non-negative integer below 2^53, with at least `width` digits (zero-padded); room already reserved. */
  #integer(n: number, width: number): void {
    if (n < INT32_LIMIT) {
      this.#pos = writeInt32(this.#buf, this.#view, this.#pos, n, width);
      return;
    }
    // Above 2^31: the leading digits and the last nine, each an int32 (n < 2^53 < 1e16, all exact).
    const high = Math.floor(n / 1e9);
    this.#pos = writeInt32(this.#buf, this.#view, this.#pos, high, Math.max(width - 9, 1));
    this.#pos = writeInt32(this.#buf, this.#view, this.#pos, n - high * 1e9, 9);
  }

  /** The same text as fixed(value, decimals) from track-table.ts. */
  fixed(value: number, decimals: number): this {
    const one = this.#one;
    one[0] = value;
    const end = this.#pos + 40 <= this.#buf.length ? writeFixed(this.#buf, this.#view, this.#pos, one, 0, decimals) : -1;
    if (end >= 0) {
      this.#pos = end;
      return this;
    }
    return this.#fixedInGeneral(value, decimals);
  }

  /** fixed() where writeFixed leaves it to the general path. */
  #fixedInGeneral(value: number, decimals: number): this {
    const scaled = scaledForFixed(value, decimals);
    if (scaled < 0) return this.text(fixed(value, decimals));
    this.#room(40);
    if (value < 0 && scaled !== 0) this.#buf[this.#pos++] = 45;
    const scale = SCALES[decimals]!;
    const whole = Math.floor(scaled / scale);
    this.#integer(whole, 1);
    if (decimals > 0) {
      this.#buf[this.#pos++] = 46;
      this.#integer(scaled - whole * scale, decimals);
    }
    return this;
  }

  /**
   * count numbers of values from index `from`, number c with decimals[c] digits (as fixed()), each
   * preceded by the byte `separator` when `leading`, else separated by it: one call per record.
   */
  fixedRun(values: Float64Array, from: number, count: number, decimals: readonly number[], separator: number, leading: boolean): this {
    for (let c = 0; c < count; c++) {
      if (leading || c > 0) {
        this.#room(1);
        this.#buf[this.#pos++] = separator;
      }
      const d = decimals[c]!;
      const end = this.#pos + 40 <= this.#buf.length ? writeFixed(this.#buf, this.#view, this.#pos, values, from + c, d) : -1;
      if (end >= 0) this.#pos = end;
      else this.#fixedInGeneral(values[from + c]!, d);
    }
    return this;
  }

  /** An epoch as ISO 8601 UTC, with or without the trailing Z. */
  utc(tt: number, zone = true): this {
    const f = this.#fields;
    this.#split(tt, f);
    if (f.datePrefix !== this.#prefixText) {
      this.#prefixText = f.datePrefix;
      this.#prefixBytes = Buffer.from(f.datePrefix, 'latin1');
    }
    const prefix = this.#prefixBytes;
    this.#room(prefix.length);
    // By hand: Buffer#copy checks its arguments on every call, for 11 bytes.
    for (let i = 0, p = this.#pos; i < prefix.length; i++, p++) this.#buf[p] = prefix[i]!;
    this.#pos += prefix.length;
    this.#room(24);
    // hh:mm:ss, each field below 100 (a leap second is 60).
    const buf = this.#buf;
    let p = this.#pos;
    writeTwo(buf, p, f.hour);
    buf[p + 2] = 58;
    writeTwo(buf, p + 3, f.minute);
    buf[p + 5] = 58;
    writeTwo(buf, p + 6, f.second);
    p += 8;
    const digits = this.#fractionDigits;
    if (digits > 0) {
      buf[p++] = 46;
      writeDigitsBefore(buf, this.#view, p + digits, f.fraction, digits);
      p += digits;
    }
    if (zone) buf[p++] = 90;
    this.#pos = p;
    return this;
  }
}
