// A nightly scheduling job: a week of passes for the fleet over the ground stations, written to one
// CSV file (one row per pass, in AOS order), through the typed client apsides/client.
//
//   npx tsx examples/nightly-passes.ts [--base-url http://127.0.0.1:8080] [--start 2026-12-03T00:00:00Z] [--days 7] [--out passes.csv]
//   (APSIDES_API_KEY is sent as the Bearer key when set)
//
// Outside this repository import { createApsidesClient } from 'apsides/client' instead.
// The fleet and the stations are invented for the demo. Passes are for planning contacts, not for
// safety-of-flight decisions; transmitting to a spacecraft needs licensing and coordination.
import { writeFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { pathToFileURL } from 'node:url';
import { createApsidesClient, type components } from '../src/client/index.js';

type PassesRequest = components['schemas']['PassesRequest'];
type Pass = components['schemas']['Pass'];

const ELEMENTS_EPOCH = '2026-12-01T00:00:00Z';

/** The invented fleet: osculating elements at ELEMENTS_EPOCH (the nightly job would take the newest). */
export const FLEET: { name: string; elements: PassesRequest['elements'] }[] = [
  { name: 'PLOVER-7', elements: { epoch: ELEMENTS_EPOCH, semiMajorAxis: 6928.137, eccentricity: 0.0012, inclination: 97.6, raan: 40, argPeriapsis: 90, trueAnomaly: 10 } },
  { name: 'TERN-2', elements: { epoch: ELEMENTS_EPOCH, semiMajorAxis: 26560, eccentricity: 0.7, inclination: 63.4, raan: 300, argPeriapsis: 270, trueAnomaly: 0 } },
  { name: 'KESTREL-B', elements: { epoch: ELEMENTS_EPOCH, semiMajorAxis: 7378.137, eccentricity: 0, inclination: 0, raan: 0, argPeriapsis: 0, trueAnomaly: 45 } },
];

/** The invented stations at invented sites. */
export const STATIONS: PassesRequest['stations'] = [
  { id: 'korrin-hill', latitude: 61.2, longitude: 24.9, altitude: 0.21, minElevation: 5 },
  { id: 'oskel-fjord', latitude: 78.1, longitude: 15.3, altitude: 0.45, minElevation: 0, horizonMask: [{ azimuth: 0, elevation: 3 }, { azimuth: 120, elevation: 12 }, { azimuth: 240, elevation: 3 }] },
  { id: 'marrow-bay', latitude: 47.5, longitude: -52.7, altitude: 0.05, minElevation: 10 },
  { id: 'sallow-key', latitude: 1.8, longitude: -157.4, altitude: 0.01, minElevation: 5 },
];

export const CSV_HEADER = 'spacecraft,station,aos_utc,tca_utc,los_utc,duration_s,max_elevation_deg,azimuth_aos_deg,azimuth_los_deg,range_tca_km,sunlit_tca';

/** RFC 4180: a field with a comma, quote or line break is quoted, its quotes doubled. */
const field = (value: string | number | boolean) => {
  const text = String(value);
  return /[",\r\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
};

export interface NightlyOptions { baseUrl: string; start: string; days: number; apiKey?: string }

/** Every pass of the fleet over the stations in [start, start + days), as CSV text (CRLF rows). */
export async function nightlyPasses({ baseUrl, start, days, apiKey }: NightlyOptions): Promise<{ csv: string; passes: number }> {
  const client = createApsidesClient({ baseUrl, ...(apiKey ? { apiKey } : {}) });
  const stop = new Date(Date.parse(start) + days * 86_400_000).toISOString();
  const rows: { aos: string; line: string }[] = [];
  for (const spacecraft of FLEET) {
    const { data, error, response } = await client.POST('/v1/passes', {
      body: { centralBody: 'earth', elements: spacecraft.elements, stations: STATIONS, window: { start, stop } },
    });
    if (error) throw new Error(`${spacecraft.name}: ${response.status} ${error.title}: ${error.detail}`);
    for (const p of data.passes as Pass[]) {
      rows.push({
        aos: p.aos,
        line: [spacecraft.name, p.station, p.aos, p.tca, p.los, p.duration.toFixed(1), p.maxElevation.toFixed(2),
          p.azimuthAos.toFixed(2), p.azimuthLos.toFixed(2), p.rangeTca.toFixed(1), p.light.tca.sunlit].map(field).join(','),
      });
    }
  }
  rows.sort((a, b) => (a.aos < b.aos ? -1 : a.aos > b.aos ? 1 : 0));
  return { csv: [CSV_HEADER, ...rows.map((r) => r.line)].join('\r\n') + '\r\n', passes: rows.length };
}

async function main() {
  const { values } = parseArgs({
    options: {
      'base-url': { type: 'string', default: 'http://127.0.0.1:8080' },
      start: { type: 'string', default: ELEMENTS_EPOCH },
      days: { type: 'string', default: '7' },
      out: { type: 'string', default: 'passes.csv' },
    },
  });
  const { csv, passes } = await nightlyPasses({
    baseUrl: values['base-url'], start: values.start, days: Number(values.days),
    ...(process.env.APSIDES_API_KEY ? { apiKey: process.env.APSIDES_API_KEY } : {}),
  });
  writeFileSync(values.out, csv);
  console.log(`wrote ${passes} passes to ${values.out}`);
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  main().catch((e: unknown) => { console.error(e instanceof Error ? e.message : e); process.exit(1); });
}
