// Time grids at the API: a regular grid (start, stop, step) or a list of epochs.
import { z } from 'zod';
import { epochProblem } from '../api/epoch.js';
import { codedIssue, EpochText, isEpochText, refineEpochs, TimeSystemField } from './common.js';
import { boundedList, MAX_LISTED_ISSUES } from './list.js';

export const TimeGrid = z
  .object({
    start: EpochText.optional().describe('First epoch of a regular grid (in timeSystem; UTC by default)'),
    stop: EpochText.optional().describe('Last epoch of a regular grid; before start for a backwards grid. The last sample is at stop exactly (the final step may be shorter)'),
    step: z.number().positive().optional().describe('Spacing of a regular grid, s (> 0; the direction comes from start and stop)'),
    times: boundedList(EpochText, { min: 1, max: 10_000_000, good: isEpochText }).optional().describe('Instead of start/stop/step: the epochs themselves (in timeSystem), in any order'),
    timeSystem: TimeSystemField,
  })
  .strict()
  .superRefine(refineEpochs(['start', 'stop']))
  .superRefine((g, ctx) => {
    if (!g.times) return;
    const system = g.timeSystem ?? 'UTC';
    let bad = 0;
    for (let i = 0; i < g.times.length && bad < MAX_LISTED_ISSUES; i++) {
      const t = g.times[i]!;
      if (system === 'UTC' && t.endsWith('Z')) continue; // checked as UTC already (EpochText)
      if (!isEpochText(t)) continue; // refused by EpochText already
      const problem = epochProblem(t, system);
      if (problem) { bad++; ctx.addIssue(codedIssue(problem.code, problem.message, ['times', i])); }
    }
  })
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
