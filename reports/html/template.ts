// The reviewer's HTML report: one self-contained file, no script, no network. It opens with the verdict,
// the counts and the caution; then the findings grouped by species; then the charts (Gibbs–Helmholtz
// residuals, ln K per reaction, Cp per species), rendered to inline SVG when the report is written;
// then the provenance. Every string from an input file is escaped (esc) before it reaches the page.
import { formatNumber } from '../../pipeline/rules/finding.js';
import { RULES } from '../../pipeline/rules/index.js';
import { failingCount } from '../../pipeline/verdict.js';
import { CHART_SPECIES_LIMIT, type FailOn, type Finding, type ReactionResult, type Report, type SpeciesSummary } from '../../pipeline/types.js';
import { findingsByRule, impactOf, worstFindings } from '../terminal.js';
import { chartKey, cpChartSpec, gibbsChartSpec, LNK_HEIGHT, lnKChartSpec, renderSvg, speciesLabel, windowSpan, type Tolerance } from './charts.js';
import { esc } from './escape.js';
import { CSS } from './style.js';

/** Most findings the page lists one by one; the rest are counted by rule (the JSON report has them all). */
export const HTML_FINDINGS_LIMIT = 2000;

/** No script at all, no network: styles and inline SVG only. */
export const CSP = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'";

export interface HtmlOptions {
  /** called after each chart is drawn, for a progress display */
  onChart?: (done: number, total: number) => void;
}

const CAUTION =
  '<p><strong>Screening, not certification.</strong> thermovet checks property tables for inconsistencies and estimates how ' +
  'much they move equilibrium constants. It does not certify data for design.</p>' +
  '<p>Results must be reviewed by a qualified engineer before they are used. Reactor and pressure-equipment design is governed ' +
  'by local codes and licensed practice, not by this report.</p>';

const n = (v: number | undefined, unit = ''): string => (v === undefined || !Number.isFinite(v) ? '—' : `${esc(formatNumber(v))}${unit ? ` ${esc(unit)}` : ''}`);

function failOnOf(report: Report): FailOn {
  const f = (report.provenance.options as { failOn?: unknown }).failOn;
  return f === 'warning' || f === 'never' ? f : 'error';
}

function tolerancesOf(report: Report): Tolerance {
  const t = (report.provenance.options as { tolerances?: { gibbsErrorKJ?: number; gibbsWarningKJ?: number } }).tolerances;
  return { errorKJ: t?.gibbsErrorKJ ?? 0.5, warningKJ: t?.gibbsWarningKJ ?? 0.1 };
}

function verdictBlock(report: Report): string {
  const failOn = failOnOf(report);
  const s = report.summary;
  if (failOn === 'never') {
    const would = s.errors > 0 ? 'REJECT' : 'PASS';
    return `<div class="verdict open" role="status"><strong>NOT ENFORCED</strong><span>This run used --fail-on never. At the default (errors fail) it would ${would}: ${s.errors} unwaived error${s.errors === 1 ? '' : 's'}.</span></div>`;
  }
  const failing = failingCount(s, failOn);
  if (failing > 0) {
    return `<div class="verdict reject" role="status"><strong>REJECT</strong><span>${failing} unwaived finding${failing === 1 ? '' : 's'} at or above ${esc(failOn)} severity.</span></div>`;
  }
  return `<div class="verdict pass" role="status"><strong>PASS</strong><span>No unwaived finding at or above ${esc(failOn)} severity. Passing the screen is not a certification: see the caution below.</span></div>`;
}

function countsBlock(report: Report): string {
  const s = report.summary;
  let waived = 0;
  for (const f of report.findings) if (f.waived) waived++;
  const cell = (label: string, v: number, cls = ''): string => `<div class="${cls}"><dt>${label}</dt><dd>${v}</dd></div>`;
  return (
    '<dl class="counts">' +
    cell('rows read', s.rows) +
    cell('rows accepted', s.accepted) +
    cell('rows rejected', s.rejected) +
    cell('species', s.species) +
    cell('errors', s.errors, 'error') +
    cell('warnings', s.warnings, 'warning') +
    cell('info', s.infos) +
    cell('waived', waived) +
    '</dl>'
  );
}

const SEV_MARK: Record<string, string> = { error: '■ error', warning: '▲ warning', info: '● info' };

