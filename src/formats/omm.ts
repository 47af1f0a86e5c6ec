// CCSDS Orbit Mean-elements Messages (CCSDS 502.0-B-3, Orbit Data Messages, ch. 4): KVN text
// ("KEYWORD = value [units]" lines, COMMENT lines), XML text (the NDM/XML layout: omm > header,
// body > segment > metadata, data > meanElements, tleParameters, ...; read with fast-xml-parser),
// or a JSON object whose keys are the standard's keywords. One segment: one orbit. Only mean
// elements of MEAN_ELEMENT_THEORY SGP4 are propagated: SGP, SGP4-XP, DSST, USM... are refused
// by name. An SGP4 OMM carries its mean motion (MEAN_MOTION, rev/day), not a semi-major axis,
// and the TLE-related parameters BSTAR, MEAN_MOTION_DOT, MEAN_MOTION_DDOT (sec. 4.2.4).

import { XMLParser } from 'fast-xml-parser';
import { dayNumber, formatUtcIso, parseUtcIso } from '../solver/time/time.js';
import { ALPHA5, type ElementIssue, type ElementsRead } from './mean-elements.js';

export type OmmInput = string | Readonly<Record<string, string | number>>;

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const KEYWORD = /^[A-Z][A-Z0-9_]*$/;
/** Structural KVN lines without a value (some writers bracket blocks; OMM KVN needs none). */
const BARE = new Set(['META_START', 'META_STOP', 'DATA_START', 'DATA_STOP', 'COVARIANCE_START', 'COVARIANCE_STOP', 'USER_DEFINED_START', 'USER_DEFINED_STOP']);

type Fields = Map<string, { value: string; where: string }>;
type Read = { ok: true; fields: Fields } | { ok: false; issues: ElementIssue[] };

function readKvn(text: string): Read {
  const fields: Fields = new Map();
  const issues: ElementIssue[] = [];
  const lines = text.split(/\r?\n/);
  lines.forEach((raw, i) => {
    const line = raw.trim();
    const where = `line ${i + 1}`;
    if (line === '' || line.startsWith('COMMENT') || BARE.has(line)) return;
    const m = /^([A-Za-z][A-Za-z0-9_]*)\s*=\s*(.*?)\s*(?:\[([^\]]*)\])?$/.exec(line);
    if (!m) {
      issues.push({ path: where, message: `${where}: expected "KEYWORD = value", found ${JSON.stringify(line.slice(0, 80))}` });
      return;
    }
    const key = m[1]!;
    if (fields.has(key)) {
      issues.push({ path: where, message: `${where}: ${key} given a second time (${fields.get(key)!.where}); one OMM describes one orbit` });
      return;
    }
    fields.set(key, { value: m[2]!, where });
  });
  return issues.length ? { ok: false, issues } : { ok: true, fields };
}

function readXml(text: string): Read {
  let doc: unknown;
  try {
    // Values as text (the numbers are read below), attributes (units) left aside, no entities.
    doc = new XMLParser({ ignoreAttributes: true, parseTagValue: false, processEntities: false, trimValues: true }).parse(text, true);
  } catch (e) {
    return { ok: false, issues: [{ path: 'xml', message: `the OMM is not well-formed XML: ${(e as Error).message.split('\n')[0]!.slice(0, 200)}` }] };
  }
  const fields: Fields = new Map();
  const issues: ElementIssue[] = [];
  const walk = (node: unknown, path: string): void => {
    if (node === null || typeof node !== 'object') return;
    for (const [key, value] of Object.entries(node as Record<string, unknown>)) {
      if (key === 'COMMENT' || key.startsWith('?')) continue;
      const here = path ? `${path}/${key}` : key;
      if (Array.isArray(value)) {
        if (KEYWORD.test(key) && value.every((v) => typeof v !== 'object')) {
          issues.push({ path: here, message: `<${key}> given ${value.length} times; one OMM describes one orbit` });
        } else if (key === 'segment' && value.length > 1) {
          issues.push({ path: here, message: `${value.length} segments; one OMM describes one orbit` });
        } else value.forEach((v) => walk(v, here));
      } else if (typeof value === 'object' && value !== null) walk(value, here);
      else if (KEYWORD.test(key)) {
        if (fields.has(key)) issues.push({ path: here, message: `<${key}> given a second time (${fields.get(key)!.where}); one OMM describes one orbit` });
        else fields.set(key, { value: String(value), where: here });
      }
    }
  };
  walk(doc, '');
  if (issues.length) return { ok: false, issues };
  if (!fields.has('EPOCH') && !fields.has('MEAN_ELEMENT_THEORY')) {
    return { ok: false, issues: [{ path: 'xml', message: 'no OMM keywords found: expected the CCSDS NDM/XML layout (omm > body > segment > metadata and data > meanElements)' }] };
  }
  return { ok: true, fields };
}

