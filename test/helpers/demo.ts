// The invented demo scenario shared by the HTTP tests: the spacecraft Plover-7 (a 550 km
// sun-synchronous orbit) and invented ground stations. Demo data only, never a reference value.
import { DEMO_ELEMENTS } from '../../src/schemas/orbit.js';

export const EPOCH = '2026-12-01T00:00:00Z';
export const DEMO_ORBIT = { centralBody: 'earth', elements: { ...DEMO_ELEMENTS, epoch: EPOCH } };
export const DEMO_STATIONS = [
  { id: 'korrin-hill', latitude: 61.2, longitude: 24.9, altitude: 0.21, minElevation: 5 },
  { id: 'oskel-fjord', latitude: 78.1, longitude: 15.3, altitude: 0.45, minElevation: 0, horizonMask: [{ azimuth: 0, elevation: 3 }, { azimuth: 120, elevation: 12 }, { azimuth: 240, elevation: 3 }] },
];
