// The request memo (src/cache/request-memo.ts) as properties: different requests never share an
// entry, an entry never outlives the solver version it was made under, and the bounds hold.
// Expected behaviour: common practice, no source (a memo must be exact or absent).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { memoKey, RequestMemo } from '../../src/cache/request-memo.js';

/** Parts that try to fool a joined key: separators, digits and colons, empty parts, long text. */
const part = fc.oneof(fc.string(), fc.constantFrom('', ':', '1:', '0:', '12:', '\n', '{}', '1:a1:b'), fc.string({ unit: fc.constantFrom('1', ':', 'a', '\n') }));
const parts = fc.array(part, { minLength: 1, maxLength: 8 });
const hashOf = (i: number) => i.toString(16).padStart(64, '0');

describe('request memo', () => {
  it('two different part lists never make the same key, and equal lists always do', () => {
    fc.assert(fc.property(parts, parts, (a, b) => {
      const same = a.length === b.length && a.every((p, i) => p === b[i]);
      expect(memoKey(a) === memoKey(b)).toBe(same);
      expect(memoKey(a)).toBe(memoKey([...a]));
    }), { numRuns: 2000 });
  });

  it('many different requests each get back their own hash, never another one', () => {
    fc.assert(fc.property(fc.uniqueArray(parts, { minLength: 2, maxLength: 40, selector: (p) => JSON.stringify(p) }), (list) => {
      const memo = new RequestMemo({ maxEntries: 1000, maxBytes: 1 << 24, solverVersion: () => '1.0.0' });
      list.forEach((p, i) => memo.set(memoKey(p), hashOf(i)));
      list.forEach((p, i) => expect(memo.get(memoKey(p))).toBe(hashOf(i)));
    }), { numRuns: 300 });
  });

  it('bodies that differ in one character (order of keys, spacing, a digit) are different entries', () => {
    fc.assert(fc.property(fc.jsonValue(), fc.nat(), fc.constantFrom(' ', '0', '"'), (value, at, ch) => {
      const body = JSON.stringify({ v: value });
      const i = at % (body.length + 1);
      const other = body.slice(0, i) + ch + body.slice(i);
      const memo = new RequestMemo({ maxEntries: 10, maxBytes: 1 << 24, solverVersion: () => '1.0.0' });
      memo.set(memoKey(['POST', '/v1/orbit', body]), hashOf(1));
      expect(memo.get(memoKey(['POST', '/v1/orbit', other]))).toBeUndefined();
      expect(memo.get(memoKey(['POST', '/v1/orbit', body]))).toBe(hashOf(1));
    }), { numRuns: 500 });
  });

  it('an entry never outlives the solver version it was made under', () => {
    fc.assert(fc.property(fc.uniqueArray(fc.string(), { minLength: 1, maxLength: 30 }), fc.string(), fc.string(), (bodies, v1, v2) => {
      fc.pre(v1 !== v2);
      let version = v1;
      const memo = new RequestMemo({ maxEntries: 1000, maxBytes: 1 << 24, solverVersion: () => version });
      bodies.forEach((b, i) => memo.set(memoKey([b]), hashOf(i)));
      version = v2;
      for (const b of bodies) expect(memo.get(memoKey([b]))).toBeUndefined();
      // ... and going back does not revive them: they were dropped when seen under the new version.
      version = v1;
      for (const b of bodies) expect(memo.get(memoKey([b]))).toBeUndefined();
      expect(memo.stats().entries).toBe(0);
    }), { numRuns: 200 });
  });

  it('stays within its entry and byte bounds; a key too long for it is not kept', () => {
    const memo = new RequestMemo({ maxEntries: 50, maxBytes: 64 * 1024, solverVersion: () => '1' });
    for (let i = 0; i < 500; i++) {
      memo.set(memoKey(['POST', '/v1/track', 'x'.repeat(i * 7)]), hashOf(i));
      const s = memo.stats();
      expect(s.entries).toBeLessThanOrEqual(50);
      expect(s.bytes).toBeLessThanOrEqual(64 * 1024);
    }
    const long = memoKey(['y'.repeat(64 * 1024)]);
    expect(memo.fits(long.length)).toBe(false);
    memo.set(long, hashOf(1));
    expect(memo.get(long)).toBeUndefined();
  });
});
