// The solver as a library: pure functions, numbers in and out (km, km/s, s, rad, TT seconds since J2000).
// import { solveOrbit, BODIES } from 'apsides/solver'
// One folder per subject; a folder imports only from the folders listed above it.
export * from './core/math.js';
export * from './core/vec3.js';
export * from './core/result.js';
export * from './core/version.js';
export * from './core/constants.js';
export * from './core/grid.js';
export * from './numerics/ode.js';
export * from './time/time.js';
export * from './bodies/bodies.js';
export * from './bodies/sun-moon.js';
export * from './conic/kepler.js';
export * from './conic/elements.js';
export * from './conic/j2.js';
export * from './conic/orbit.js';
export * from './conic/stumpff.js';
export * from './conic/universal.js';
export * from './conic/two-body.js';
export * from './central/potential.js';
export * from './central/radial.js';
export * from './central/radial-track.js';
export * from './earth/frames.js';
export * from './earth/geodetic.js';
export * from './propagation/perturbations.js';
export * from './propagation/atmosphere.js';
export * from './propagation/numerical.js';
export * from './propagation/j2-secular.js';
export * from './propagation/propagator.js';
export * from './propagation/track.js';
export * from './stations/topocentric.js';
export * from './stations/horizon-mask.js';
export * from './stations/passes.js';
