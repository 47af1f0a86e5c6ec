import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { AstroTime, Horizon, Observer, SiderealTime } from 'astronomy-engine';
import { SPEED_OF_LIGHT_KM_S } from '../../../src/solver/core/constants.js';
import { dopplerFactor, dopplerShift, lookAngles, stationFromGeodetic } from '../../../src/solver/stations/topocentric.js';
import { add, combine, scale, type Vec3 } from '../../../src/solver/core/vec3.js';
import { expectClose } from '../../helpers/approx.js';

const DEG = Math.PI / 180;

describe('lookAngles', () => {
  it('agrees with astronomy-engine Horizon() for directions given by RA/Dec of date (independent code path, property)', () => {
    // A point 1000 km from the station along the direction (RA, Dec of date) must be seen at the
    // azimuth and altitude the library computes for that RA/Dec (no refraction).
    fc.assert(
      fc.property(
        fc.double({ min: -89, max: 89, noNaN: true }),
        fc.double({ min: -180, max: 180, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        fc.double({ min: 0, max: 23.999, noNaN: true }),
        fc.double({ min: -89, max: 89, noNaN: true }),
        fc.double({ min: 0, max: 20_000, noNaN: true }),
        (lat, lon, hKm, raHours, decDeg, day) => {
          const time = new AstroTime(day);
          const theirs = Horizon(time, new Observer(lat, lon, hKm * 1000), raHours, decDeg);
          if (Math.abs(theirs.altitude) > 89.9) return; // azimuth undefined at the zenith
          const gast = (SiderealTime(time) * Math.PI) / 12;
          const ra = raHours * 15 * DEG;
          const dec = decDeg * DEG;
          const dirOfDate: Vec3 = [Math.cos(dec) * Math.cos(ra), Math.cos(dec) * Math.sin(ra), Math.sin(dec)];
          const dirFixed: Vec3 = [
            Math.cos(gast) * dirOfDate[0] + Math.sin(gast) * dirOfDate[1],
            -Math.sin(gast) * dirOfDate[0] + Math.cos(gast) * dirOfDate[1],
            dirOfDate[2],
          ];
          const station = stationFromGeodetic(lat * DEG, lon * DEG, hKm);
          const look = lookAngles(station, add(station.position, scale(dirFixed, 1000)), [0, 0, 0]);
          expectClose(look.elevation / DEG, theirs.altitude, 1e-8, 'elevation deg');
          const dAz = ((look.azimuth / DEG - theirs.azimuth + 540) % 360) - 180;
          expectClose(dAz, 0, 1e-7, 'azimuth deg');
          expectClose(look.range, 1000, 1e-9, 'range km');
        },
      ),
      { numRuns: 500 },
    );
  });

  it('measures azimuth from north through east: north 0, east 90, south 180, west 270 deg; zenith 90 deg elevation', () => {
    const st = stationFromGeodetic(40 * DEG, -75 * DEG, 0.2);
    const at = (d: Vec3): ReturnType<typeof lookAngles> => lookAngles(st, add(st.position, d), [0, 0, 0]);
    expectClose(at(scale(st.north, 500)).azimuth / DEG, 0, 1e-12, 'north');
    expectClose(at(scale(st.east, 500)).azimuth / DEG, 90, 1e-12, 'east');
    expectClose(at(scale(st.north, -500)).azimuth / DEG, 180, 1e-12, 'south');
    expectClose(at(scale(st.east, -500)).azimuth / DEG, 270, 1e-12, 'west');
    expectClose(at(scale(st.up, 500)).elevation / DEG, 90, 1e-12, 'zenith');
    expectClose(at(combine(st.north, 100, st.up, -100)).elevation / DEG, -45, 1e-12, 'below the horizon');
    // Rounding just west of north must still land in [0, 360).
    const nearNorth = at(combine(st.north, 500, st.east, -1e-14)).azimuth;
    expect(nearNorth >= 0 && nearNorth < 2 * Math.PI).toBe(true);
  });

  it('gives range rate, azimuth rate and elevation rate equal to finite differences of straight-line motion', () => {
    const st = stationFromGeodetic(-33 * DEG, 151 * DEG, 0.05);
    const r0: Vec3 = add(add(st.position, combine(st.north, 900, st.up, 400)), scale(st.east, 500));
    const v: Vec3 = add(combine(st.east, 6.5, st.north, -2.1), scale(st.up, 0.3));
    const at = (t: number): ReturnType<typeof lookAngles> => lookAngles(st, combine(r0, 1, v, t), v);
    const h = 1e-3;
    const l = at(0);
    expectClose(l.rangeRate, (at(h).range - at(-h).range) / (2 * h), 1e-8, 'range rate');
    expectClose(l.azimuthRate, (at(h).azimuth - at(-h).azimuth) / (2 * h), 1e-9, 'azimuth rate');
    expectClose(l.elevationRate, (at(h).elevation - at(-h).elevation) / (2 * h), 1e-9, 'elevation rate');
  });
});

describe('Doppler', () => {
  it('is 1 - rangeRate/c to first order: a receding transmitter is heard lower (common practice, no source)', () => {
    expectClose(dopplerFactor(7), 1 - 7 / 299_792.458, 1e-15, 'receding');
    expect(dopplerFactor(-7)).toBeGreaterThan(1);
    expect(SPEED_OF_LIGHT_KM_S).toBe(299_792.458); // exact, SI definition of the metre
    // 2.2 GHz carrier, 7 km/s away: -2.2e9 * 7 / 299792.458 = -51368.87 Hz.
    expectClose(dopplerShift(2.2e9, 7), -51_368.87, 0.01, 'shift Hz');
  });
});
