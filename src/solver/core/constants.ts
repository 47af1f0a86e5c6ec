// Physical constants that belong to no single body, each with its published source.

/**
 * Newtonian constant of gravitation G in km^3 kg^-1 s^-2: CODATA 2018 recommended value
 * 6.67430(15)e-11 m^3 kg^-1 s^-2 (Tiesinga, Mohr, Newell and Taylor, Rev. Mod. Phys. 93, 025010,
 * 2021; from memory), times 1e-9 km^3/m^3.
 */
export const GRAVITATIONAL_CONSTANT_KM3_PER_KG_S2 = 6.6743e-20;

/** Relative standard uncertainty of G (CODATA 2018: 0.00015 / 6.67430; from memory). */
export const GRAVITATIONAL_CONSTANT_RELATIVE_UNCERTAINTY = 2.2e-5;

export const GRAVITATIONAL_CONSTANT_SOURCE =
  'CODATA 2018 recommended value 6.67430(15)e-11 m^3 kg^-1 s^-2 (Tiesinga et al., Rev. Mod. Phys. 93, 025010, 2021), from memory';

/** GM (km^3/s^2) of a mass in kg: G m. */
export const gmFromMass = (massKg: number): number => GRAVITATIONAL_CONSTANT_KM3_PER_KG_S2 * massKg;

/** Mass (kg) of a GM in km^3/s^2: GM / G, uncertain by G's 2.2e-5 even when GM is known far better. */
export const massFromGm = (gmKm3PerS2: number): number => gmKm3PerS2 / GRAVITATIONAL_CONSTANT_KM3_PER_KG_S2;

/** Speed of light in vacuum, km/s: exact by the definition of the metre (SI Brochure, 9th ed., 2019). */
export const SPEED_OF_LIGHT_KM_S = 299_792.458;
