// One table file from bytes to SpeciesRows: pick the reader, resolve the header, read every row.
import { makeFinding } from '../rules/finding.js';
import { rule as unknownColumn } from '../rules/unknown-column.js';
import { rule as unreadableRow } from '../rules/unreadable-row.js';
import { InputError } from '../errors.js';
import type { Finding, SpeciesRow } from '../types.js';
import { readDelimited } from './csv.js';
import type { TableEvent, TableFormat } from './events.js';
import { resolveHeader } from './header.js';
import { readJsonArray, readNdjson } from './json.js';
import { normalizeRow, rowContext, type RowContext } from './row.js';

export interface TableCounts {
  rows: number;
  accepted: number;
  rejected: number;
}

export interface TableInput {
  path: string;
  format: TableFormat;
  headerMap: Record<string, string>;
  units: Record<string, string>;
}

/** Reads one table; every data row ends up either in `onRow` (accepted) or as findings (rejected). */
export async function ingestTable(
  table: TableInput,
  onRow: (row: SpeciesRow) => void,
  onFinding: (f: Finding) => void,
): Promise<TableCounts> {
  const counts: TableCounts = { rows: 0, accepted: 0, rejected: 0 };
  const file = table.path;
  let ctx: RowContext | undefined;
  const reported = new Set<string>();
  const positional = table.format === 'csv' || table.format === 'tsv';
  let headerLine: number | undefined;
  const sink = (ev: TableEvent): void => {
    if (ev.type === 'header') {
      if (ev.cells.length === 0) return;
      headerLine ??= ev.line;
      // JSON records name their own keys, so a record without `phase` is that row's problem, not the file's
      const layout = resolveHeader(ev.cells, file, ev.line, table.headerMap, table.units, positional);
      for (const ig of layout.ignored) {
        if (reported.has(ig.header)) continue;
        reported.add(ig.header);
        onFinding(makeFinding(unknownColumn, 'ignored', { header: ig.header }, positional ? { file, line: ev.line, column: ig.index + 1 } : { file, line: ev.line }));
      }
      ctx = rowContext(file, layout, positional);
      return;
    }
    counts.rows++;
    if (ev.type === 'unreadable') {
      counts.rejected++;
      const where = { file, line: ev.line, ...(ev.column !== undefined ? { column: ev.column } : {}), ...(ev.field !== undefined ? { field: ev.field } : {}) };
      onFinding(makeFinding(unreadableRow, ev.messageId, ev.params, where));
      return;
    }
    ctx ??= rowContext(file, resolveHeader([], file, ev.line, table.headerMap, table.units, false), positional);
    const result = normalizeRow(ev.cells, ev.line, ctx);
    if (result.row) {
      counts.accepted++;
      onRow(result.row);
    } else {
      counts.rejected++;
      for (const f of result.findings) onFinding(f);
    }
  };
  try {
    if (table.format === 'csv' || table.format === 'tsv') await readDelimited(file, table.format === 'csv' ? ',' : '\t', sink);
    else if (table.format === 'json') await readJsonArray(file, sink);
    else await readNdjson(file, sink);
  } catch (e) {
    if (e instanceof InputError && e.file === undefined) throw new InputError(e.code, e.message, { file, line: e.line, field: e.field });
    throw e;
  }
  if (counts.rows === 0) {
    // a table cut down to its header (or an empty JSON array) must not pass as a clean table
    const what = positional ? 'the table has a header but no data rows' : 'the table holds no records';
    throw new InputError('no-rows', `${what}; there is nothing to check`, { file, line: headerLine ?? 1 });
  }
  return counts;
}
