// The HTML report in a real browser: Debian's chromium, driven by playwright-core (which never downloads a
// browser of its own). The charts must have drawn; hostile species names must run no script.
// Screenshots go to test/out/ for a person to look at.
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderHtml } from '../../reports/html/template.js';
import { readReport, thermovet } from '../cli/run.js';
import { HOSTILE_IMG, HOSTILE_SCRIPT, makeReport } from './fixture.js';

const CHROMIUM = '/usr/bin/chromium';
const OUT = 'test/out';
const ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

let browser: Browser;

beforeAll(async () => {
  // .ci/apt-packages installs it; without it this test fails rather than skips
  expect(existsSync(CHROMIUM), `${CHROMIUM} missing: apt-get install chromium`).toBe(true);
  mkdirSync(OUT, { recursive: true });
  browser = await chromium.launch({ executablePath: CHROMIUM, args: ARGS, headless: true });
});

afterAll(async () => {
  await browser?.close();
});

interface Opened {
  page: Page;
  dialogs: string[];
  requests: string[];
  errors: string[];
}

/** Opens a report with every network request but the file itself recorded and refused. */
async function open(file: string): Promise<Opened> {
  const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  const o: Opened = { page, dialogs: [], requests: [], errors: [] };
  const self = pathToFileURL(resolve(file)).href;
  page.on('dialog', (d) => {
    o.dialogs.push(d.message());
    void d.dismiss();
  });
  page.on('pageerror', (e) => o.errors.push(e.message));
  await page.route('**/*', (route) => {
    const url = route.request().url();
    if (url === self) return route.continue();
    o.requests.push(url);
    return route.abort();
  });
  await page.goto(self, { waitUntil: 'load' });
  return o;
}

/** Each chart: an SVG of real size holding drawn marks (paths with geometry). */
async function charts(page: Page): Promise<{ w: number; h: number; paths: number; texts: number }[]> {
  return page.$$eval('figure.chart svg.marks', (svgs) =>
    svgs.map((s) => {
      const box = s.getBoundingClientRect();
      const paths = [...s.querySelectorAll('path')].filter((p) => (p.getAttribute('d') ?? '').length > 10).length;
      return { w: box.width, h: box.height, paths, texts: s.querySelectorAll('text').length };
    }),
  );
}

async function ranNoScript(o: Opened): Promise<void> {
  await o.page.waitForTimeout(200); // an onerror on a broken image would have fired by now
  expect(await o.page.evaluate(() => (window as unknown as { __pwned?: number }).__pwned)).toBeUndefined();
  expect(o.dialogs).toEqual([]);
  expect(o.errors).toEqual([]);
  expect(await o.page.$$eval('script, img, iframe, object, embed', (els) => els.length)).toBe(0);
}

describe('HTML report in headless chromium', () => {
  it('the demo report: verdict and caution visible, charts drawn, no network, screenshot', async () => {
    const html = `${OUT}/demo.html`;
    const json = `${OUT}/demo.json`;
    const r = thermovet(['check', '--manifest', 'datasets/demo/manifest.yaml', '--html', html, '--json', json, '--fail-on', 'never', '-q']);
    expect(r.code).toBe(0);
    const report = readReport(json);
    const o = await open(html);
    await expect(o.page.locator('.verdict')).toBeDefined();
    expect(await o.page.locator('.verdict').isVisible()).toBe(true);
    expect(await o.page.locator('.caution').innerText()).toMatch(/Screening, not certification/);
    // as many charts as the report has data for: the residual chart, one per reaction, one per sampled species
    const species = report.species ?? [];
    const expected =
      (species.some((s: { gibbsResidual?: number }) => typeof s.gibbsResidual === 'number') ? 1 : 0) +
      (report.reactions ?? []).filter((x: { points: { lnK: number }[] }) => x.points.some((p) => Number.isFinite(p.lnK))).length +
      Math.min(200, species.filter((s: { cp?: { samples?: unknown[] } }) => (s.cp?.samples?.length ?? 0) >= 2).length);
    const drawn = await charts(o.page);
    expect(drawn).toHaveLength(expected);
    for (const c of drawn) {
      expect(c.w).toBeGreaterThan(300);
      expect(c.h).toBeGreaterThan(80);
      expect(c.paths).toBeGreaterThan(0);
    }
    expect(await o.page.locator('#findings table').count()).toBeGreaterThan(0);
    expect(o.requests).toEqual([]);
    await ranNoScript(o);
    await o.page.screenshot({ path: `${OUT}/demo.png`, fullPage: true });
    await o.page.close();
  });

  it('a report with species and reactions: every chart draws with marks and axis text; screenshot', async () => {
    const file = `${OUT}/fixture.html`;
    writeFileSync(file, await renderHtml(makeReport()));
    const o = await open(file);
    const drawn = await charts(o.page);
    expect(drawn).toHaveLength(6); // 1 residual chart + 1 reaction + 4 species
    for (const c of drawn) {
      expect(c.w).toBeGreaterThan(300);
      expect(c.paths).toBeGreaterThan(0);
      expect(c.texts).toBeGreaterThan(5);
    }
    expect(o.requests).toEqual([]);
    await ranNoScript(o);
    await o.page.screenshot({ path: `${OUT}/fixture.png`, fullPage: true });
    await o.page.close();
  });

  it('hostile species names from an input table run no script and show as text', async () => {
    // CO(g) values: CODATA Key Values (1989) ΔfH°, S°; NIST-JANAF 4th ed. (1998) ΔfG°. Rows repeat on purpose
    // so that findings (duplicate-row) carry the names into messages as well.
    const csv = `${OUT}/hostile.csv`;
    const img = '<img src=x onerror="window.__pwned=1;alert(1)">';
    const script = '<script>window.__pwned=2;alert(2)</script>';
    const row = (name: string) => `"${name.replace(/"/g, '""')}",CO,g,-110.53,-137.163,197.66`;
    writeFileSync(csv, ['species,formula,phase,dHf,dGf,S', row(img), row(img), row(script), row(script), row(script).replace('-137.163', 'oops')].join('\n') + '\n');
    const html = `${OUT}/hostile.html`;
    const r = thermovet(['check', csv, '--html', html, '--fail-on', 'never', '-q']);
    expect(r.code).toBe(0);
    const o = await open(html);
    await ranNoScript(o);
    const text = await o.page.locator('#findings').innerText();
    expect(text).toContain(img);
    expect(text).toContain(script);
    await o.page.screenshot({ path: `${OUT}/hostile.png`, fullPage: true });
    await o.page.close();
  });

  it('hostile names in every field of a full report (charts included) run no script', async () => {
    const file = `${OUT}/hostile-fixture.html`;
    writeFileSync(file, await renderHtml(makeReport({ hostile: true })));
    const o = await open(file);
    await ranNoScript(o);
    expect(await o.page.locator('h1').innerText()).toContain(HOSTILE_IMG);
    const svgText = await o.page.$$eval('figure.chart svg text', (ts) => ts.map((t) => t.textContent ?? '').join('\n'));
    expect(svgText).toMatch(/<img src=x onerror/);
    expect(await o.page.locator('#equilibrium').innerText()).toContain(HOSTILE_SCRIPT);
    await o.page.close();
  });
});
