import { expect } from 'vitest';

/** Absolute tolerance check with a readable message. */
export function expectClose(actual: number, expected: number, tolerance: number, label = 'value'): void {
  const diff = Math.abs(actual - expected);
  if (!(diff <= tolerance)) {
    expect.fail(`${label}: got ${actual}, expected ${expected} +/- ${tolerance} (off by ${diff})`);
  }
}

/** Relative tolerance check: |a - e| <= rel * max(|e|, floor). */
export function expectRelClose(actual: number, expected: number, rel: number, label = 'value', floor = 0): void {
  const tolerance = rel * Math.max(Math.abs(expected), floor);
  expectClose(actual, expected, tolerance, label);
}

/** Component-wise absolute check of vectors. */
export function expectVecClose(actual: ArrayLike<number>, expected: ArrayLike<number>, tolerance: number, label = 'vector'): void {
  expect(actual.length, `${label} length`).toBe(expected.length);
  for (let i = 0; i < expected.length; i++) expectClose(actual[i]!, expected[i]!, tolerance, `${label}[${i}]`);
}
