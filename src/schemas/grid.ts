// Time grids at the API: a regular grid (start, stop, step) or a list of epochs.
import { z } from 'zod';
import { Epoch, isEpoch } from './common.js';
import { boundedList } from './list.js';

export const TimeGrid = z
  .object({
    start: Epoch.optional().describe('First epoch of a regular grid (ISO 8601 UTC)'),
    stop: Epoch.optional().describe('Last epoch of a regular grid; before start for a backwards grid. The last sample is at stop exactly (the final step may be shorter)'),
    step: z.number().positive().optional().describe('Spacing of a regular grid, s (> 0; the direction comes from start and stop)'),
    times: boundedList(Epoch, { min: 1, max: 10_000_000, good: isEpoch }).optional().describe('Instead of start/stop/step: the epochs themselves, in any order'),
  })
  .strict()
  .superRefine((g, ctx) => {
    const regular = g.start !== undefined || g.stop !== undefined || g.step !== undefined;
    if (regular === (g.times !== undefined)) {
      ctx.addIssue({ code: 'custom', message: 'give either start, stop and step, or times' });
    } else if (regular && (g.start === undefined || g.stop === undefined || g.step === undefined)) {
      ctx.addIssue({ code: 'custom', message: 'a regular grid needs start, stop and step' });
    }
  })
  .describe('The sample epochs: a regular grid (start, stop, step) or a list (times)')
  .meta({ id: 'TimeGrid' });

export type TimeGrid = z.output<typeof TimeGrid>;
