// Time grids: the API's grid (ISO epochs, step in s) -> the solver's TT epochs.
import { ProblemError } from '../errors.js';
import { regularGrid, regularGridCount } from '../solver/core/grid.js';
import { roundToMicrosecond } from '../solver/core/math.js';
import type { TimeGrid } from '../schemas/grid.js';
import { epochTT } from './epoch.js';

/**
 * The sample epochs of a validated grid (in its timeSystem), refusing more than `max` before
 * allocating anything. A regular grid is written into the memory `lend(n)` gives when it gives n
 * numbers (a long track's arena, src/routes/track.ts).
 */
export function gridEpochs(grid: TimeGrid, max: number, lend?: (n: number) => Float64Array | undefined): Float64Array {
  const system = grid.timeSystem ?? 'UTC';
  if (grid.times) {
    if (grid.times.length > max) {
      throw new ProblemError('too-many-samples', `${grid.times.length} times asked; the maximum is ${max} samples`, { errors: [{ path: 'body.grid.times', message: `more than ${max} samples` }] });
    }
    return Float64Array.from(grid.times, (t) => epochTT(t, system));
  }
  const [start, stop] = [epochTT(grid.start!, system), epochTT(grid.stop!, system)];
  const count = regularGridCount(start, stop, grid.step!);
  // Written so that a NaN count is refused too; nothing is allocated before this check.
  if (!(count <= max)) {
    const asked = Number.isFinite(count) ? `the grid has ${count} samples` : `a step of ${grid.step} s gives more samples than a double counts`;
    throw new ProblemError('too-many-samples', `${asked}; the maximum is ${max} (use a longer step or a shorter span)`, { errors: [{ path: 'body.grid.step', message: `gives more than ${max} samples` }] });
  }
  // Sampled on the microsecond, the resolution the epochs are printed with (start + k step rarely falls on one).
  const epochs = regularGrid(start, stop, grid.step!, lend);
  for (let i = 0; i < epochs.length; i++) epochs[i] = roundToMicrosecond(epochs[i]!);
  return epochs;
}
