// Helpers for the across-records tests: a CSV through the real ingest path into folded species.
import { SpeciesStore } from '../../pipeline/records.js';
import { loadReference } from '../../pipeline/chemistry/reference.js';
import { normalizeOptions } from '../../pipeline/options.js';
import type { CheckContext, Finding, Species } from '../../pipeline/types.js';
import { readTable } from '../ingest/helpers.js';

export async function speciesOf(csv: string): Promise<{ species: Species[]; path: string; findings: Finding[] }> {
  const { rows, path, findings } = await readTable(csv);
  const store = new SpeciesStore();
  for (const r of rows) findings.push(...store.add(r));
  return { species: store.list(), path, findings };
}

export function contextFor(path: string): CheckContext {
  return { options: normalizeOptions({ tables: [path] }), reference: loadReference() };
}
