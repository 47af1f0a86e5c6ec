// Light on a pass: is the spacecraft in sunlight, how high is the Sun at the station, and can the
// station see the spacecraft optically (a sunlit spacecraft over a station in darkness)?
// - Sunlit: the centre of the solar disc is in view of the spacecraft, not behind the Earth's disc
//   (light/shadow.ts, conical geometry: c > b), so a spacecraft is counted sunlit until the middle
//   of its penumbra. Earth's shadow only.
// - Sun elevation: the geometric elevation of the apparent Sun (light/sun.ts) at the station, from
//   the Earth-fixed Sun vector (the diurnal parallax, up to 8.8", comes with the topocentric
//   vector); no refraction.
// - Visible: sunlit and the Sun's elevation at the station below the twilight limit (default
//   -6 deg: civil twilight, common practice, no source). Above the station's horizon mask is the
//   pass itself.

import { DEG } from '../core/math.js';
import type { Vec3 } from '../core/vec3.js';
import { gcrfToItrfTabled, orientationTable, type FrameOptions, type OrientationTable } from '../earth/frames.js';
import { failure, success, type Outcome } from '../core/result.js';
import { PropagationStopped, gcrfStateAt, type StateAt } from '../propagation/state-source.js';
import type { Pass, PassStation } from '../stations/passes.js';
import { lookAngles, stationFromGeodetic, type Station } from '../stations/topocentric.js';
import { shadowGeometry, sunCentreVisible } from './shadow.js';
import { apparentSunCache, type SunState } from './sun.js';
import { BODIES } from '../bodies/bodies.js';

/** Default twilight limit, rad: civil twilight (common practice, no source). */
export const DEFAULT_TWILIGHT_LIMIT = -6 * DEG;

export interface LightAt {
  /** The spacecraft sees the centre of the solar disc. */
  readonly sunlit: boolean;
  /** Geometric elevation of the Sun at the station, rad. */
  readonly sunElevation: number;
  /** Sunlit and the Sun below the twilight limit at the station. */
  readonly visible: boolean;
}

export interface LightingOptions extends FrameOptions {
  /** rad (default -6 deg). */
  readonly twilightLimit?: number;
}

/** Light at any epoch for one station (the spacecraft's GCRF state at that epoch when known). */
export type StationLight = (tt: number, gcrf?: { r: Vec3; v: Vec3 }) => LightAt;

/** A lighting evaluator over [startTT, stopTT] (its Sun and Earth orientation cached for the span); stations by geodetic latitude, longitude (rad) and height (km). */
export function lightingOver(stateAt: StateAt, startTT: number, stopTT: number, opts: LightingOptions = {}): (station: { latitude: number; longitude: number; height: number }) => StationLight {
  const table: OrientationTable = orientationTable(startTT, stopTT, opts);
  const sun: (tt: number) => SunState = apparentSunCache(startTT);
  const limit = opts.twilightLimit ?? DEFAULT_TWILIGHT_LIMIT;
  const earthRadius = BODIES.earth.radius!;
  return (site) => {
    const station: Station = stationFromGeodetic(site.latitude, site.longitude, site.height);
    return (tt, given) => {
      const s = given ?? gcrfStateAt(stateAt, tt);
      const sn = sun(tt);
      const sunlit = sunCentreVisible(shadowGeometry(s.r, s.v, sn.r, sn.v, earthRadius));
      const fixed = gcrfToItrfTabled(table, tt, sn.r, sn.v);
      const sunElevation = lookAngles(station, fixed.r, fixed.v).elevation;
      return { sunlit, sunElevation, visible: sunlit && sunElevation < limit };
    };
  };
}

/** The light at a pass's AOS, TCA and LOS and at each of its pointing samples. */
export interface PassLight {
  readonly aos: LightAt;
  readonly tca: LightAt;
  readonly los: LightAt;
  /** In the order of the pass's pointing samples; absent without a pointing track. */
  readonly pointing?: readonly LightAt[];
}

/** The light on each pass of a search (same order as `passes`). */
export function lightPasses(
  passes: readonly Pass[],
  stations: readonly PassStation[],
  stateAt: StateAt,
  startTT: number,
  stopTT: number,
  opts: LightingOptions = {},
): Outcome<PassLight[]> {
  if (!(stopTT >= startTT)) return failure('invalid-parameter', 'the lighting span needs stop at or after start');
  const over = lightingOver(stateAt, startTT, stopTT, opts);
  const byId = new Map(stations.map((s) => [s.id, over(s)]));
  try {
    return success(passes.map((p) => {
      const at = byId.get(p.station);
      if (!at) throw new TypeError(`pass of unknown station ${p.station}`);
      return {
        aos: at(p.aos),
        tca: at(p.tca),
        los: at(p.los),
        ...(p.pointing ? { pointing: p.pointing.map((s) => at(s.tt)) } : {}),
      };
    }));
  } catch (e) {
    if (e instanceof PropagationStopped) return e.failure;
    throw e;
  }
}
