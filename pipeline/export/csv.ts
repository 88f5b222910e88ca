// The canonical CSV: fixed columns with their units in brackets, numbers written as numbers, text cells
// quoted when needed and neutralised against spreadsheet formula injection.
import { R_J_PER_MOL_K } from '../cp/constants.js';
import type { SpeciesRow } from '../types.js';

/**
 * The columns, in order. Energies in kJ/mol (an SI multiple, the unit of the published tables and the
 * default of every reader of this format), entropies and Cp in J/(mol K), temperatures in K, pressure in bar.
 */
export const EXPORT_COLUMNS = [
  'species',
  'formula',
  'phase',
  'dHf [kJ/mol]',
  'dGf [kJ/mol]',
  'S [J/(mol K)]',
  'u_dHf [kJ/mol]',
  'u_dGf [kJ/mol]',
  'u_S [J/(mol K)]',
  'P_ref [bar]',
  'cp_model',
  'cp_exponents',
  'cp_unit',
  'cp_coeffs',
  'cp_T [K]',
  'cp_Tmin [K]',
  'cp_Tmax [K]',
  'source',
] as const;

/** Characters that make a spreadsheet read a cell as a formula (OWASP "CSV injection" list). */
const FORMULA_START = /^[=+\-@\t\r]/;

/**
 * A text cell as written: a cell a spreadsheet would take for a formula gets a leading apostrophe (the
 * spreadsheet convention for "this is text") and is quoted; `first` also protects a leading `#`, which
 * CSV readers (thermovet's included) take for a comment line. Cells with a delimiter, quote or line
 * break are quoted with quotes doubled (RFC 4180).
 */
export function textCell(text: string, first = false): string {
  let t = text;
  let quote = false;
  if (FORMULA_START.test(t) || (first && t.startsWith('#'))) {
    t = `'${t}`;
    quote = true;
  } else if (t.startsWith("'")) quote = true; // already protected (an exported file exported again): written the same way
  if (/[",\r\n]/.test(t)) quote = true;
  return quote ? `"${t.replace(/"/g, '""')}"` : t;
}

/**
 * 10 significant digits: more than any published table or correlation carries (NASA polynomials are
 * printed with 9), and it hides the round-off of unit conversion (−241.826000000001 from kcal/mol).
 */
export function numberCell(v: number | undefined): string {
  if (v === undefined) return '';
  return String(Number(v.toPrecision(10)));
}

const listCell = (vs: readonly number[] | undefined): string => (vs ? vs.map((v) => numberCell(v)).join(' ') : '');
const kJ = (J: number | undefined): number | undefined => (J === undefined ? undefined : J / 1000);

/**
 * One accepted row in the canonical columns. Values arrive in SI (ingest converted them); `poly` and
 * `table` Cp coefficients are brought to J/(mol K) (cp_unit written as such), other models keep their
 * published native form.
 */
export function rowCells(row: SpeciesRow): string[] {
  const v = row.values;
  const cp = row.cp;
  const scaled = cp && (cp.model === 'poly' || cp.model === 'table');
  const phase = row.state ? `${row.phase} ${row.state}` : row.phase;
  return [
    textCell(row.species, true),
    textCell(row.formulaText),
    textCell(phase),
    numberCell(kJ(v.dHf)),
    numberCell(kJ(v.dGf)),
    numberCell(v.S),
    numberCell(kJ(v.u_dHf)),
    numberCell(kJ(v.u_dGf)),
    numberCell(v.u_S),
    numberCell(v.P_ref),
    cp ? textCell(cp.model) : '',
    listCell(cp?.exponents),
    scaled ? 'J/(mol K)' : '',
    cp ? listCell(scaled ? cp.coeffs.map((c) => c * cp.unitFactor) : cp.coeffs) : '',
    listCell(cp?.temps),
    numberCell(cp?.Tmin),
    numberCell(cp?.Tmax),
    textCell(v.source),
  ];
}

export const headerLine = (): string => EXPORT_COLUMNS.map((c) => textCell(c)).join(',');

/** R used when a Cp/R correlation is brought to J/(mol K), for the provenance header. */
export const R_USED = R_J_PER_MOL_K;
