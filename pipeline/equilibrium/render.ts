// The ln K table as text, CSV or JSON. Pure: results in, a string out.
import { inert } from '../../reports/terminal.js';
import { formatNumber } from '../rules/finding.js';
import type { Finding, ReactionResult } from '../types.js';
import type { EquilibriumPoint } from './lnk.js';

export type LnkFormat = 'text' | 'csv' | 'json';

export const CAUTION =
  'Screening values only: they follow from the data as given. A qualified engineer reviews them before design use; local codes and licensed practice govern.';

function fixed(v: number | undefined, digits: number): string {
  if (v === undefined || !Number.isFinite(v)) return '-';
  const s = v.toFixed(digits);
  return s === `-${(0).toFixed(digits)}` ? (0).toFixed(digits) : s;
}

function notes(p: EquilibriumPoint): string {
  const n = p.extrapolated.map((e) => `${e.species} Cp extrapolated ${formatNumber(Number(e.outsideK.toPrecision(4)))} K (${formatNumber(Number(e.cp.toPrecision(4)))} J/(mol K))`);
  if (p.cpMissing?.length) n.push(`no Cp for ${p.cpMissing.join(', ')}: ΔrCp = 0`);
  return n.join('; ');
}

const LN10 = Math.log(10);

function renderText(results: readonly ReactionResult[]): string {
  const out: string[] = [];
  const head = ['T/K', 'ΔrH°/kJ/mol', 'ΔrS°/J/(mol K)', 'ΔrG°/kJ/mol', 'ln K', 'log10 K', 'ln K (ΔrH° const)', 'difference', 'u(ln K)'];
  for (const r of results) {
    out.push(`${inert(r.id)}: ${inert(r.equation)}   (${inert(r.file)}:${r.line})`);
    if (!r.balanced || r.points.length === 0) {
      out.push('  not computed (see the findings)', '');
      continue;
    }
    const rows = (r.points as EquilibriumPoint[]).map((p) => [
      fixed(p.T, 2),
      fixed(p.dH, 3),
      fixed(p.dS, 3),
      fixed(p.dG, 3),
      fixed(p.lnK, 4),
      fixed(p.lnK / LN10, 4),
      fixed(p.lnKShortcut, 4),
      fixed(p.lnK - p.lnKShortcut, 4),
      fixed(p.u_lnK, 4),
      notes(p),
    ]);
    const width = head.map((h, i) => Math.max(h.length, ...rows.map((row) => row[i]!.length)));
    const line = (cells: string[]): string => '  ' + cells.map((c, i) => (i < head.length ? c.padStart(width[i]!) : c)).join('  ').trimEnd();
    out.push(line(head));
    for (const row of rows) out.push(line(row));
    if (r.uncertaintyRanking?.length) {
      out.push(`  u(ln K)² shares at its largest: ${r.uncertaintyRanking.map((s) => `${inert(s.species)} ${(100 * s.share).toFixed(1)} %`).join(', ')}`);
    }
    out.push('');
  }
  out.push(CAUTION);
  return out.join('\n') + '\n';
}

function csvCell(v: string | number | undefined): string {
  if (v === undefined) return '';
  const s = typeof v === 'number' ? String(v) : v;
  // a leading = + - @ would be read as a formula by spreadsheets; quote and prefix text that starts so
  const safe = typeof v === 'string' && /^[=+\-@\t\r]/.test(s) ? `'${s}` : s;
  return /[",\n\r]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

function renderCsv(results: readonly ReactionResult[]): string {
  const lines = ['reaction,equation,T_K,dH_kJmol,dS_JmolK,dG_kJmol,lnK,log10K,lnK_shortcut,lnK_minus_shortcut,u_lnK,extrapolated,cp_missing'];
  for (const r of results) {
    for (const p of r.points as EquilibriumPoint[]) {
      lines.push(
        [
          csvCell(r.id),
          csvCell(r.equation),
          p.T,
          p.dH,
          p.dS,
          p.dG,
          p.lnK,
          p.lnK / LN10,
          p.lnKShortcut,
          p.lnK - p.lnKShortcut,
          p.u_lnK,
          csvCell(p.extrapolated.map((e) => `${e.species}:${Number(e.outsideK.toPrecision(6))}`).join(' ')),
          csvCell((p.cpMissing ?? []).join(' ')),
        ]
          .map((c) => (typeof c === 'number' ? String(c) : (c ?? '')))
          .join(','),
      );
    }
  }
  return lines.join('\n') + '\n';
}

export function renderLnk(results: readonly ReactionResult[], format: LnkFormat, extra: { version: string; findings: readonly Finding[] }): string {
  if (format === 'csv') return renderCsv(results);
  if (format === 'json') {
    return JSON.stringify({ tool: { name: 'thermovet', version: extra.version }, caution: CAUTION, reactions: results, findings: extra.findings }, null, 2) + '\n';
  }
  return renderText(results);
}