function readJson(obj: Readonly<Record<string, string | number>>): Read {
  const fields: Fields = new Map();
  for (const [key, value] of Object.entries(obj)) {
    if (key === 'COMMENT') continue;
    fields.set(key, { value: typeof value === 'number' ? String(value) : value.trim(), where: key });
  }
  return { ok: true, fields };
}

/** OMM epoch: "YYYY-MM-DDThh:mm:ss[.d...]" or "YYYY-DDDThh:mm:ss[.d...]" in UTC (CCSDS 502.0-B-3 sec. 7.5.10), an optional Z. */
function epochOf(text: string): { ok: true; tt: number } | { ok: false; message: string } {
  const doy = /^(\d{4})-(\d{3})T(\d{2}:\d{2}:\d{2}(?:\.\d+)?)Z?$/.exec(text);
  let iso = text.endsWith('Z') ? text : `${text}Z`;
  if (doy) {
    const year = Number(doy[1]);
    const d = Number(doy[2]);
    const days = dayNumber(year + 1, 1, 1) - dayNumber(year, 1, 1);
    if (d < 1 || d > days) return { ok: false, message: `day of year ${d} does not exist in ${year}` };
    iso = `${dateOfDay(year, d)}T${doy[3]}Z`;
  }
  // Fractions beyond nanoseconds are cut to 9 digits (the time scale keeps no more).
  iso = iso.replace(/(\.\d{9})\d+Z$/, '$1Z');
  const t = parseUtcIso(iso);
  return t.ok ? { ok: true, tt: t.value } : { ok: false, message: t.message };
}

function dateOfDay(year: number, day: number): string {
  const d = new Date(Date.UTC(year, 0, day));
  return d.toISOString().slice(0, 10);
}

