// The report's charts: vega-lite specifications built from the finished Report, rendered headless to
// SVG when the report is written, so the page needs no script and no network to show them.
// The charts only draw what the report holds; they compute nothing the JSON report does not have.
import * as vega from 'vega';
import { compile, type TopLevelSpec } from 'vega-lite';
import type { ReactionResult, SpeciesSummary, UseWindow } from '../../pipeline/types.js';

/** Okabe–Ito, a palette that stays distinct under the common colour-vision deficiencies. */
export const PALETTE = {
  blue: '#0072B2',
  vermillion: '#D55E00',
  orange: '#E69F00',
  sky: '#56B4E9',
  green: '#009E73',
  purple: '#CC79A7',
  grey: '#6b6b6b',
} as const;

const FONT = 'system-ui, -apple-system, "Segoe UI", "DejaVu Sans", Arial, sans-serif';
const CONFIG = {
  font: FONT,
  background: '#ffffff',
  view: { stroke: '#bdbdbd' },
  axis: { labelFontSize: 11, titleFontSize: 12, titleFontWeight: 'normal' as const, gridColor: '#e6e6e6', labelColor: '#222', titleColor: '#222' },
  title: { fontSize: 13, anchor: 'start' as const, fontWeight: 'normal' as const },
};

/** Renders a vega-lite specification to a standalone SVG string (no DOM, no canvas, no network). */
export async function renderSvg(spec: TopLevelSpec): Promise<string> {
  // silent loggers: the CLI's stderr belongs to the user
  const vg = compile(spec, { logger: vega.logger(vega.None) }).spec;
  const view = new vega.View(vega.parse(vg), { renderer: 'none', logLevel: vega.None });
  try {
    return await view.toSVG();
  } finally {
    view.finalize();
  }
}

/** The readable label of a species: name and phase. */
export const speciesLabel = (s: { name: string; phase: string }): string => `${s.name} (${s.phase})`;

const CP_FIT = 'Cp inside a fitted range';
const CP_EXTRA = 'Cp extrapolated beyond the fitted ranges';
const WINDOW = 'use window';

/** Window bounds as the charts mark them: the declared Tmin..Tmax, or the span of the listed temperatures. */
export function windowSpan(w: UseWindow | undefined): [number, number] | undefined {
  if (!w) return undefined;
  const ts = w.temperatures ?? [];
  const lo = w.Tmin ?? (ts.length ? Math.min(...ts) : undefined);
  const hi = w.Tmax ?? (ts.length ? Math.max(...ts) : undefined);
  return lo !== undefined && hi !== undefined && hi > lo ? [lo, hi] : undefined;
}

/**
 * Cp against T for one species: the sampled curve, solid where a fitted range covers it and dashed
 * where it is extrapolated; the use window shaded; below it a strip with each fitted range and the window.
 * Undefined when the report holds no samples for the species.
 */
