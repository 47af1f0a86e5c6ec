// 3x3 rotation matrices, row-major, and the frame (passive) rotations about x, y, z.
// R1, R2, R3 as in Vallado 4th ed. ch. 3 (ROT1/ROT2/ROT3) and IERS Conventions 2010 ch. 5.

import type { Vec3 } from '../core/vec3.js';

/** Row-major 3x3 matrix. */
export type Mat3 = readonly [number, number, number, number, number, number, number, number, number];

export const IDENTITY: Mat3 = [1, 0, 0, 0, 1, 0, 0, 0, 1];

/** a b (apply b first). */
export function multiply(a: Mat3, b: Mat3): Mat3 {
  const m = new Array<number>(9);
  for (let i = 0; i < 3; i++) {
    for (let j = 0; j < 3; j++) m[3 * i + j] = a[3 * i]! * b[j]! + a[3 * i + 1]! * b[3 + j]! + a[3 * i + 2]! * b[6 + j]!;
  }
  return m as unknown as Mat3;
}

export const transpose = (m: Mat3): Mat3 => [m[0], m[3], m[6], m[1], m[4], m[7], m[2], m[5], m[8]];

/** Frame rotation by t about x. */
export const rot1 = (t: number): Mat3 => [1, 0, 0, 0, Math.cos(t), Math.sin(t), 0, -Math.sin(t), Math.cos(t)];
/** Frame rotation by t about y. */
export const rot2 = (t: number): Mat3 => [Math.cos(t), 0, -Math.sin(t), 0, 1, 0, Math.sin(t), 0, Math.cos(t)];
/** Frame rotation by t about z. */
export const rot3 = (t: number): Mat3 => [Math.cos(t), Math.sin(t), 0, -Math.sin(t), Math.cos(t), 0, 0, 0, 1];

/** m x. */
export const apply = (m: Mat3, x: Vec3): Vec3 => [
  m[0] * x[0] + m[1] * x[1] + m[2] * x[2],
  m[3] * x[0] + m[4] * x[1] + m[5] * x[2],
  m[6] * x[0] + m[7] * x[1] + m[8] * x[2],
];

/** m^T x (the inverse rotation). */
export const applyT = (m: Mat3, x: Vec3): Vec3 => [
  m[0] * x[0] + m[3] * x[1] + m[6] * x[2],
  m[1] * x[0] + m[4] * x[1] + m[7] * x[2],
  m[2] * x[0] + m[5] * x[1] + m[8] * x[2],
];

/** (1 - f) a + f b, element by element (for slowly turning matrices sampled at close nodes). */
export const lerp = (a: Mat3, b: Mat3, f: number): Mat3 => [
  a[0] + f * (b[0] - a[0]), a[1] + f * (b[1] - a[1]), a[2] + f * (b[2] - a[2]),
  a[3] + f * (b[3] - a[3]), a[4] + f * (b[4] - a[4]), a[5] + f * (b[5] - a[5]),
  a[6] + f * (b[6] - a[6]), a[7] + f * (b[7] - a[7]), a[8] + f * (b[8] - a[8]),
];
