// Regular time grids: start, start + step, ..., ending exactly at stop (common practice, no source).
import { describe, expect, it } from 'vitest';
import { regularGrid, regularGridCount } from '../../../src/solver/core/grid.js';

describe('regularGrid', () => {
  it('ends exactly at stop with a shorter last step when the span is not a whole number of steps', () => {
    const g = regularGrid(0, 10, 3);
    expect([...g]).toEqual([0, 3, 6, 9, 10]);
    expect(regularGridCount(0, 10, 3)).toBe(5);
  });

  it('puts no sliver step after a stop that lies on the grid (within a microsecond)', () => {
    expect([...regularGrid(0, 9, 3)]).toEqual([0, 3, 6, 9]);
    expect(regularGridCount(0, 9 + 1e-7, 3)).toBe(4);
  });

  it('runs backwards when stop is before start, and is one sample when they are equal', () => {
    expect([...regularGrid(10, 0, 4)]).toEqual([10, 6, 2, 0]);
    expect([...regularGrid(5, 5, 1)]).toEqual([5]);
  });

  it('computes start + k step without drift over a long grid', () => {
    const g = regularGrid(1e8, 1e8 + 86_400 * 30, 0.1);
    expect(g.length).toBe(86_400 * 300 + 1);
    expect(g[123_456]).toBe(1e8 + 123_456 * 0.1);
  });

  it('counts an infinite grid for a step so small that span / step overflows (never NaN)', () => {
    expect(regularGridCount(0, 600, 5e-324)).toBe(Number.POSITIVE_INFINITY);
    expect(regularGridCount(5, 5, 5e-324)).toBe(1);
  });

  it('refuses a step that is not positive', () => {
    expect(() => regularGridCount(0, 1, 0)).toThrow(RangeError);
    expect(() => regularGridCount(0, 1, Number.NaN)).toThrow(RangeError);
  });
});