export function cpChartSpec(sp: SpeciesSummary, useWindow: UseWindow | undefined): TopLevelSpec | undefined {
  const samples = sp.cp?.samples;
  if (!samples || samples.length < 2) return undefined;
  const win = windowSpan(useWindow);
  const ranges = sp.cp?.ranges ?? [];
  // consecutive samples of one kind form a run; neighbouring runs share their boundary sample so the
  // curve is unbroken, and the step between a fitted and an extrapolated sample belongs to the
  // extrapolated (dashed) run: the fitted range's own end sample is where the dashes start or stop
  const curve: { T: number; cp: number; kind: string; run: number }[] = [];
  let run = 0;
  samples.forEach((p, i) => {
    const kind = p.outsideK > 0 ? CP_EXTRA : CP_FIT;
    const prev = samples[i - 1];
    if (prev && (prev.outsideK > 0 ? CP_EXTRA : CP_FIT) !== kind) {
      if (kind === CP_EXTRA) curve.push({ T: prev.T, cp: prev.cp, kind, run: ++run });
      else curve.push({ T: p.T, cp: p.cp, kind: CP_EXTRA, run: run++ });
    }
    curve.push({ T: p.T, cp: p.cp, kind, run });
  });
  const xs = [...samples.map((p) => p.T), ...ranges.flatMap((r) => [r.Tmin, r.Tmax]), ...(win ?? [])];
  const domain = [Math.min(...xs), Math.max(...xs)];
  const x = { field: 'T', type: 'quantitative' as const, title: 'T (K)', scale: { domain, nice: false, zero: false } };
  // the page draws one key per kind of chart (chartKey), so the SVGs carry no legends
  const color = {
    field: 'kind',
    type: 'nominal' as const,
    legend: null,
    scale: { domain: [CP_FIT, CP_EXTRA, WINDOW], range: [PALETTE.blue, PALETTE.vermillion, PALETTE.sky] },
  };
  const strip = [
    ...(win ? [{ row: `use window ${win[0]}–${win[1]} K`, lo: win[0], hi: win[1], kind: WINDOW }] : []),
    ...ranges.map((r, i) => ({ row: `${i + 1}. ${r.model} ${r.Tmin}–${r.Tmax} K`, lo: r.Tmin, hi: r.Tmax, kind: CP_FIT })),
  ];
  const width = 520;
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    description: `Heat capacity of ${speciesLabel(sp)} against temperature`,
    config: CONFIG,
    vconcat: [
      {
        width,
        height: 220,
        layer: [
          ...(win
            ? [
                {
                  data: { values: [{ lo: win[0], hi: win[1], kind: WINDOW }] },
                  mark: { type: 'rect' as const, opacity: 0.22 },
                  encoding: { x: { ...x, field: 'lo' }, x2: { field: 'hi' }, color },
                },
              ]
            : []),
          {
            data: { values: curve },
            mark: { type: 'line' as const, strokeWidth: 2 },
            encoding: {
              x,
              y: { field: 'cp', type: 'quantitative' as const, title: 'Cp (J/(mol K))', scale: { zero: false } },
              color,
              strokeDash: { field: 'kind', type: 'nominal' as const, legend: null, scale: { domain: [CP_FIT, CP_EXTRA, WINDOW], range: [[1, 0], [6, 4], [1, 0]] } },
              detail: { field: 'run', type: 'nominal' as const },
            },
          },
        ],
      },
      {
        width,
        height: { step: 16 },
        data: { values: strip },
        mark: { type: 'bar' as const, height: 9, cornerRadius: 2 },
        encoding: {
          x: { ...x, field: 'lo', axis: null },
          x2: { field: 'hi' },
          y: { field: 'row', type: 'nominal' as const, title: null, sort: null, axis: { ticks: false, domain: false, labelLimit: 240 } },
          color,
        },
      },
    ],
    resolve: { scale: { x: 'shared', color: 'shared' } },
  } as TopLevelSpec;
}

export interface Tolerance {
  errorKJ: number;
  warningKJ: number;
}

/** Most bars one residual chart shows; the largest residuals come first. */
export const GIBBS_BAR_LIMIT = 60;

/**
 * Gibbs–Helmholtz residuals across species, largest first, on a symmetric-log axis so that 0.01 and
 * 200 kJ/mol both read; the warning and error tolerances drawn as dashed rules.
 */
