// Invented demo scenarios: spacecraft, stations and sites are made up for the demo (never reference data).
const EPOCH = '2026-12-01T00:00:00Z';

export const DEMOS = [
  {
    name: 'Plover-7, 550 km sun-synchronous, over Korrin Hill and Oskel Fjord',
    request: {
      centralBody: 'earth',
      elements: { epoch: EPOCH, semiMajorAxis: 6928.137, eccentricity: 0.0012, inclination: 97.6, raan: 40, argPeriapsis: 90, trueAnomaly: 10 },
      object: { name: 'PLOVER-7', id: '2026-900A' },
      grid: { start: EPOCH, stop: '2026-12-01T03:00:00Z', step: 60 },
      window: { start: EPOCH, stop: '2026-12-02T00:00:00Z' },
      stations: [
        { id: 'korrin-hill', latitude: 61.2, longitude: 24.9, altitude: 0.21, minElevation: 5 },
        { id: 'oskel-fjord', latitude: 78.1, longitude: 15.3, altitude: 0.45, minElevation: 0, horizonMask: [{ azimuth: 0, elevation: 3 }, { azimuth: 120, elevation: 12 }, { azimuth: 240, elevation: 3 }] },
      ],
    },
  },
  {
    name: 'Tern-2, a 12-hour eccentric relay orbit, over Marrow Bay',
    request: {
      centralBody: 'earth',
      elements: { epoch: EPOCH, semiMajorAxis: 26560, eccentricity: 0.7, inclination: 63.4, raan: 300, argPeriapsis: 270, trueAnomaly: 0 },
      object: { name: 'TERN-2', id: '2026-901A' },
      grid: { start: EPOCH, stop: '2026-12-02T00:00:00Z', step: 120 },
      window: { start: EPOCH, stop: '2026-12-03T00:00:00Z' },
      stations: [{ id: 'marrow-bay', latitude: 47.5, longitude: -52.7, altitude: 0.05, minElevation: 10 }],
    },
  },
  {
    name: 'Kestrel-B, a low equatorial orbit, over Sallow Key',
    request: {
      centralBody: 'earth',
      elements: { epoch: EPOCH, semiMajorAxis: 7378.137, eccentricity: 0, inclination: 0, raan: 0, argPeriapsis: 0, trueAnomaly: 45 },
      object: { name: 'KESTREL-B', id: '2026-902A' },
      grid: { start: EPOCH, stop: '2026-12-01T04:00:00Z', step: 60 },
      window: { start: EPOCH, stop: '2026-12-01T12:00:00Z' },
      stations: [{ id: 'sallow-key', latitude: 1.8, longitude: -157.4, altitude: 0.01, minElevation: 5 }],
    },
  },
  {
    name: 'Central force: a Kepler well with a small r^-3 correction (consistent units)',
    request: {
      mass: 1,
      potential: { terms: [{ kind: 'power', coefficient: -1, exponent: -1 }, { kind: 'power', coefficient: -0.002, exponent: -3 }] },
      angularMomentum: 1.2,
      energy: -0.3,
      track: { periods: 3, samples: 601 },
    },
  },
];
