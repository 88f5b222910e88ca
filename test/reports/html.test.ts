// The HTML report as text: self-contained, no script, every input string escaped, charts inline.
// (html-browser.test.ts opens it in a real browser.)
import { describe, expect, it } from 'vitest';
import { esc } from '../../reports/html/escape.js';
import { CSP, HTML_FINDINGS_LIMIT, lnKCaption, renderHtml } from '../../reports/html/template.js';
import { cpChartSpec, gibbsChartSpec, lnKChartSpec } from '../../reports/html/charts.js';
import type { Finding } from '../../pipeline/types.js';
import { HOSTILE_IMG, HOSTILE_SCRIPT, USE_WINDOW, makeReport } from './fixture.js';

describe('esc', () => {
  it('escapes markup, both quotes, and shows control and bidi characters escaped', () => {
    expect(esc(`<a href="x" onclick='y'>&\``)).toBe('&lt;a href=&quot;x&quot; onclick=&#39;y&#39;&gt;&amp;&#96;');
    expect(esc('a\u202eb\u0007')).toBe('a\\u202eb\\u0007');
    expect(esc(undefined)).toBe('');
  });
});

describe('renderHtml', () => {
  it('opens with the verdict, the counts and the caution, and has no script and no external reference', async () => {
    const html = await renderHtml(makeReport());
    expect(html).toContain(`content="${CSP}"`);
    expect(CSP).toContain("default-src 'none'");
    expect(CSP).not.toMatch(/script-src/); // falls back to default-src 'none': no script at all
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/\son[a-z]+\s*=/i);
    expect(html).not.toMatch(/(src|href)\s*=\s*["']?(https?:)?\/\//i);
    const verdict = html.indexOf('REJECT');
    const caution = html.indexOf('Screening, not certification');
    const findings = html.indexOf('id="findings"');
    expect(verdict).toBeGreaterThan(0);
    expect(caution).toBeGreaterThan(verdict);
    expect(findings).toBeGreaterThan(caution);
    expect(html).toContain('qualified engineer');
    expect(html).toContain('local codes and licensed practice');
  });

  it('draws one Gibbs chart, one ln K chart per reaction and one Cp chart per species with samples, as inline SVG', async () => {
    const r = makeReport();
    const html = await renderHtml(r);
    const figures = html.match(/<figure class="chart">[\s\S]*?<\/figure>/g) ?? [];
    expect(figures).toHaveLength(1 + r.reactions!.length + r.species!.length);
    for (const f of figures) expect(f).toMatch(/<svg[^>]*>[\s\S]*<path[^>]* d="M/);
  });

  it('lists findings grouped by species with file:line:field and the diagnosis; waived ones are marked', async () => {
    const html = await renderHtml(makeReport());
    expect(html.replace(/<[^>]+>/g, '')).toContain('datasets/fixture/gases.csv:4:6'); // the text, with break points after slashes only
    expect(html).toContain('gases.csv<span class="nowrap">:4:6</span>');
    expect(html).toMatch(/Diagnosis|class="diag"/);
    expect(html).toContain('cal-read-as-J');
    expect(html).toContain('accepted by A. Reviewer until 2031-12-31');
    expect(html).toContain('(waived)');
  });

  it('escapes hostile names everywhere: text, attributes, charts, options', async () => {
    const html = await renderHtml(makeReport({ hostile: true }));
    expect(html).not.toContain(HOSTILE_IMG);
    expect(html).not.toContain(HOSTILE_SCRIPT);
    expect(html).not.toMatch(/<img/i);
    expect(html).not.toMatch(/<script/i);
    expect(html).toContain(esc(HOSTILE_IMG));
    // the chart SVGs carry the names as escaped text too
    const svgs = (html.match(/<svg[\s\S]*?<\/svg>/g) ?? []).join('');
    expect(svgs).toContain('&lt;img');
  });

  it('stays bounded: at most HTML_FINDINGS_LIMIT findings listed, the rest counted by rule', async () => {
    const r = makeReport();
    const many: Finding[] = [];
    for (let i = 0; i < HTML_FINDINGS_LIMIT + 500; i++) many.push({ ...r.findings[0]!, location: { file: 'big.csv', line: i + 2 } });
    r.findings = many;
    const html = await renderHtml(r);
    expect((html.match(/<tr class="/g) ?? []).length).toBe(HTML_FINDINGS_LIMIT);
    expect(html).toContain(`The ${HTML_FINDINGS_LIMIT} worst of ${HTML_FINDINGS_LIMIT + 500}`);
    expect(html).toContain('All findings by rule');
  });

  it('says "not enforced" under --fail-on never and PASS when nothing fails', async () => {
    const r = makeReport();
    (r.provenance.options as Record<string, unknown>).failOn = 'never';
    expect(await renderHtml(r)).toContain('NOT ENFORCED');
    const clean = makeReport();
    clean.summary.errors = 0;
    expect(await renderHtml(clean)).toContain('>PASS<');
  });
});

describe('chart keys', () => {
  it('the Cp key names the use window only when the report has one', async () => {
    const cpKey = (html: string): string => html.slice(html.indexOf('<section id="cp"'), html.indexOf('</figure>', html.indexOf('<section id="cp"')));
    expect(cpKey(await renderHtml(makeReport()))).toContain('use window');
    const r = makeReport();
    r.dataset = { ...r.dataset!, useWindow: {} };
    const html = await renderHtml(r);
    expect(html).toContain('No use window was declared.');
    expect(cpKey(html)).not.toContain('use window</li>');
  });
});

describe('chart specifications', () => {
  it('Cp: samples outside every fitted range are drawn as their own (extrapolated) runs, joined to the fitted curve', () => {
    const sp = makeReport().species![2]!; // CO2, fitted 298–1200 K, sampled to 1500 K
    const spec = cpChartSpec(sp, USE_WINDOW) as any;
    const curve = spec.vconcat[0].layer[1].data.values as { T: number; kind: string; run: number }[];
    const extra = curve.filter((p) => p.kind.includes('extrapolated'));
    expect(Math.min(...extra.map((p) => p.T))).toBe(1200); // shares the boundary sample with the fitted run
    expect(Math.max(...extra.map((p) => p.T))).toBe(1500);
    expect(new Set(curve.map((p) => p.run)).size).toBe(2);
    expect(spec.vconcat[0].layer[0].data.values[0]).toMatchObject({ lo: 400, hi: 1400 });
  });

  it('Cp: a fitted range that starts above the first sample is dashed up to its own start, solid from there', () => {
    const sp = structuredClone(makeReport().species![2]!);
    sp.cp!.ranges = [{ ...sp.cp!.ranges[0]!, Tmin: 500, Tmax: 1500 }];
    sp.cp!.samples = [300, 400, 500, 600, 700].map((T) => ({ T, cp: 40 + T / 100, outsideK: Math.max(0, 500 - T) }));
    const spec = cpChartSpec(sp, USE_WINDOW) as any;
    const curve = spec.vconcat[0].layer[1].data.values as { T: number; kind: string; run: number }[];
    const dashed = curve.filter((p) => p.kind.includes('extrapolated')).map((p) => p.T);
    const solid = curve.filter((p) => !p.kind.includes('extrapolated')).map((p) => p.T);
    expect(dashed).toEqual([300, 400, 500]); // the step 400 -> 500 K lies outside the fitted range
    expect(solid).toEqual([500, 600, 700]);
  });

  it('ln K caption: gives the band\'s size, and says so when the band is too thin to see beside ln K\'s own range', () => {
    const base = makeReport().reactions![0]!;
    const pts = (u: number | undefined) => [400, 800, 1200].map((T, i) => ({ ...base.points[0]!, T, lnK: -12 - 4 * i, lnKShortcut: -12 - 4.2 * i, u_lnK: u, extrapolated: [] }));
    // span about 8.4 in ln K over 240 px: ±0.05 is under 3 px high, ±1 is 57 px
    expect(lnKCaption({ ...base, points: pts(0.05) })).toMatch(/Band: ± u\(ln K\), 0\.05; at this scale the band is narrower than the lines/);
    expect(lnKCaption({ ...base, points: pts(1) })).toMatch(/Band: ± u\(ln K\), 1\.$/);
    expect(lnKCaption({ ...base, points: pts(undefined) })).toMatch(/No band/);
  });

  it('Cp caption: a fitted range that starts above 298.15 K is named as an extrapolation the integrals run through', async () => {
    // the fixture's H2O is fitted from 500 K (NIST's Shomate range); CO, CO2 and H2 from 298 K
    const html = await renderHtml(makeReport());
    expect(html).toContain('298.15 K is 201.85 K below the fitted ranges: H and S are integrated from there');
    expect(html.match(/below the fitted ranges/g)).toHaveLength(1);
  });

  it('an odd source\'s diagnosis reads as the median of the sources, not as a correction leaving a residual', async () => {
    const r = makeReport();
    const f = r.findings.find((x) => x.diagnosis)!;
    f.rule = 'cross-source';
    f.diagnosis = { cause: 'odd-source', field: 'S', corrected: 213.79, unit: 'J/(mol K)', residualAfter: 0 };
    const html = await renderHtml(r);
    expect(html).toContain('odd-source in S; the median of all the sources is 213.79 J/(mol K).');
    expect(html).not.toMatch(/odd-source[^<]*leaves a residual/);
  });

  it('no chart without data: no samples, no residuals, no finite ln K', () => {
    const r = makeReport();
    delete r.species![0]!.cp!.samples;
    expect(cpChartSpec(r.species![0]!, USE_WINDOW)).toBeUndefined();
    expect(gibbsChartSpec(r.species!.map((s) => ({ ...s, gibbsResidual: undefined })), { errorKJ: 0.5, warningKJ: 0.1 })).toBeUndefined();
    expect(lnKChartSpec({ ...r.reactions![0]!, points: [] })).toBeUndefined();
  });

  it('Gibbs: largest residuals first, capped, coloured by tolerance', () => {
    const r = makeReport();
    const g = gibbsChartSpec(r.species!, { errorKJ: 0.5, warningKJ: 0.1 })!;
    const rows = (g.spec as any).layer[0].data.values as { label: string; status: string }[];
    expect(rows[0]).toMatchObject({ label: 'CO2 (g)', status: 'above the error tolerance' });
    expect(rows[1]).toMatchObject({ label: 'CO (g)', status: 'above the warning tolerance' });
    expect(g.total).toBe(4);
  });
});
