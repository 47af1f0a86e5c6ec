// POST /v1/passes: ground-station passes of one spacecraft over a window.
import { z } from 'zod';
import { boundedList } from './list.js';
import { SearchDiagnostics } from './diagnostics.js';
import { SECONDS_PER_DAY } from '../solver/core/math.js';
import { MAX_PASS_STATIONS, MAX_PASS_WINDOW_S, MAX_POINTING_SAMPLES, MIN_POINTING_STEP_S } from '../solver/stations/passes.js';
import { TRACK_MODELS } from '../solver/propagation/track.js';
import { BENNETT_PRESSURE_HPA, BENNETT_TEMPERATURE_C, REFRACTION_MODELS } from '../solver/stations/refraction.js';
import { DEMO_EPOCH, EpochOut, EpochText, refineEpochs, TimeSystemField, UT1_MINUS_UTC, UT1_MINUS_UTC_TEXT } from './common.js';
import { modelFields, withDefaultModel } from './forces.js';
import { PropagationStopped } from './catalog.js';
import { DEMO_ELEMENTS, orbitFields, plotFormatField, requireOneOrbitInput } from './orbit.js';

/** Pointing step of the sky plots when the request asks for no pointing track, s. */
export const SVG_POINTING_STEP_S = 20;
/** Window length times station count (s) beyond which that step grows: the sky plots stay below MAX_POINTING_SAMPLES. */
export const SVG_POINTING_BUDGET_S = 8_000_000;

const MaskPoint = z
  .object({
    azimuth: z.number().min(0).lt(360).describe('deg from north through east, [0, 360)'),
    elevation: z.number().min(-90).max(90).describe('deg: the lowest usable elevation at that azimuth'),
  })
  .strict();

export const GroundStation = z
  .object({
    id: z.string().min(1).max(64).describe('Unique within the request; echoed in each pass'),
    latitude: z.number().min(-90).max(90).describe('Geodetic latitude, deg (WGS-84)'),
    longitude: z.number().min(-180).max(360).describe('Longitude east, deg'),
    altitude: z.number().min(-10).max(100).describe('Height above the WGS-84 ellipsoid, km'),
    minElevation: z.number().min(-90).max(90).default(0).describe('Elevation limit, deg (default 0)'),
    horizonMask: z.array(MaskPoint).max(360).optional()
      .describe('Elevation limit by azimuth for terrain and buildings: linear between points, wrapping at 360; never below minElevation'),
  })
  .strict()
  .meta({ id: 'GroundStation' });
export type GroundStation = z.output<typeof GroundStation>;

export const PassesRequest = z
  .object({
    ...orbitFields,
    ...modelFields,
    window: z.object({ start: EpochText, stop: EpochText, timeSystem: TimeSystemField }).strict().superRefine(refineEpochs(['start', 'stop'])).describe(`Search window (epochs in timeSystem, UTC by default), stop after start, at most ${MAX_PASS_WINDOW_S / SECONDS_PER_DAY} days`),
    stations: boundedList(GroundStation, { min: 1, max: MAX_PASS_STATIONS, tooMany: 'too-many-stations' }).describe(`Ground stations, 1 to ${MAX_PASS_STATIONS}`),
    pointing: z
      .object({
        step: z.number().min(MIN_POINTING_STEP_S).describe(`Pointing-track step, s (>= ${MIN_POINTING_STEP_S}); at most ${MAX_POINTING_SAMPLES} samples over all passes`),
        carrierFrequency: z.number().positive().optional().describe('Carrier frequency, Hz: adds the first-order Doppler shift, Hz, to each sample'),
      })
      .strict()
      .optional()
      .describe('Ask for an antenna pointing track of each pass'),
    ut1MinusUtc: UT1_MINUS_UTC.describe(`${UT1_MINUS_UTC_TEXT}; without either, 0 costs up to ~0.4 km of along-track error on the ground`),
    refraction: z.enum(REFRACTION_MODELS).optional()
      .describe('none (default: geometric elevations) | radio (4/3 effective Earth radius) | optical (Bennett 1982): AOS/LOS are then where the apparent elevation crosses the limit, and maxElevation and the pointing elevations are apparent'),
    atmosphere: z.object({
      pressure: z.number().min(0).max(1200).default(BENNETT_PRESSURE_HPA).describe(`Air pressure at the station, hPa (default ${BENNETT_PRESSURE_HPA})`),
      temperature: z.number().min(-90).max(60).default(BENNETT_TEMPERATURE_C).describe(`Air temperature at the station, deg C (default ${BENNETT_TEMPERATURE_C})`),
    }).strict().optional().describe('With refraction optical only: the conditions Bennett\'s refraction is scaled to'),
    sunAvoidance: z.object({
      angle: z.number().gt(0).max(90).describe('deg: the least allowed angle between the antenna boresight and the Sun'),
    }).strict().optional().describe('Flag each pass (and pointing sample) where the angle between the boresight (toward the spacecraft) and the Sun falls below angle, with the intervals'),
    twilightLimit: z.number().min(-90).max(90).default(-6)
      .describe('deg (default -6, civil twilight): a pass point is visible (optically) when the spacecraft is sunlit and the Sun\'s elevation at the station is below this'),
    format: plotFormatField(`a timeline of the passes by station, and a sky plot per station with the horizon mask and AOS/TCA/LOS; without pointing the plot uses a pointing step of ${SVG_POINTING_STEP_S} s, longer when the window times the stations exceeds ${SVG_POINTING_BUDGET_S} s`),
  })
  .strict()
  .superRefine(requireOneOrbitInput)
  .superRefine((req, ctx) => {
    if (req.atmosphere !== undefined && req.refraction !== 'optical') ctx.addIssue({ code: 'custom', path: ['atmosphere'], message: 'atmosphere applies to refraction "optical" only' });
  })
  .transform(withDefaultModel)
  .meta({
    description: 'A spacecraft, ground stations and a window',
    examples: [{
      centralBody: 'earth',
      elements: DEMO_ELEMENTS,
      window: { start: DEMO_EPOCH, stop: '2026-12-02T00:00:00Z' },
      stations: [
        { id: 'korrin-hill', latitude: 61.2, longitude: 24.9, altitude: 0.21, minElevation: 5 },
        { id: 'veyra-point', latitude: -31.4, longitude: 138.6, altitude: 0.32, minElevation: 10, horizonMask: [{ azimuth: 0, elevation: 10 }, { azimuth: 90, elevation: 20 }, { azimuth: 180, elevation: 10 }] },
      ],
      pointing: { step: 10, carrierFrequency: 2.2e9 },
    }],
  })
  .meta({ id: 'PassesRequest' });
