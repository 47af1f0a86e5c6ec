// General central forces between the API and the solver: the request -> the solver's problem, and
// the analysis -> the answer (radians -> degrees; every other number as it is: consistent units).
import type { PotentialTerm } from '../solver/central/potential.js';
import { fromInitial, type CentralForceAnalysis, type CentralForceProblem } from '../solver/central/radial.js';
import type { RadialTrack } from '../solver/central/radial-track.js';
import { RAD } from '../solver/core/math.js';
import { success, type Outcome } from '../solver/core/result.js';
import type { CentralForceAnswer, CentralForceRequest } from '../schemas/central-force.js';

/** The solver's problem for a validated request: the constants given, or those of the initial state. */
export function centralForceProblem(req: CentralForceRequest): Outcome<CentralForceProblem> {
  const terms: PotentialTerm[] = req.potential.terms;
  if (req.initial) return fromInitial(req.mass, terms, req.initial);
  return success({ mass: req.mass, terms, angularMomentum: req.angularMomentum!, energy: req.energy! });
}

const deg = (rad: number): number => rad * RAD;
const degOrNull = (rad: number | null): number | null => (rad === null ? null : deg(rad));

/** Solver analysis (and track) -> API answer: radians -> degrees; every other number as it is. */
export function toCentralForceAnswer(
  a: CentralForceAnalysis,
  track: { start: 'initial' | 'periapsis' | 'apoapsis'; value: RadialTrack } | null,
  units: { radius: string; energy: string },
  scenarioHash: string,
): CentralForceAnswer {
  return {
    scenarioHash,
    mass: a.mass,
    angularMomentum: a.angularMomentum,
    energy: a.energy,
    units: { radius: units.radius, energy: units.energy },
    effectivePotential: a.effectivePotential.map((s) => ({ r: s.r, u: s.u, uEff: s.uEff })),
    sampleSpacing: a.sampleSpacing,
    turningPoints: [...a.turningPoints],
    circularOrbits: a.circularOrbits.map((c) => ({
      radius: c.radius,
      energy: c.energy,
      stable: c.stable,
      radialFrequency: c.radialFrequency,
      angularFrequency: c.angularFrequency,
      frequencyRatio: c.frequencyRatio,
      apsidalAngle: degOrNull(c.apsidalAngle),
    })),
    allowedRegions: a.allowedRegions.map((g) => ({ inner: g.inner, outer: g.outer, innerEnd: g.innerEnd, outerEnd: g.outerEnd, motion: g.motion })),
    analysedRegion: a.regionIndex,
    motion: a.motion,
    rectilinear: a.rectilinear,
    periapsis: a.periapsis,
    apoapsis: a.apoapsis,
    radialPeriod: a.radialPeriod,
    apsidalAngle: degOrNull(a.apsidalAngle),
    precessionPerOrbit: degOrNull(a.precessionPerOrbit),
    track: track === null
      ? null
      : {
        start: track.start,
        sampleCount: track.value.t.length,
        energy: track.value.energy,
        energyDrift: track.value.energyDrift,
        energyDriftRelative: track.value.energyDriftRelative,
        reachedCentre: track.value.reachedCentre,
        samples: track.value.t.map((t, i) => ({ t, r: track.value.r[i]!, rDot: track.value.rDot[i]!, phi: deg(track.value.phi[i]!) })),
      },
  };
}