/** Read an OMM (KVN or XML text, or a JSON object of keywords) into the element set SGP4 propagates. */
export function readOmm(input: OmmInput): ElementsRead {
  let read: Read;
  if (typeof input === 'string') read = input.trimStart().startsWith('<') ? readXml(input) : readKvn(input);
  else read = readJson(input);
  if (!read.ok) return { ok: false, unsupported: false, issues: read.issues };
  const fields = read.fields;
  const issues: ElementIssue[] = [];
  const text = (key: string): string | undefined => fields.get(key)?.value;

  // What the service does not propagate: refused by name (omm-unsupported).
  const unsupported: ElementIssue[] = [];
  const theory = text('MEAN_ELEMENT_THEORY')?.toUpperCase();
  if (theory !== undefined && theory !== 'SGP4') {
    unsupported.push({ path: 'MEAN_ELEMENT_THEORY', message: `MEAN_ELEMENT_THEORY ${JSON.stringify(text('MEAN_ELEMENT_THEORY'))}: only SGP4 mean elements are propagated${theory === 'SGP' || theory === 'SGP4-XP' ? ` (${theory} elements need their own theory and are not SGP4 elements)` : ''}` });
  }
  const center = text('CENTER_NAME')?.toUpperCase();
  if (center !== undefined && center !== 'EARTH') unsupported.push({ path: 'CENTER_NAME', message: `CENTER_NAME ${JSON.stringify(text('CENTER_NAME'))}: SGP4 elements are Earth-centred (EARTH)` });
  const frame = text('REF_FRAME')?.toUpperCase();
  if (frame !== undefined && frame !== 'TEME') unsupported.push({ path: 'REF_FRAME', message: `REF_FRAME ${JSON.stringify(text('REF_FRAME'))}: SGP4 mean elements are referred to TEME` });
  const ts = text('TIME_SYSTEM')?.toUpperCase();
  if (ts !== undefined && ts !== 'UTC') unsupported.push({ path: 'TIME_SYSTEM', message: `TIME_SYSTEM ${JSON.stringify(text('TIME_SYSTEM'))}: SGP4 element epochs are UTC` });
  const eph = text('EPHEMERIS_TYPE');
  if (eph !== undefined && eph !== '0') unsupported.push({ path: 'EPHEMERIS_TYPE', message: `EPHEMERIS_TYPE ${JSON.stringify(eph)}: only 0 (SGP4 elements) is propagated` });
  if (fields.has('SEMI_MAJOR_AXIS') && !fields.has('MEAN_MOTION')) unsupported.push({ path: 'SEMI_MAJOR_AXIS', message: 'SEMI_MAJOR_AXIS given: SGP4 elements carry MEAN_MOTION (rev/day) instead' });
  if (unsupported.length) return { ok: false, unsupported: true, issues: unsupported };

  const number = (key: string, what: string, check: (x: number) => boolean, required = true): number => {
    const v = text(key);
    if (v === undefined) {
      if (required) issues.push({ path: key, message: `${key} is missing: expected ${what}` });
      return 0;
    }
    const x = NUMBER.test(v) ? Number(v) : NaN;
    if (!Number.isFinite(x) || !check(x)) issues.push({ path: key, message: `${key}: expected ${what}, found ${JSON.stringify(v.slice(0, 40))}` });
    return x;
  };
  const angle = (x: number): boolean => x >= -360 && x <= 360;
  const meanMotion = number('MEAN_MOTION', 'revolutions per day, more than 0', (x) => x > 0);
  const eccentricity = number('ECCENTRICITY', 'a number from 0 to 1 (exclusive)', (x) => x >= 0 && x < 1);
  const inclination = number('INCLINATION', 'degrees from 0 to 180', (x) => x >= 0 && x <= 180);
  const raan = number('RA_OF_ASC_NODE', 'degrees from -360 to 360', angle);
  const argPerigee = number('ARG_OF_PERICENTER', 'degrees from -360 to 360', angle);
  const meanAnomaly = number('MEAN_ANOMALY', 'degrees from -360 to 360', angle);
  const bstar = number('BSTAR', 'B* in 1/earth radii', (x) => Math.abs(x) < 1e3);
  const ndot = number('MEAN_MOTION_DOT', 'rev/day^2', (x) => Math.abs(x) < 1e3);
  const nddot = number('MEAN_MOTION_DDOT', 'rev/day^3', (x) => Math.abs(x) < 1e3);
  const catalog = text('NORAD_CAT_ID');
  let catalogNumber = 0;
  if (catalog !== undefined) {
    const alpha = /^([A-HJ-NP-Z])(\d{4})$/.exec(catalog);
    if (alpha) catalogNumber = (10 + ALPHA5.indexOf(alpha[1]!)) * 10_000 + Number(alpha[2]);
    else if (/^\d{1,9}$/.test(catalog)) catalogNumber = Number(catalog);
    else issues.push({ path: 'NORAD_CAT_ID', message: `NORAD_CAT_ID: expected a catalogue number (digits, or Alpha-5), found ${JSON.stringify(catalog.slice(0, 20))}` });
  }
  const setNo = number('ELEMENT_SET_NO', 'a whole number', (x) => Number.isInteger(x) && x >= 0, false);
  const rev = number('REV_AT_EPOCH', 'a whole number', (x) => Number.isInteger(x) && x >= 0, false);
  const epochText = text('EPOCH');
  let epochTT = 0;
  if (epochText === undefined) issues.push({ path: 'EPOCH', message: 'EPOCH is missing: expected a UTC epoch like 2026-12-01T00:00:00.000' });
  else {
    const e = epochOf(epochText);
    if (e.ok) epochTT = e.tt;
    else issues.push({ path: 'EPOCH', message: `EPOCH ${JSON.stringify(epochText.slice(0, 40))}: ${e.message}` });
  }
  if (issues.length) return { ok: false, unsupported: false, issues };

  const name = text('OBJECT_NAME') ?? null;
  const id = text('OBJECT_ID') ?? null;
  return {
    ok: true,
    value: {
      format: 'omm',
      name,
      catalogNumber,
      catalogId: catalog ?? String(catalogNumber),
      internationalDesignator: id,
      classification: text('CLASSIFICATION_TYPE') ?? null,
      epochTT,
      meanMotion,
      eccentricity,
      inclination,
      raan,
      argPerigee,
      meanAnomaly,
      bstar,
      meanMotionDot: ndot,
      meanMotionDdot: nddot,
      elementSetNumber: fields.has('ELEMENT_SET_NO') ? setNo : null,
      revolutionNumber: fields.has('REV_AT_EPOCH') ? rev : null,
      sgp4: {
        source: {
          omm: {
            OBJECT_NAME: name ?? 'UNNAMED', OBJECT_ID: id ?? 'UNKNOWN', EPOCH: formatUtcIso(epochTT, 3),
            MEAN_MOTION: meanMotion, ECCENTRICITY: eccentricity, INCLINATION: inclination, RA_OF_ASC_NODE: raan,
            ARG_OF_PERICENTER: argPerigee, MEAN_ANOMALY: meanAnomaly, NORAD_CAT_ID: catalogNumber,
            ELEMENT_SET_NO: fields.has('ELEMENT_SET_NO') ? setNo : 999, BSTAR: bstar, MEAN_MOTION_DOT: ndot, MEAN_MOTION_DDOT: nddot,
          },
        },
        epochTT,
      },
    },
  };
}