export type PassesRequest = z.output<typeof PassesRequest>;

const LIGHT_FIELDS = {
  sunlit: z.boolean().describe('The spacecraft sees the centre of the solar disc (not in the Earth\'s umbra nor the inner half of its penumbra; conical shadow)'),
  sunElevation: z.number().describe('deg: geometric elevation of the Sun at the station'),
  visible: z.boolean().describe('sunlit and the Sun\'s elevation at the station below twilightLimit: the spacecraft can be seen optically'),
};
const Light = z.object(LIGHT_FIELDS).describe('Light at one instant of the pass');

const PointingSample = z.object({
  epoch: EpochOut,
  azimuth: z.number().describe('deg'),
  elevation: z.number().describe('deg: geometric, or apparent when refraction was asked'),
  range: z.number().describe('km'),
  rangeRate: z.number().describe('km/s, positive receding'),
  dopplerFactor: z.number().describe('received / transmitted frequency, 1 - rangeRate / c (first order)'),
  dopplerShift: z.number().nullable().describe('Hz at the carrier frequency (null without one)'),
  ...LIGHT_FIELDS,
  sunAngle: z.number().optional().describe('deg, with sunAvoidance: the angle between the boresight and the Sun'),
  sunInBeam: z.boolean().optional().describe('With sunAvoidance: sunAngle below the limit'),
});

export const Pass = z.object({
  station: z.string(),
  aos: EpochOut.describe('Acquisition of signal: elevation rises through the limit (or the window start)'),
  tca: EpochOut.describe('Time of maximum elevation'),
  los: EpochOut.describe('Loss of signal: elevation falls through the limit (or the window stop)'),
  duration: z.number().describe('s'),
  maxElevation: z.number().describe('deg: geometric, or apparent when refraction was asked'),
  azimuthAos: z.number().describe('deg'),
  azimuthTca: z.number().describe('deg'),
  azimuthLos: z.number().describe('deg'),
  rangeTca: z.number().describe('km at TCA'),
  startsBeforeWindow: z.boolean().describe('Already up at the window start: aos is the window start'),
  endsAfterWindow: z.boolean().describe('Still up at the window stop: los is the window stop'),
  light: z.object({ aos: Light, tca: Light, los: Light }).describe('Sunlight on the spacecraft and the Sun\'s elevation at the station at AOS, TCA and LOS'),
  sunAvoidance: z.object({
    sunInBeam: z.boolean().describe('The angle falls below the limit somewhere in the pass'),
    minAngle: z.number().describe('deg: the least boresight-Sun angle over the pass'),
    minAngleAt: EpochOut.describe('When it is least'),
    intervals: z.array(z.object({ start: EpochOut, stop: EpochOut, duration: z.number().describe('s') })).describe('Where the angle is below the limit, in time order'),
  }).optional().describe('With sunAvoidance in the request'),
  pointing: z.array(PointingSample).optional(),
})
  .meta({ id: 'Pass' });



export const PassesAnswer = z.object({
  scenarioHash: z.string(),
  model: z.enum(TRACK_MODELS),
  window: z.object({ start: EpochOut, stop: EpochOut }),
  coarseStep: z.number().describe('s: the scan step sized from the orbit so no pass above the limit is missed'),
  refraction: z.object({
    model: z.enum(['radio', 'optical']),
    pressure: z.number().optional().describe('hPa (optical)'),
    temperature: z.number().optional().describe('deg C (optical)'),
  }).optional().describe('Present when refraction was asked: the elevations of the answer (limits, AOS/LOS, maxElevation, pointing) are apparent ones. Absent: geometric elevations'),
  passes: z.array(Pass).describe('In time order of AOS, then station order'),
  propagationStopped: PropagationStopped.optional(),
  diagnostics: SearchDiagnostics.optional(),
})
  .meta({ id: 'PassesAnswer' });
export type PassesAnswer = z.infer<typeof PassesAnswer>;
