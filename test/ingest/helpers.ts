// Helpers for ingest tests: write a table to a temporary file, read it back through the real ingest path.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ingestTable } from '../../pipeline/ingest/table.js';
import type { TableFormat } from '../../pipeline/ingest/events.js';
import type { Finding, SpeciesRow } from '../../pipeline/types.js';

const dir = mkdtempSync(join(tmpdir(), 'thermovet-test-'));
let n = 0;

export function tempFile(content: string | Buffer, ext = 'csv'): string {
  const p = join(dir, `t${++n}.${ext}`);
  writeFileSync(p, content);
  return p;
}

export async function readTable(content: string | Buffer, format: TableFormat = 'csv', opts: { headerMap?: Record<string, string>; units?: Record<string, string> } = {}) {
  const path = tempFile(content, format);
  const rows: SpeciesRow[] = [];
  const findings: Finding[] = [];
  const counts = await ingestTable({ path, format, headerMap: opts.headerMap ?? {}, units: opts.units ?? {} }, (r) => rows.push(r), (f) => findings.push(f));
  return { path, rows, findings, counts };
}
