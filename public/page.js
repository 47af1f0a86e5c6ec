// The scenario page: pick a demo or paste a request, send it, see the key numbers and the plots.
// Same-origin requests only; no inline script or style, so a strict Content-Security-Policy holds.
import { DEMOS } from './demos.js';

const $ = (id) => document.getElementById(id);
const ORBIT_KEYS = ['centralBody', 'elements', 'state', 'timeSystem', 'tle', 'omm', 'ephemeris'];
const MODEL_KEYS = ['model', 'forces', 'ut1MinusUtc'];

const pick = (obj, keys) => Object.fromEntries(keys.filter((k) => obj[k] !== undefined).map((k) => [k, obj[k]]));

/** The calls a request stands for: central force alone, or an orbit with its track and passes. */
export function plan(req) {
  if (req.potential) {
    const { format: _f, ...cf } = req;
    return [{ url: '/v1/central-force', body: cf, numbers: 'central-force', plot: true }];
  }
  const orbit = pick(req, ORBIT_KEYS);
  const calls = [{ url: '/v1/orbit', body: orbit, numbers: 'orbit', plot: true }];
  if (req.grid) {
    const track = { ...orbit, ...pick(req, MODEL_KEYS), grid: req.grid, ...(req.object ? { object: req.object } : {}) };
    calls.push({ url: '/v1/track', body: track, plot: true, downloads: [['csv', 'CSV', 'csv'], ['oem', 'CCSDS OEM', 'oem']] });
  }
  if (req.stations && req.window) {
    const passes = { ...orbit, ...pick(req, [...MODEL_KEYS, 'pointing']), stations: req.stations, window: req.window };
    calls.push({ url: '/v1/passes', body: passes, numbers: 'passes', plot: true });
  }
  // Eclipses exist for the built-in earth only (the service's own rule): asked for an earth orbit with a window.
  if (req.window && (req.centralBody ?? 'earth') === 'earth') {
    const eclipses = { ...orbit, ...pick(req, MODEL_KEYS), window: req.window };
    calls.push({ url: '/v1/eclipses', body: eclipses, numbers: 'eclipses', plot: true, downloads: [['csv', 'eclipses CSV', 'csv']] });
  }
  return calls;
}

