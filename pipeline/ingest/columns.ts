// The canonical columns of a property table: what each holds, and in which unit when none is declared.
import type { Dimension } from '../units/table.js';

export type ColumnKind = 'text' | 'number' | 'list';

export interface ColumnDef {
  name: string;
  kind: ColumnKind;
  dimension?: Dimension; // numbers (and lists of temperatures) that carry a unit
  defaultUnit?: string;
  description: string;
}

export const COLUMNS: readonly ColumnDef[] = [
  { name: 'species', kind: 'text', description: 'identifier, unique per phase' },
  { name: 'formula', kind: 'text', description: 'chemical formula; may be omitted when species is a formula' },
  { name: 'phase', kind: 'text', description: 'g, l, cr or aq' },
  { name: 'dHf', kind: 'number', dimension: 'molar-energy', defaultUnit: 'kJ/mol', description: 'ΔfH° at 298.15 K' },
  { name: 'dGf', kind: 'number', dimension: 'molar-energy', defaultUnit: 'kJ/mol', description: 'ΔfG° at 298.15 K' },
  { name: 'S', kind: 'number', dimension: 'molar-entropy', defaultUnit: 'J/(mol K)', description: 'S° at 298.15 K' },
  { name: 'u_dHf', kind: 'number', dimension: 'molar-energy', defaultUnit: 'kJ/mol', description: 'standard uncertainty of dHf' },
  { name: 'u_dGf', kind: 'number', dimension: 'molar-energy', defaultUnit: 'kJ/mol', description: 'standard uncertainty of dGf' },
  { name: 'u_S', kind: 'number', dimension: 'molar-entropy', defaultUnit: 'J/(mol K)', description: 'standard uncertainty of S' },
  { name: 'cp_model', kind: 'text', description: 'poly, shomate, nasa7, nasa9 or table' },
  { name: 'cp_exponents', kind: 'list', description: 'poly: the powers of T, space-separated' },
  { name: 'cp_unit', kind: 'text', description: 'poly and table: J/(mol K), cal/(mol K) or R (Cp/R)' },
  { name: 'cp_coeffs', kind: 'list', description: "coefficients in the model's published order (table: Cp values)" },
  { name: 'cp_T', kind: 'list', dimension: 'temperature', defaultUnit: 'K', description: 'table: the temperatures of the Cp values' },
  { name: 'cp_Tmin', kind: 'number', dimension: 'temperature', defaultUnit: 'K', description: 'lower end of the validity range' },
  { name: 'cp_Tmax', kind: 'number', dimension: 'temperature', defaultUnit: 'K', description: 'upper end of the validity range' },
  { name: 'P_ref', kind: 'number', dimension: 'pressure', defaultUnit: 'bar', description: 'standard-state pressure' },
  { name: 'source', kind: 'text', description: "citation of the row's values" },
];

export const COLUMN_BY_NAME: ReadonlyMap<string, ColumnDef> = new Map(COLUMNS.map((c) => [c.name, c]));
const BY_LOWER = new Map(COLUMNS.map((c) => [c.name.toLowerCase(), c]));

/** Canonical column for a header name (case-insensitive), or undefined. */
export function canonicalColumn(name: string): ColumnDef | undefined {
  return BY_LOWER.get(name.trim().toLowerCase());
}
