// The initial Cartesian state of a request's orbit (state given, or elements converted).
import type { z } from 'zod';
import type { CentralBody } from '../solver/bodies/bodies.js';
import { elementsToState } from '../solver/conic/elements.js';
import { failure, success, type Outcome } from '../solver/core/result.js';
import type { Vec3 } from '../solver/core/vec3.js';
import { orbitSolverInput, type ElementsInput, type StateInput } from './orbit.js';

export function initialState(
  body: CentralBody,
  req: { state?: z.output<typeof StateInput>; elements?: z.output<typeof ElementsInput> },
): Outcome<{ r: Vec3; v: Vec3; epochTT: number }> {
  const { epochTT, input } = orbitSolverInput(req);
  if ('r' in input) {
    if (input.r.every((x) => x === 0)) return failure('zero-position', 'the position vector is zero');
    return success({ r: input.r, v: input.v, epochTT });
  }
  const state = elementsToState(input.elements, body.gm);
  return state.ok ? success({ r: state.value.r, v: state.value.v, epochTT }) : state;
}
