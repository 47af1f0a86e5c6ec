// POST /v1/eclipses: when a spacecraft is in the Earth's (and optionally the Moon's) shadow over a
// window, with the beta angle (mapping to and from the solver: src/api/eclipses.ts).
import { z } from 'zod';
import { SearchDiagnostics } from './diagnostics.js';
import { SECONDS_PER_DAY } from '../solver/core/math.js';
import { MAX_ECLIPSE_WINDOW_S } from '../solver/light/eclipses.js';
import { TRACK_MODELS } from '../solver/propagation/track.js';
import { DEMO_EPOCH, EpochOut, EpochText, refineEpochs, TimeSystemField, ScenarioHash, UT1_MINUS_UTC, UT1_MINUS_UTC_TEXT } from './common.js';
import { modelFields, withDefaultModel } from './forces.js';
import { PropagationStopped } from './catalog.js';
import { DEMO_ELEMENTS, orbitFields, requireOneOrbitInput } from './orbit.js';

/** Answer formats of /v1/eclipses. */
export const ECLIPSE_FORMATS = [
  ['json', 'application/json'],
  ['csv', 'text/csv'],
  ['svg', 'image/svg+xml'],
] as const;
export type EclipseFormat = (typeof ECLIPSE_FORMATS)[number][0];

export const EclipsesRequest = z
  .object({
    ...orbitFields,
    ...modelFields,
    window: z.object({ start: EpochText, stop: EpochText, timeSystem: TimeSystemField }).strict().superRefine(refineEpochs(['start', 'stop']))
      .describe(`Search window (epochs in timeSystem, UTC by default), stop after start, at most ${MAX_ECLIPSE_WINDOW_S / SECONDS_PER_DAY} days`),
    moon: z.boolean().default(false)
      .describe('Also search the Moon\'s shadow (conical, mean lunar radius 1737.4 km); its eclipses are listed apart, in moonEclipses'),
    ut1MinusUtc: UT1_MINUS_UTC.describe(`${UT1_MINUS_UTC_TEXT}; enters only the local time of the ascending node`),
    format: z.enum(ECLIPSE_FORMATS.map(([f]) => f) as [EclipseFormat, ...EclipseFormat[]]).optional()
      .describe('json | csv (RFC 4180, one row per eclipse, Earth and Moon together in time order) | svg (a timeline of sunlight, penumbra and umbra, one row per UTC day). Without it the Accept header chooses (application/json, text/csv, image/svg+xml); default json'),
  })
  .strict()
  .superRefine(requireOneOrbitInput)
  .transform(withDefaultModel)
  .meta({
    description: 'A spacecraft and a window',
    examples: [{ centralBody: 'earth', elements: DEMO_ELEMENTS, window: { start: DEMO_EPOCH, stop: '2026-12-02T00:00:00Z' } }],
  })
  .meta({ id: 'EclipsesRequest' });
export type EclipsesRequest = z.output<typeof EclipsesRequest>;

export const Eclipse = z.object({
  start: EpochOut.describe('Penumbra entry: the first point of the solar disc is hidden (or the window start)'),
  stop: EpochOut.describe('Penumbra exit: the whole solar disc is seen again (or the window stop)'),
  umbraStart: EpochOut.nullable().describe('Umbra entry: the whole solar disc is hidden (null when the eclipse is partial only)'),
  umbraStop: EpochOut.nullable().describe('Umbra exit (null when the eclipse is partial only)'),
  duration: z.number().describe('s, start to stop'),
  umbraDuration: z.number().nullable().describe('s, umbraStart to umbraStop (null when partial only)'),
  depth: z.number().min(0).max(1).describe('Largest fraction of the solar disc hidden, 0 to 1 (1 when the umbra is reached); a uniformly bright disc'),
  startsBeforeWindow: z.boolean().describe('Already in shadow at the window start: start is the window start'),
  endsAfterWindow: z.boolean().describe('Still in shadow at the window stop: stop is the window stop'),
})
  .meta({ id: 'Eclipse' });
export type Eclipse = z.infer<typeof Eclipse>;

export const EclipsesAnswer = z.object({
  scenarioHash: ScenarioHash,
  model: z.enum(TRACK_MODELS),
  window: z.object({ start: EpochOut, stop: EpochOut }),
  shadow: z.string().describe('The shadow model and the Sun used, in words'),
  coarseStep: z.number().describe('s: the scan step sized from the orbit so that no eclipse is missed, even one shorter than the step'),
  eclipses: z.array(Eclipse).describe('The Earth\'s shadow, in time order'),
  moonEclipses: z.array(Eclipse).nullable().describe('The Moon\'s shadow, in time order; null unless moon was asked'),
  beta: z.object({
    start: z.number().describe('deg: the Sun\'s elevation above the orbit plane at the window start (positive on the side of the angular momentum)'),
    min: z.number().describe('deg: least beta over the scan samples of the window'),
    max: z.number().describe('deg: greatest beta over the scan samples of the window'),
  }).describe('Beta angle of the osculating orbit plane'),
  sunSynchronous: z.boolean().describe('At the window start, the osculating orbit\'s first-order J2 node rate follows the mean Sun (within the tolerance of /v1/orbit)'),
  ascendingNodeLocalTime: z.number().nullable().describe('h, [0, 24): local mean solar time of the ascending node at the window start; null unless sunSynchronous'),
  propagationStopped: PropagationStopped.optional(),
  diagnostics: SearchDiagnostics.optional(),
})
  .meta({ id: 'EclipsesAnswer' });
export type EclipsesAnswer = z.infer<typeof EclipsesAnswer>;
