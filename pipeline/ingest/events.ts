// What a table reader hands on: the header once, then rows (or rows it could not read), each with its line.

export type TableEvent =
  | { type: 'header'; cells: string[]; line: number }
  | { type: 'row'; cells: readonly (string | undefined)[]; line: number }
  | { type: 'unreadable'; line: number; messageId: 'ragged' | 'raggedLong' | 'json' | 'notObject' | 'type'; params: Record<string, string | number>; column?: number; field?: string };

export type TableSink = (event: TableEvent) => void;

export type TableFormat = 'csv' | 'tsv' | 'json' | 'ndjson';

/** Format from the file extension; undefined when the extension says nothing. */
export function formatFromPath(path: string): TableFormat | undefined {
  const m = /\.([a-z0-9]+)$/i.exec(path);
  const ext = m?.[1]?.toLowerCase();
  if (ext === 'csv' || ext === 'txt') return 'csv';
  if (ext === 'tsv' || ext === 'tab') return 'tsv';
  if (ext === 'json') return 'json';
  if (ext === 'ndjson' || ext === 'jsonl') return 'ndjson';
  return undefined;
}

/** Limits that keep hostile input from exhausting memory (documented in docs/limits.md). */
export const LIMITS = {
  maxRecordChars: 1_000_000, // one CSV record, one NDJSON line, or one JSON record
  maxColumns: 1_000,
  maxJsonBytes: 512 * 1024 * 1024, // a JSON array file is parsed whole; larger inputs should be NDJSON or CSV
  maxJsonDepth: 64,
};