/** file:line:column, breakable only after a slash of the path, never inside ":17:4". */
function whereHtml(f: Finding): string {
  const tail = `:${f.location.line}${f.location.column ? `:${f.location.column}` : ''}`;
  const path = esc(f.location.file).replace(/\//g, '/<wbr>');
  return `${path}<span class="nowrap">${tail}</span>`;
}

function findingRow(f: Finding): string {
  const rule = RULES.find((r) => r.id === f.rule);
  let cell = esc(f.message);
  const d = f.diagnosis;
  if (d) {
    if (d.cause === 'odd-source') {
      // the median is a consensus, not a corrected value that leaves a residual
      cell += `<span class="diag">${esc(d.cause)} in ${esc(d.field)}; the median of all the sources is ${n(d.corrected, d.unit)}.</span>`;
    } else {
      const after = `${n(Number(d.residualAfter.toPrecision(3)))}${f.rule === 'gibbs-helmholtz' ? ' kJ/mol' : ''}`;
      cell += `<span class="diag">${esc(d.cause)} in ${esc(d.field)}; the corrected value ${n(d.corrected, d.unit)} leaves a residual of ${after}.</span>`;
    }
  }
  const impact = impactOf(f);
  if (impact > 0) {
    const worst = [...(f.impact ?? [])].sort((a, b) => b.maxAbsDeltaLnK - a.maxAbsDeltaLnK).slice(0, 3);
    cell += `<span class="impact">Moves ln K by up to ${n(impact)}: ${worst.map((i) => `${esc(i.reaction)} ${n(i.maxAbsDeltaLnK)}${i.T_K !== undefined ? ` at ${n(i.T_K)} K` : ''}`).join('; ')}</span>`;
  }
  if (f.waived) {
    cell += `<span class="waiver">accepted by ${esc(f.waived.by)} until ${esc(f.waived.expires)}: ${esc(f.waived.reason)}</span>`;
  }
  return (
    `<tr class="${f.waived ? 'waived' : ''}"><td><span class="sev ${esc(f.severity)}">${SEV_MARK[f.severity] ?? esc(f.severity)}${f.waived ? ' (waived)' : ''}</span></td>` +
    `<td class="where"><code>${whereHtml(f)}</code>${f.location.field ? `<br><span class="note">${esc(f.location.field)}</span>` : ''}</td>` +
    `<td class="rule"><code title="${esc(rule?.description ?? '')}">${esc(f.rule)}</code></td><td>${cell}</td></tr>`
  );
}

function findingsSection(report: Report, chartAnchor: Map<string, string>): string {
  const out: string[] = ['<section id="findings"><h2>Findings</h2>'];
  if (report.findings.length === 0) {
    out.push('<p>No findings.</p></section>');
    return out.join('');
  }
  const shown = worstFindings(report.findings, HTML_FINDINGS_LIMIT);
  const total = report.findings.length;
  out.push(
    `<p class="note">Worst first: unwaived before waived, then by severity and by how far the finding moves ln K. Locations are file:line:field position.${
      shown.length < total ? ` The ${shown.length} worst of ${total} are listed; the JSON and SARIF reports hold all of them.` : ''
    }</p>`,
  );
  const groups = new Map<string, { title: string; phase?: string; anchorKey?: string; list: Finding[] }>();
  for (const f of shown) {
    const k = f.species !== undefined ? `s\u0000${f.species}\u0000${f.phase ?? ''}` : `f\u0000${f.location.file}`;
    let g = groups.get(k);
    if (!g) {
      g = f.species !== undefined ? { title: f.species, phase: f.phase, anchorKey: `${f.species}|${f.phase ?? ''}`, list: [] } : { title: `${f.location.file} (rows and file)`, list: [] };
      groups.set(k, g);
    }
    g.list.push(f);
  }
  for (const g of groups.values()) {
    const anchor = g.anchorKey ? chartAnchor.get(g.anchorKey) : undefined;
    out.push(
      `<div class="group"><h3>${esc(g.title)}${g.phase ? ` <span class="phase">(${esc(g.phase)})</span>` : ''}${anchor ? `<a href="#${anchor}">Cp chart</a>` : ''}</h3>` +
        '<table class="findings"><colgroup><col class="c-sev"><col class="c-where"><col class="c-rule"><col></colgroup>' +
        '<thead><tr><th>severity</th><th>where</th><th>rule</th><th>finding</th></tr></thead><tbody>' +
        g.list.map(findingRow).join('') +
        '</tbody></table></div>',
    );
  }
  if (shown.length < total) {
    out.push('<h3>All findings by rule</h3><table><thead><tr><th>severity</th><th>rule</th><th class="num">findings</th></tr></thead><tbody>');
    for (const r of findingsByRule(report.findings)) out.push(`<tr><td>${esc(r.severity)}</td><td><code>${esc(r.rule)}</code></td><td class="num">${r.count}</td></tr>`);
    out.push('</tbody></table>');
  }
  out.push('</section>');
  return out.join('');
}

function figure(svg: string, label: string, caption: string, kind: 'cp' | 'lnK' | 'gibbs', withWindow = true): string {
  const key = chartKey(kind, withWindow)
    .map((k) => `<li>${k.swatch}${esc(k.label)}</li>`)
    .join('');
  return `<figure class="chart"><div role="img" aria-label="${esc(label)}">${svg}</div><ul class="key">${key}</ul><figcaption>${caption}</figcaption></figure>`;
}

/** Fixed decimals for table columns, so digits line up: ln K to 0.001, ΔrG° to 0.01 kJ/mol. */
const fixed = (v: number | undefined, digits: number): string => (v === undefined || !Number.isFinite(v) ? '—' : esc(v.toFixed(digits)));

function reactionTable(r: ReactionResult): string {
  if (r.points.length === 0) return '';
  const rows = r.points
    .map(
      (p) =>
        `<tr><td class="num">${n(p.T)}</td><td class="num">${fixed(p.lnK, 3)}</td><td class="num">${fixed(p.lnKShortcut, 3)}</td><td class="num">${fixed(p.lnK - p.lnKShortcut, 3)}</td>` +
        `<td class="num">${fixed(p.u_lnK, 3)}</td><td class="num">${fixed(p.dG, 2)}</td><td>${p.extrapolated.map((e) => `${esc(e.species)} (+${n(e.outsideK)} K, Cp ${n(e.cp)})`).join(', ') || '—'}</td></tr>`,
    )
    .join('');
  return (
    '<table><thead><tr><th class="num">T (K)</th><th class="num">ln K rigorous</th><th class="num">ln K shortcut</th><th class="num">difference</th>' +
    '<th class="num">u(ln K)</th><th class="num">ΔrG° (kJ/mol)</th><th>Cp extrapolated</th></tr></thead><tbody>' +
    rows +
    '</tbody></table>'
  );
}

interface ChartJob {
  section: 'gibbs' | 'reaction' | 'cp';
  key: string;
  run: () => Promise<string>;
}

/** The whole page. Charts are drawn one after another (bounded: at most CHART_SPECIES_LIMIT species charts). */
export async function renderHtml(report: Report, opts: HtmlOptions = {}): Promise<string> {
  const species = report.species ?? [];
  const reactions = report.reactions ?? [];
  const useWindow = report.dataset?.useWindow;
  const tol = tolerancesOf(report);
  // one pass over the summaries (check() makes them as they are read): the charted ones kept, the rest counted
  const cpSpecies: SpeciesSummary[] = [];
  let withCp = 0;
  for (const s of species) {
    if (s.cp) withCp++;
    if (cpSpecies.length < CHART_SPECIES_LIMIT && (s.cp?.samples?.length ?? 0) >= 2) cpSpecies.push(s);
  }
  const chartAnchor = new Map<string, string>();
  cpSpecies.forEach((s, i) => chartAnchor.set(`${s.name}|${s.phase}`, `cp-${i + 1}`));

  // draw every chart first (the slow part), reporting progress
  const gibbs = gibbsChartSpec(species, tol);
  const jobs: ChartJob[] = [];
  if (gibbs) jobs.push({ section: 'gibbs', key: 'gibbs', run: () => renderSvg(gibbs.spec) });
  reactions.forEach((r, i) => {
    const spec = lnKChartSpec(r);
    if (spec) jobs.push({ section: 'reaction', key: String(i), run: () => renderSvg(spec) });
  });
  cpSpecies.forEach((s, i) => {
    const spec = cpChartSpec(s, useWindow);
    if (spec) jobs.push({ section: 'cp', key: String(i), run: () => renderSvg(spec) });
  });
  const svgs = new Map<string, string>();
  for (let i = 0; i < jobs.length; i++) {
    const job = jobs[i]!;
    svgs.set(`${job.section}:${job.key}`, await job.run());
    opts.onChart?.(i + 1, jobs.length);
  }

  const name = report.dataset?.name ?? report.provenance.inputs[0]?.path ?? 'property tables';
  const out: string[] = [];
  out.push(
    '<!doctype html>\n<html lang="en"><head><meta charset="utf-8">' +
      `<meta http-equiv="Content-Security-Policy" content="${CSP}">` +
      '<meta name="referrer" content="no-referrer"><meta name="viewport" content="width=device-width, initial-scale=1">' +
      `<meta name="generator" content="thermovet ${esc(report.tool.version)}">` +
      `<title>thermovet: ${esc(name)}</title><style>${CSS}</style></head><body><div class="page">`,
  );
  out.push(
    '<header>' +
      `<p class="meta">thermovet ${esc(report.tool.version)} · property-table screening report · generated ${esc(report.provenance.generatedAt)}</p>` +
      `<h1>${esc(name)}</h1>` +
      verdictBlock(report) +
      countsBlock(report) +
      `<aside class="caution" role="note">${CAUTION}</aside>` +
      '</header>',
  );
  const toc: [string, string][] = [['findings', 'Findings']];
  if (gibbs) toc.push(['gibbs', 'Gibbs–Helmholtz residuals']);
  if (reactions.length) toc.push(['equilibrium', 'Equilibrium constants']);
  if (cpSpecies.length) toc.push(['cp', 'Heat capacity']);
  toc.push(['provenance', 'Provenance']);
  out.push(`<nav class="toc" aria-label="contents"><strong>Contents</strong><ol>${toc.map(([id, t]) => `<li><a href="#${id}">${t}</a></li>`).join('')}</ol></nav><main>`);

  out.push(findingsSection(report, chartAnchor));

  if (gibbs) {
    out.push('<section id="gibbs"><h2>Gibbs–Helmholtz residuals</h2>');
    out.push(
      figure(
        svgs.get('gibbs:gibbs')!,
        'Gibbs–Helmholtz residual for each species',
        `ΔfG° − (ΔfH° − T·ΔfS°) at 298.15 K for each species with all three values. Dashed lines: the warning tolerance (±${n(tol.warningKJ)} kJ/mol) and the error tolerance (±${n(tol.errorKJ)} kJ/mol). ` +
          (gibbs.shown < gibbs.total ? `The ${gibbs.shown} largest of ${gibbs.total} residuals are drawn.` : `All ${gibbs.total} residuals are drawn.`),
        'gibbs',
      ),
    );
    out.push('</section>');
  }

  if (reactions.length) {
    out.push('<section id="equilibrium"><h2>Equilibrium constants</h2>');
    out.push(
      '<p class="note">ln K by the rigorous route (each species’ Cp integrated from 298.15 K) and by the constant-ΔrH° shortcut. The band is ± one standard uncertainty propagated from the stated uncertainties; triangles mark temperatures at which a species’ Cp correlation is used outside its fitted range.</p>',
    );
    reactions.forEach((r, i) => {
      out.push(`<h3 id="rx-${i + 1}">${esc(r.id)}: <span class="mono">${esc(r.equation)}</span></h3>`);
      out.push(`<p class="meta">defined at ${esc(r.file)}:${r.line}${r.balanced ? '' : ' · <strong>not balanced</strong> in elements or charge'}</p>`);
      const svg = svgs.get(`reaction:${i}`);
      if (svg) out.push(figure(svg, `ln K against temperature for ${r.id}`, lnKCaption(r), 'lnK'));
      else out.push('<p class="note">No finite ln K to draw.</p>');
      out.push(reactionTable(r));
      if (r.uncertaintyRanking?.length) {
        out.push(
          `<p class="note">Share of u(ln K)² at the worst point: ${r.uncertaintyRanking
            .slice(0, 5)
            .map((u) => `${esc(u.species)} ${n(Math.round(u.share * 1000) / 10)} %`)
            .join(', ')}.</p>`,
        );
      }
    });
    out.push('</section>');
  }

  if (cpSpecies.length) {
    const win = windowSpan(useWindow);
    out.push('<section id="cp"><h2>Heat capacity</h2>');
    out.push(
      `<p class="note">Cp against T as each species’ correlation gives it: solid where a fitted range covers T, dashed where it is extrapolated. ${
        win ? `The shaded band is the use window, ${n(win[0])}–${n(win[1])} K.` : 'No use window was declared.'
      } The strip under each chart shows the fitted ranges and the window.${withCp > cpSpecies.length ? ` Charts are drawn for ${cpSpecies.length} of the ${withCp} species with a Cp correlation (those in reactions first, then those with Cp findings, then the rest by name).` : ''}</p>`,
    );
    cpSpecies.forEach((s, i) => {
      const svg = svgs.get(`cp:${i}`);
      out.push(`<h3 id="cp-${i + 1}">${esc(s.name)} <span class="phase">(${esc(s.phase)})</span> <span class="meta mono">${esc(s.formula)}</span></h3>`);
      if (svg) out.push(figure(svg, `Heat capacity of ${speciesLabel(s)} against temperature`, cpCaption(s), 'cp', win !== undefined));
    });
    out.push('</section>');
  }

  out.push(provenanceSection(report));
  out.push(`</main><footer>${CAUTION}<p>Generated by thermovet ${esc(report.tool.version)} at ${esc(report.provenance.generatedAt)}.</p></footer></div></body></html>\n`);
  return out.join('\n');
}

/** Band narrower than this on the page (px, full height) reads as part of the lines. */
const BAND_VISIBLE_PX = 4;

/** What the ln K chart's band holds, and a word when it is too thin to see at the chart's scale. */
export function lnKCaption(r: ReactionResult): string {
  const fin = (x: number | undefined): x is number => typeof x === 'number' && Number.isFinite(x);
  const pts = r.points.filter((p) => fin(p.lnK));
  const us = pts.map((p) => p.u_lnK).filter((u): u is number => fin(u) && u > 0);
  const head = `ln K against T for ${esc(r.id)}.`;
  if (us.length === 0) return `${head} No band: no stated uncertainty reaches this reaction's ln K.`;
  const ys = pts.flatMap((p) => [p.lnK, p.lnKShortcut, ...(fin(p.u_lnK) ? [p.lnK - p.u_lnK, p.lnK + p.u_lnK] : [])]).filter(fin);
  const span = Math.max(...ys) - Math.min(...ys);
  const uMin = Math.min(...us);
  const uMax = Math.max(...us);
  const band = `Band: ± u(ln K), ${uMin === uMax ? n(Number(uMax.toPrecision(2))) : `${n(Number(uMin.toPrecision(2)))} to ${n(Number(uMax.toPrecision(2)))}`}`;
  const thin = span > 0 && ((2 * uMax) / span) * LNK_HEIGHT < BAND_VISIBLE_PX;
  return `${head} ${band}${thin ? '; at this scale the band is narrower than the lines (u(ln K) per temperature is in the table below)' : ''}.`;
}

function cpCaption(s: SpeciesSummary): string {
  const cp = s.cp!;
  const ranges = cp.ranges.map((r) => `${esc(r.model)} ${n(r.Tmin)}–${n(r.Tmax)} K (${esc(r.file)}:${r.line})`).join('; ');
  const outside = cp.atWindow.filter((w) => w.outsideK > 0);
  const below = cp.ranges.length ? Math.min(...cp.ranges.map((r) => r.Tmin)) - 298.15 : 0;
  return (
    `Fitted ranges: ${ranges || 'none'}. Cp(298.15 K) = ${n(cp.cp298, 'J/(mol K)')}.` +
    (below > 0 ? ` 298.15 K is ${n(Number(below.toFixed(2)))} K below the fitted ranges: H and S are integrated from there through the extrapolated correlation (dashed).` : '') +
    (outside.length ? ` Extrapolated in the use window: ${outside.map((w) => `${n(w.T)} K is ${n(w.outsideK)} K outside, Cp ${n(w.cp)} J/(mol K)`).join('; ')}.` : '')
  );
}

function provenanceSection(report: Report): string {
  const p = report.provenance;
  const inputs = p.inputs.map((i) => `<tr><td><code>${esc(i.path)}</code></td><td class="num">${i.bytes}</td><td><code>${esc(i.sha256)}</code></td></tr>`).join('');
  return (
    '<section id="provenance"><h2>Provenance</h2>' +
    `<p>Tool: thermovet ${esc(report.tool.version)}. Generated at ${esc(p.generatedAt)}.</p>` +
    '<table><thead><tr><th>input</th><th class="num">bytes</th><th>SHA-256</th></tr></thead><tbody>' +
    inputs +
    `<tr><td><code>${esc(p.reference.path)}</code> (reference data)</td><td class="num">—</td><td><code>${esc(p.reference.sha256)}</code></td></tr>` +
    '</tbody></table>' +
    `<p>Rules that ran: ${p.rules.map((r) => `<code>${esc(r)}</code>`).join(', ')}.</p>` +
    `<h3>Options in effect</h3><pre>${esc(JSON.stringify(p.options, null, 2))}</pre>` +
    '</section>'
  );
}
