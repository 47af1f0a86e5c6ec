// The scenario page in a real browser (Debian's chromium driven by playwright-core): on first open
// it shows the first demo answered, numbers and plots, under a strict Content-Security-Policy.
// Skipped with a notice when chromium is absent, except under CI=true (.ci/run installs it), where that fails.
import { existsSync, mkdirSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { chromium, type Browser } from 'playwright-core';
import { testApp } from '../helpers/app.js';

const CHROMIUM = '/usr/bin/chromium';
const ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'];
// Same origin for everything, nothing inline (common practice, no source): the service's own
// Content-Security-Policy (src/plugins/edge.ts) must hold these, and the page and /docs work under it.
const STRICT = ["default-src 'self'", "script-src 'self'", "style-src 'self'", "connect-src 'self'", "object-src 'none'", "base-uri 'none'", "frame-ancestors 'none'"];
const cspOf = (headers: Record<string, string>) => (headers['content-security-policy'] ?? '').split(';').map((d) => d.trim());
const ARTIFACTS = new URL('../artifacts/', import.meta.url);
const present = existsSync(CHROMIUM);
if (!present && process.env.CI !== 'true') console.warn(`NOTICE: ${CHROMIUM} not found: the browser test of the scenario page is skipped (apt-get install -y chromium)`);

describe.runIf(!present && process.env.CI === 'true')('CI runs the browser test', () => {
  it('has chromium (.ci/run installs it)', () => expect.fail(`${CHROMIUM} is missing under CI=true`));
});

describe.skipIf(!present)('the scenario page at / in chromium', () => {
  let app: FastifyInstance;
  let browser: Browser;
  let origin: string;
  beforeAll(async () => {
    app = await testApp();
    origin = await app.listen({ port: 0, host: '127.0.0.1' });
    browser = await chromium.launch({ executablePath: CHROMIUM, args: ARGS });
  }, 60_000);
  afterAll(async () => {
    await browser?.close();
    await app?.close();
  });

  it('shows the first demo answered on first open: key numbers and its plots, no CSP violation', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    const problems: string[] = [];
    page.on('console', (m) => { if (m.type() === 'error') problems.push(m.text()); });
    page.on('pageerror', (e) => problems.push(e.message));
    const answer = await page.goto(`${origin}/`);
    expect(cspOf(answer!.headers())).toEqual(expect.arrayContaining(STRICT));
    await page.waitForSelector('body[data-answered="yes"]', { timeout: 90_000 });
    const numbers = await page.locator('#numbers').innerText();
    expect(numbers).toContain('semi-major axis (km)');
    expect(numbers).toContain('6928.14');
    expect(numbers).toContain('korrin-hill');
    expect(numbers).toContain('eclipses by the Earth');
    expect(await page.locator('#plots svg').count()).toBe(4); // orbit, ground track, passes (timeline + sky plots), eclipses
    const titles = await page.locator('#plots svg > title').allTextContents();
    expect(titles).toEqual(['Orbit about earth', 'Ground track of PLOVER-7', 'Ground-station passes', 'Eclipses']);
    const box = await page.locator('#plots svg').first().boundingBox();
    expect(box!.width).toBeGreaterThan(500);
    expect(await page.locator('#downloads a').count()).toBe(3); // track CSV and OEM, eclipses CSV
    expect(await page.locator('#curl').innerText()).toContain(`curl -s ${origin}/v1/orbit`);
    mkdirSync(ARTIFACTS, { recursive: true });
    await page.screenshot({ path: new URL('page.png', ARTIFACTS).pathname, fullPage: true });
    expect(problems).toEqual([]);
    await page.close();
  }, 120_000);

  it('/docs (the interactive API reference) renders the operations under the service\'s policy, no CSP violation', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    const problems: string[] = [];
    page.on('console', (m) => { if (m.type() === 'error') problems.push(m.text()); });
    page.on('pageerror', (e) => problems.push(e.message));
    const answer = await page.goto(`${origin}/docs`);
    // The reference bundle sets inline styles: /docs alone allows them; scripts stay same-origin.
    expect(cspOf(answer!.headers())).toEqual(expect.arrayContaining([...STRICT.filter((d) => !d.startsWith('style-src')), "style-src 'self' 'unsafe-inline'"]));
    await page.waitForSelector('.opblock', { timeout: 60_000 });
    expect(await page.locator('.opblock').count()).toBeGreaterThan(5);
    expect(await page.locator('.opblock-summary-path', { hasText: '/v1/orbit' }).count()).toBeGreaterThan(0);
    expect(problems).toEqual([]);
    await page.close();
  }, 120_000);

  it('picking another demo sends it; a bad request shows the problem', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await page.goto(`${origin}/`);
    await page.waitForSelector('body[data-answered="yes"]', { timeout: 90_000 });
    await page.selectOption('#demo', '3');
    await page.locator('#numbers', { hasText: 'apsidal angle' }).waitFor({ timeout: 60_000 });
    expect(await page.locator('#plots svg').count()).toBe(1);
    await page.fill('#request', '{"centralBody": "earth", "elements": {"epoch": "2026-12-01T00:00:00Z", "eccentricity": 0.1}}');
    await page.click('#send');
    await page.waitForSelector('#status.error', { timeout: 30_000 });
    expect(await page.locator('#status').innerText()).toContain('400');
    await page.close();
  }, 120_000);
});
