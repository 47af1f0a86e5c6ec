// Two bodies between the API and the solver: masses (kg or GM) -> the solver's GM = G m states,
// and the reduction (integrals times G) -> the answer (kg, kg km^2/s^2, kg km^2/s, degrees, ISO epochs).
import type { CentralBody } from '../solver/bodies/bodies.js';
import {
  GRAVITATIONAL_CONSTANT_KM3_PER_KG_S2,
  GRAVITATIONAL_CONSTANT_RELATIVE_UNCERTAINTY,
  GRAVITATIONAL_CONSTANT_SOURCE,
  gmFromMass,
  massFromGm,
} from '../solver/core/constants.js';
import { relativeDifference } from '../solver/core/math.js';
import type { OrbitSolution } from '../solver/conic/orbit.js';
import type { BodyState, TwoBodyReduction } from '../solver/conic/two-body.js';
import { formatUtcIso } from '../solver/time/time.js';
import { norm, sub, type Vec3 as SolverVec3 } from '../solver/core/vec3.js';
import type { TwoBodyAnswer, TwoBodyMember, TwoBodyRequest } from '../schemas/two-body.js';
import { toOrbitAnswer } from './orbit.js';

const gmOf = (b: TwoBodyMember): number => b.gm ?? gmFromMass(b.mass!);
const massOf = (b: TwoBodyMember): number => b.mass ?? massFromGm(b.gm!);
const label = (b: TwoBodyMember, fallback: string): string => b.name ?? fallback;
/**
 * A sum of two inputs as printed: 15 significant digits, what a double carries of two addends
 * (IEEE 754 binary64: 15.95 decimal digits), so 5.2e11 + 3.1e9 prints 523100000000, not the
 * 523100000000.00006 that dividing the summed GMs by G leaves.
 */
const derivedSum = (x: number): number => (Number.isFinite(x) ? Number(x.toPrecision(15)) : x);

/** The solver's bodies for a validated request (mass -> GM = G m). */
export function twoBodySolverInput(req: TwoBodyRequest): [BodyState, BodyState] {
  const [b1, b2] = req.bodies;
  return [
    { gm: gmOf(b1), r: b1.position, v: b1.velocity },
    { gm: gmOf(b2), r: b2.position, v: b2.velocity },
  ];
}

/** The "central body" of the relative orbit: body 1 with mu = G (m1 + m2), no radius. */
export function relativeCentralBody(req: TwoBodyRequest, reduction: TwoBodyReduction): CentralBody {
  const [b1, b2] = req.bodies;
  return {
    name: `${label(b1, 'body1')}+${label(b2, 'body2')}`,
    gm: reduction.totalGm,
    sources: { gm: 'G (m1 + m2) of the two bodies in the request' },
  };
}

/** |a - b| / max(|a|, |b|) for vectors; 0 when both are zero. */
function vectorRelativeDifference(a: SolverVec3, b: SolverVec3): number {
  const scale = Math.max(norm(a), norm(b));
  return scale === 0 ? 0 : norm(sub(a, b)) / scale;
}

/** Solver reduction and relative orbit -> API answer without the tracks (GM units -> kg via G). */
export function toTwoBodyAnswer(
  req: TwoBodyRequest,
  red: TwoBodyReduction,
  orbit: OrbitSolution,
  relativeBody: CentralBody,
  epochTT: number,
  scenarioHash: string,
): Omit<TwoBodyAnswer, 'tracks'> {
  const G = GRAVITATIONAL_CONSTANT_KM3_PER_KG_S2;
  const [b1, b2] = req.bodies;
  const axes = red.semiMajorAxes;
  const member = (b: TwoBodyMember, fraction: number, about: { r: SolverVec3; v: SolverVec3 }, a: number | null) => ({
    name: b.name ?? null,
    mass: massOf(b),
    gm: gmOf(b),
    massFraction: fraction,
    position: [...about.r] as [number, number, number],
    velocity: [...about.v] as [number, number, number],
    semiMajorAxis: a,
    period: red.periodS,
  });
  // The solver's integrals are G E (km^5/s^4) and G L (km^5/s^3): divide by G for kg km^2/s^2 and kg km^2/s.
  const energyDirect = red.energyTimesG.direct / G;
  const energyRelative = red.energyTimesG.fromRelative / G;
  const momentumDirect = red.angularMomentumTimesG.direct.map((x) => x / G) as [number, number, number];
  const momentumRelative = red.angularMomentumTimesG.fromRelative.map((x) => x / G) as [number, number, number];
  return {
    scenarioHash,
    epoch: formatUtcIso(epochTT),
    frame: req.frame,
    gravitationalConstant: {
      value: G,
      unit: 'km^3 kg^-1 s^-2',
      relativeUncertainty: GRAVITATIONAL_CONSTANT_RELATIVE_UNCERTAINTY,
      source: GRAVITATIONAL_CONSTANT_SOURCE,
    },
    totalMass: derivedSum(massOf(b1) + massOf(b2)),
    totalGm: red.totalGm,
    reducedMass: massFromGm(red.reducedGm),
    barycenter: { position: [...red.barycentre.r], velocity: [...red.barycentre.v] },
    relativeState: { position: [...red.relative.r], velocity: [...red.relative.v] },
    relativeOrbit: toOrbitAnswer(orbit, relativeBody, epochTT, scenarioHash),
    bodies: [
      member(b1, red.massFraction1, red.body1, axes ? axes.body1 : null),
      member(b2, red.massFraction2, red.body2, axes ? axes.body2 : null),
    ],
    conserved: {
      energy: {
        unit: 'kg km^2/s^2',
        fromBodies: energyDirect,
        fromRelativeMotion: energyRelative,
        relativeDifference: relativeDifference(energyDirect, energyRelative),
      },
      angularMomentum: {
        unit: 'kg km^2/s',
        fromBodies: momentumDirect,
        fromRelativeMotion: momentumRelative,
        relativeDifference: vectorRelativeDifference(momentumDirect, momentumRelative),
      },
    },
  };
}

/** The name of each body's track (the request's label, or null). */
export const trackNames = (req: TwoBodyRequest): [string | null, string | null] => [req.bodies[0].name ?? null, req.bodies[1].name ?? null];