export function gibbsChartSpec(species: Iterable<SpeciesSummary>, tol: Tolerance): { spec: TopLevelSpec; shown: number; total: number } | undefined {
  const withResidual: { label: string; residual: number }[] = []; // labels and numbers only: the summaries may be made as they are read
  for (const s of species) {
    if (typeof s.gibbsResidual === 'number' && Number.isFinite(s.gibbsResidual)) withResidual.push({ label: speciesLabel(s), residual: s.gibbsResidual });
  }
  if (withResidual.length === 0) return undefined;
  const status = (r: number): string => (Math.abs(r) > tol.errorKJ ? 'above the error tolerance' : Math.abs(r) > tol.warningKJ ? 'above the warning tolerance' : 'within tolerance');
  const rows = withResidual
    .map((s) => ({ label: s.label, residual: s.residual, status: status(s.residual) }))
    .sort((a, b) => Math.abs(b.residual) - Math.abs(a.residual) || (a.label < b.label ? -1 : a.label > b.label ? 1 : 0))
    .slice(0, GIBBS_BAR_LIMIT);
  const rules = [-tol.errorKJ, -tol.warningKJ, tol.warningKJ, tol.errorKJ].map((v) => ({ v }));
  // ticks at 0 and at ± powers of ten up to the largest residual: a symmetric-log axis reads by decades
  const top = Math.max(tol.errorKJ, ...rows.map((r) => Math.abs(r.residual)));
  const decades: number[] = [0];
  for (let p = Math.floor(Math.log10(Math.max(tol.warningKJ, 1e-3))); 10 ** p <= top * 1.0001; p++) decades.push(10 ** p, -(10 ** p));
  const hasNeg = rows.some((r) => r.residual < 0);
  const hasPos = rows.some((r) => r.residual > 0);
  const ticks = decades.filter((v) => (v < 0 ? hasNeg : v > 0 ? hasPos : true)).sort((x, y) => x - y);
  const spec = {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    description: 'Gibbs–Helmholtz residual at 298.15 K for each species',
    config: CONFIG,
    width: 520,
    height: { step: 16 },
    layer: [
      {
        data: { values: rows },
        mark: { type: 'bar' as const, height: 11 },
        encoding: {
          y: { field: 'label', type: 'nominal' as const, title: null, sort: null, axis: { labelLimit: 220 } },
          x: {
            field: 'residual',
            type: 'quantitative' as const,
            title: 'ΔfG° − (ΔfH° − T·ΔfS°) at 298.15 K (kJ/mol, symmetric-log axis)',
            scale: { type: 'symlog' as const, constant: Math.max(tol.warningKJ, 1e-3) },
            axis: { values: ticks, format: '~r' },
          },
          color: {
            field: 'status',
            type: 'nominal' as const,
            legend: null,
            scale: { domain: ['within tolerance', 'above the warning tolerance', 'above the error tolerance'], range: [PALETTE.green, PALETTE.orange, PALETTE.vermillion] },
          },
        },
      },
      {
        data: { values: rules },
        mark: { type: 'rule' as const, strokeDash: [3, 3], color: '#444' },
        encoding: { x: { field: 'v', type: 'quantitative' as const } },
      },
    ],
  } as TopLevelSpec;
  return { spec, shown: rows.length, total: withResidual.length };
}

const LNK_RIG = 'ln K, rigorous (Cp integrated)';
const LNK_SHORT = 'ln K, constant-ΔrH° shortcut';
const LNK_EXTRA = 'Cp of a species extrapolated here';
const LNK_BAND = '± u(ln K)';

/** Height of the ln K plot area, px. */
export const LNK_HEIGHT = 240;