const shellQuote = (s) => `'${s.replace(/'/g, `'\\''`)}'`;
const curlOf = (url, body) => `curl -s ${location.origin}${url} -H 'content-type: application/json' -d ${shellQuote(JSON.stringify(body))}`;

async function post(url, body) {
  const res = await fetch(url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
  const text = await res.text();
  if (!res.ok) {
    let detail = text;
    try { const p = JSON.parse(text); detail = `${p.title}: ${p.detail ?? ''}`; } catch { /* not a problem document */ }
    throw new Error(`${url} answered ${res.status}: ${detail}`);
  }
  return { text, type: res.headers.get('content-type') ?? '' };
}

const fmt = (v, digits = 6) => (v === null || v === undefined ? '—' : typeof v === 'number' ? String(Number(v.toPrecision(digits))) : String(v));

function table(caption, head, rows) {
  const t = document.createElement('table');
  if (caption) t.createCaption().textContent = caption;
  if (head) {
    const tr = t.createTHead().insertRow();
    for (const h of head) { const th = document.createElement('th'); th.textContent = h; tr.appendChild(th); }
  }
  const body = t.createTBody();
  for (const row of rows) {
    const tr = body.insertRow();
    for (const cell of row) {
      const td = tr.insertCell();
      td.textContent = cell;
      if (/^-?[\d.]+(e-?\d+)?$/.test(cell)) td.className = 'num';
    }
  }
  return t;
}

function orbitNumbers(a) {
  const peri = a.apsides.periapsis;
  const apo = a.apsides.apoapsis;
  return table(`Orbit about ${a.centralBody.name} at ${a.epoch}`, null, [
    ['orbit type', a.orbitType],
    ['semi-major axis (km)', fmt(a.elements.semiMajorAxis)],
    ['eccentricity', fmt(a.elements.eccentricity, 4)],
    ['inclination (deg)', fmt(a.elements.inclination)],
    ['RAAN (deg)', fmt(a.elements.raan)],
    ['argument of periapsis (deg)', fmt(a.elements.argPeriapsis)],
    ['true anomaly (deg)', fmt(a.elements.trueAnomaly)],
    ['period (min)', a.period === null ? '—' : fmt(a.period / 60)],
    ['periapsis altitude (km)', fmt(peri.altitude)],
    ['apoapsis altitude (km)', apo ? fmt(apo.altitude) : '— (unbound)'],
    ['speed at epoch (km/s)', fmt(a.speed)],
    ['RAAN rate, J2 (deg/day)', a.j2 ? fmt(a.j2.raanRate, 4) : '—'],
    ['sun-synchronous', a.j2 ? (a.j2.sunSynchronous ? 'yes' : 'no') : '—'],
  ]);
}

function passNumbers(a) {
  const counts = new Map();
  for (const p of a.passes) counts.set(p.station, (counts.get(p.station) ?? 0) + 1);
  const wrap = document.createElement('div');
  wrap.appendChild(table(`Passes ${a.window.start} to ${a.window.stop}`, ['station', 'passes'], [...counts].map(([s, n]) => [s, String(n)])));
  wrap.appendChild(table('First passes (UTC)', ['station', 'AOS', 'LOS', 'max el (deg)', 'duration (s)'],
    a.passes.slice(0, 12).map((p) => [p.station, p.aos.slice(0, 19).replace('T', ' '), p.los.slice(11, 19), fmt(p.maxElevation, 3), fmt(p.duration, 4)])));
  return wrap;
}

function eclipseNumbers(a) {
  const umbra = a.eclipses.map((e) => e.umbraDuration ?? 0);
  return table(`Eclipses ${a.window.start} to ${a.window.stop}`, null, [
    ['eclipses by the Earth', String(a.eclipses.length)],
    ['of them partial only', String(a.eclipses.filter((e) => e.umbraStart === null).length)],
    ['longest umbra (min)', umbra.length ? fmt(Math.max(...umbra) / 60, 4) : '—'],
    ['shadow time in window (min)', fmt(a.eclipses.reduce((t, e) => t + e.duration, 0) / 60, 5)],
    ['beta angle range (deg)', `${fmt(a.beta.min, 3)} to ${fmt(a.beta.max, 3)}`],
    ['node local time (h)', a.ascendingNodeLocalTime === null ? '— (not sun-synchronous)' : fmt(a.ascendingNodeLocalTime, 4)],
  ]);
}

function centralForceNumbers(a) {
  return table('Central-force motion', null, [
    ['motion', a.motion],
    ['turning points', a.turningPoints.map((r) => fmt(r)).join(', ') || '—'],
    ['periapsis', fmt(a.periapsis)],
    ['apoapsis', fmt(a.apoapsis)],
    ['radial period', fmt(a.radialPeriod)],
    ['apsidal angle (deg)', fmt(a.apsidalAngle)],
    ['precession per orbit (deg)', fmt(a.precessionPerOrbit)],
    ['circular orbits', a.circularOrbits.map((c) => `${fmt(c.radius)} (${c.stable ? 'stable' : 'unstable'})`).join(', ') || '—'],
  ]);
}

function showSvg(text, label) {
  const doc = new DOMParser().parseFromString(text, 'image/svg+xml');
  if (doc.getElementsByTagName('parsererror').length > 0) throw new Error(`${label}: the plot did not parse`);
  const figure = document.createElement('figure');
  figure.appendChild(document.importNode(doc.documentElement, true));
  $('plots').appendChild(figure);
}

function download(call, format, label, ext) {
  const a = document.createElement('a');
  a.href = '#';
  a.textContent = `${label} (${call.url})`;
  a.addEventListener('click', async (event) => {
    event.preventDefault();
    try {
      const { text, type } = await post(call.url, { ...call.body, format });
      const url = URL.createObjectURL(new Blob([text], { type }));
      const link = document.createElement('a');
      link.href = url;
      link.download = `${(call.body.object?.name ?? 'track').toLowerCase()}.${ext}`;
      document.body.appendChild(link);
      link.click();
      link.remove();
      setTimeout(() => URL.revokeObjectURL(url), 10_000);
    } catch (e) {
      status(e.message, true);
    }
  });
  return a;
}

function status(text, error = false) {
  $('status').textContent = text;
  $('status').className = error ? 'error' : '';
}

const RENDER = { orbit: orbitNumbers, passes: passNumbers, eclipses: eclipseNumbers, 'central-force': centralForceNumbers };

export async function send() {
  let req;
  try {
    req = JSON.parse($('request').value);
  } catch (e) {
    status(`The request is not JSON: ${e.message}`, true);
    return;
  }
  const calls = plan(req);
  status('sending...');
  $('numbers').replaceChildren();
  $('plots').replaceChildren();
  $('downloads').replaceChildren();
  const curls = [];
  try {
    // JSON and SVG of each call, all at once; shown in the order of the calls.
    const answers = await Promise.all(calls.map((c) => Promise.all([
      c.numbers ? post(c.url, c.body) : null,
      c.plot ? post(c.url, { ...c.body, format: 'svg' }) : null,
    ])));
    calls.forEach((c, i) => {
      const [json, svg] = answers[i];
      if (json) {
        $('numbers').appendChild(RENDER[c.numbers](JSON.parse(json.text)));
        curls.push(curlOf(c.url, c.body));
      }
      if (svg) {
        showSvg(svg.text, c.url);
        curls.push(curlOf(c.url, { ...c.body, format: 'svg' }));
      }
      for (const [format, label, ext] of c.downloads ?? []) {
        $('downloads').appendChild(download(c, format, label, ext));
        curls.push(curlOf(c.url, { ...c.body, format }));
      }
    });
    if (!$('downloads').firstChild) $('downloads').textContent = 'none for this request (add a grid to an orbit)';
    status(`answered: ${calls.map((c) => c.url).join(', ')}`);
    document.body.dataset.answered = 'yes';
  } catch (e) {
    status(e.message, true);
  }
  $('curl').textContent = curls.join('\n\n');
}

function choose(index) {
  $('request').value = JSON.stringify(DEMOS[index].request, null, 2);
}

function start() {
  DEMOS.forEach((d, i) => $('demo').add(new Option(d.name, String(i))));
  $('demo').addEventListener('change', () => { choose(Number($('demo').value)); void send(); });
  $('send').addEventListener('click', () => void send());
  $('copy').addEventListener('click', async () => {
    try {
      await navigator.clipboard.writeText($('curl').textContent);
      status('curl commands copied');
    } catch {
      getSelection()?.selectAllChildren($('curl'));
      status('select and copy the commands by hand (clipboard not available)');
    }
  });
  choose(0);
  void send();
}

start();
