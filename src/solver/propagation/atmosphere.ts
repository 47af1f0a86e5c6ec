// Exponential atmosphere: rho(h) = rho0 exp(-(h - h0) / H) in bands of base altitude h0, from the
// table of Vallado, Fundamentals of Astrodynamics and Applications, 4th ed., Table 8-4 (built from
// CIRA-72 and the U.S. Standard Atmosphere 1976; values from memory). A static mean atmosphere: no
// solar or geomagnetic activity, no day-night bulge, so densities above ~200 km can be off by a
// factor of several against a real day. Altitudes are heights above the ellipsoid, km.

export interface AtmosphereBand {
  /** h0, km: the band holds altitudes from here up to the next band's base. */
  readonly baseAltitudeKm: number;
  /** rho0 at h0, kg/m^3. */
  readonly baseDensityKgM3: number;
  /** H, km. */
  readonly scaleHeightKm: number;
}

const band = (baseAltitudeKm: number, baseDensityKgM3: number, scaleHeightKm: number): AtmosphereBand => ({
  baseAltitudeKm,
  baseDensityKgM3,
  scaleHeightKm,
});

/** Vallado 4th ed. Table 8-4 (from memory); the last band (1000 km) continues without an upper end. */
export const EXPONENTIAL_ATMOSPHERE: readonly AtmosphereBand[] = [
  band(0, 1.225, 7.249),
  band(25, 3.899e-2, 6.349),
  band(30, 1.774e-2, 6.682),
  band(40, 3.972e-3, 7.554),
  band(50, 1.057e-3, 8.382),
  band(60, 3.206e-4, 7.714),
  band(70, 8.77e-5, 6.549),
  band(80, 1.905e-5, 5.799),
  band(90, 3.396e-6, 5.382),
  band(100, 5.297e-7, 5.877),
  band(110, 9.661e-8, 7.263),
  band(120, 2.438e-8, 9.473),
  band(130, 8.484e-9, 12.636),
  band(140, 3.845e-9, 16.149),
  band(150, 2.07e-9, 22.523),
  band(180, 5.464e-10, 29.74),
  band(200, 2.789e-10, 37.105),
  band(250, 7.248e-11, 45.546),
  band(300, 2.418e-11, 53.628),
  band(350, 9.518e-12, 53.298),
  band(400, 3.725e-12, 58.515),
  band(450, 1.585e-12, 60.828),
  band(500, 6.967e-13, 63.822),
  band(600, 1.454e-13, 71.835),
  band(700, 3.614e-14, 88.667),
  band(800, 1.17e-14, 124.64),
  band(900, 5.245e-15, 181.05),
  band(1000, 3.019e-15, 268),
];

/**
 * Density (kg/m^3) at a height above the ellipsoid (km): rho0 exp(-(h - h0) / H) of the band holding h;
 * Vallado 4th ed. sec. 8.6.2 and Table 8-4 (from memory). Below 0 km the sea-level value is
 * returned (the caller has met the surface); above 1000 km the last band continues. NaN in, NaN out.
 */
export function exponentialDensity(altitudeKm: number): number {
  if (Number.isNaN(altitudeKm)) return NaN;
  if (altitudeKm <= 0) return EXPONENTIAL_ATMOSPHERE[0]!.baseDensityKgM3;
  let i = EXPONENTIAL_ATMOSPHERE.length - 1;
  while (i > 0 && EXPONENTIAL_ATMOSPHERE[i]!.baseAltitudeKm > altitudeKm) i--;
  const b = EXPONENTIAL_ATMOSPHERE[i]!;
  return b.baseDensityKgM3 * Math.exp(-(altitudeKm - b.baseAltitudeKm) / b.scaleHeightKm);
}