/** ln K against T for one reaction: rigorous and shortcut routes, the ±u band, extrapolated points marked. */
export function lnKChartSpec(r: ReactionResult): TopLevelSpec | undefined {
  const pts = r.points.filter((p) => Number.isFinite(p.lnK) && Number.isFinite(p.T));
  if (pts.length === 0) return undefined;
  const lines = pts.flatMap((p) => [
    { T: p.T, lnK: p.lnK, series: LNK_RIG },
    ...(Number.isFinite(p.lnKShortcut) ? [{ T: p.T, lnK: p.lnKShortcut, series: LNK_SHORT }] : []),
  ]);
  const band = pts.filter((p) => typeof p.u_lnK === 'number' && Number.isFinite(p.u_lnK) && p.u_lnK > 0).map((p) => ({ T: p.T, lo: p.lnK - p.u_lnK!, hi: p.lnK + p.u_lnK!, series: LNK_BAND }));
  const extra = pts
    .filter((p) => p.extrapolated.length > 0)
    .map((p) => ({ T: p.T, lnK: p.lnK, series: LNK_EXTRA, who: p.extrapolated.map((e) => `${e.species} +${Math.round(e.outsideK)} K`).join(', ') }));
  const color = {
    field: 'series',
    type: 'nominal' as const,
    legend: null,
    scale: { domain: [LNK_RIG, LNK_SHORT, LNK_EXTRA, LNK_BAND], range: [PALETTE.blue, PALETTE.orange, PALETTE.vermillion, PALETTE.sky] },
  };
  const x = { field: 'T', type: 'quantitative' as const, title: 'T (K)', scale: { zero: false } };
  const y = { field: 'lnK', type: 'quantitative' as const, title: 'ln K', scale: { zero: false } };
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    description: `ln K against temperature for reaction ${r.id}`,
    config: CONFIG,
    width: 520,
    height: LNK_HEIGHT,
    layer: [
      ...(band.length
        ? [{ data: { values: band }, mark: { type: 'area' as const, opacity: 0.3 }, encoding: { x, y: { ...y, field: 'lo' }, y2: { field: 'hi' }, color } }]
        : []),
      {
        data: { values: lines },
        mark: { type: 'line' as const, strokeWidth: 2, point: { size: 22 } },
        encoding: {
          x,
          y,
          color,
          strokeDash: { field: 'series', type: 'nominal' as const, legend: null, scale: { domain: [LNK_RIG, LNK_SHORT], range: [[1, 0], [6, 4]] } },
        },
      },
      ...(extra.length
        ? [{ data: { values: extra }, mark: { type: 'point' as const, shape: 'triangle-up', size: 110, filled: true, strokeWidth: 0 }, encoding: { x, y, color } }]
        : []),
    ],
  } as TopLevelSpec;
}

/** One entry of a chart's key: a small fixed SVG swatch (no data in it) and its words. */
export interface KeyEntry {
  swatch: string;
  label: string;
}

const sw = (inner: string): string => `<svg width="26" height="12" viewBox="0 0 26 12" aria-hidden="true">${inner}</svg>`;
const line = (color: string, dash = ''): string => sw(`<line x1="1" y1="6" x2="25" y2="6" stroke="${color}" stroke-width="2.5"${dash ? ` stroke-dasharray="${dash}"` : ''}/>`);
const box = (color: string, opacity = 1): string => sw(`<rect x="4" y="1" width="18" height="10" fill="${color}" fill-opacity="${opacity}"/>`);
const tri = (color: string): string => sw(`<path d="M13 1 L19 11 L7 11 Z" fill="${color}"/>`);

/** The key the page prints under each kind of chart; the same colours and dashes as the specs above (Cp: the window only when one is drawn). */
export function chartKey(kind: 'cp' | 'lnK' | 'gibbs', withWindow = true): KeyEntry[] {
  if (kind === 'cp') {
    return [
      { swatch: line(PALETTE.blue), label: CP_FIT },
      { swatch: line(PALETTE.vermillion, '6 4'), label: CP_EXTRA },
      ...(withWindow ? [{ swatch: box(PALETTE.sky, 0.45), label: WINDOW }] : []),
    ];
  }
  if (kind === 'lnK') {
    return [
      { swatch: line(PALETTE.blue), label: LNK_RIG },
      { swatch: line(PALETTE.orange, '6 4'), label: LNK_SHORT },
      { swatch: box(PALETTE.sky, 0.45), label: LNK_BAND },
      { swatch: tri(PALETTE.vermillion), label: LNK_EXTRA },
    ];
  }
  return [
    { swatch: box(PALETTE.green), label: 'within tolerance' },
    { swatch: box(PALETTE.orange), label: 'above the warning tolerance' },
    { swatch: box(PALETTE.vermillion), label: 'above the error tolerance' },
    { swatch: line('#444', '3 3'), label: 'tolerances' },
  ];
}
