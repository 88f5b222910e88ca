// The species of a set of tables, through the same ingest path as `check` (streaming readers, unit
// conversion, one record per species and phase), without running the rules over every species.
import { ingestTable } from '../ingest/table.js';
import { SpeciesStore } from '../records.js';
import type { Finding, OptionsNormalized, Species } from '../types.js';

export interface LoadedSpecies {
  species: Species[];
  /** row-level findings raised while reading (rejected rows, conflicting values, …) */
  findings: Finding[];
  rows: number;
  rejected: number;
}

export async function loadSpecies(options: OptionsNormalized): Promise<LoadedSpecies> {
  const { store, ...rest } = await loadStore(options);
  return { species: store.list(), ...rest };
}

/** The same, with the species left in their store (columns; each Species built on request), as check() reads them. */
export async function loadStore(options: OptionsNormalized): Promise<Omit<LoadedSpecies, 'species'> & { store: SpeciesStore }> {
  const store = new SpeciesStore();
  const findings: Finding[] = [];
  let rows = 0;
  let rejected = 0;
  for (const table of options.tables) {
    const counts = await ingestTable(
      { path: table.path, format: table.format, headerMap: options.headerMap, units: options.units },
      (row) => {
        for (const f of store.add(row)) findings.push(f);
      },
      (f) => findings.push(f),
    );
    rows += counts.rows;
    rejected += counts.rejected;
  }
  return { store, findings, rows, rejected };
}
