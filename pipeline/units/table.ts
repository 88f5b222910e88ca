// Every unit thermovet accepts, by dimension, as an affine map to the internal SI unit:
// si = value * factor + offset. Internal units: J/mol, J/(mol K), K, bar.
// The thermochemical calorie is 4.184 J exactly (its definition).

export type Dimension = 'molar-energy' | 'molar-entropy' | 'temperature' | 'pressure' | 'heat-capacity';

export interface UnitDef {
  name: string; // canonical spelling, used in messages
  dimension: Dimension;
  factor: number;
  offset: number;
}

export const CAL_J = 4.184; // thermochemical calorie, exact by definition
export const ATM_BAR = 1.01325; // standard atmosphere, exact: 101325 Pa
export { R_J_PER_MOL_K } from '../cp/constants.js'; // one definition of R for the whole tool

import { R_J_PER_MOL_K } from '../cp/constants.js';

const defs: UnitDef[] = [
  { name: 'J/mol', dimension: 'molar-energy', factor: 1, offset: 0 },
  { name: 'kJ/mol', dimension: 'molar-energy', factor: 1000, offset: 0 },
  { name: 'cal/mol', dimension: 'molar-energy', factor: CAL_J, offset: 0 },
  { name: 'kcal/mol', dimension: 'molar-energy', factor: 1000 * CAL_J, offset: 0 },
  { name: 'J/(mol K)', dimension: 'molar-entropy', factor: 1, offset: 0 },
  { name: 'kJ/(mol K)', dimension: 'molar-entropy', factor: 1000, offset: 0 },
  { name: 'cal/(mol K)', dimension: 'molar-entropy', factor: CAL_J, offset: 0 },
  { name: 'K', dimension: 'temperature', factor: 1, offset: 0 },
  { name: 'degC', dimension: 'temperature', factor: 1, offset: 273.15 },
  { name: 'bar', dimension: 'pressure', factor: 1, offset: 0 },
  { name: 'atm', dimension: 'pressure', factor: ATM_BAR, offset: 0 },
  { name: 'Pa', dimension: 'pressure', factor: 1e-5, offset: 0 },
  { name: 'kPa', dimension: 'pressure', factor: 1e-2, offset: 0 },
  { name: 'MPa', dimension: 'pressure', factor: 10, offset: 0 },
  // heat-capacity units for cp_unit (poly and table coefficients); 'R' means the values are Cp/R
  { name: 'J/(mol K)', dimension: 'heat-capacity', factor: 1, offset: 0 },
  { name: 'cal/(mol K)', dimension: 'heat-capacity', factor: CAL_J, offset: 0 },
  { name: 'R', dimension: 'heat-capacity', factor: R_J_PER_MOL_K, offset: 0 },
];

/** Spellings users write, mapped to the canonical spelling. Keys are normalised by `unitKey`. */
const aliases: Record<string, string> = {
  'j/mol': 'J/mol',
  'kj/mol': 'kJ/mol',
  'cal/mol': 'cal/mol',
  'kcal/mol': 'kcal/mol',
  'j/(molk)': 'J/(mol K)',
  'j/molk': 'J/(mol K)',
  'j/(kmol)': 'J/(mol K)',
  'j/kmol': 'J/(mol K)',
  'j/mol/k': 'J/(mol K)',
  'j/(mol*k)': 'J/(mol K)',
  'j/(mol·k)': 'J/(mol K)',
  'jmol-1k-1': 'J/(mol K)',
  'kj/(molk)': 'kJ/(mol K)',
  'kj/mol/k': 'kJ/(mol K)',
  'cal/(molk)': 'cal/(mol K)',
  'cal/molk': 'cal/(mol K)',
  'cal/mol/k': 'cal/(mol K)',
  'cal/(kmol)': 'cal/(mol K)',
  'cal/(mol*k)': 'cal/(mol K)',
  'cal/(mol·k)': 'cal/(mol K)',
  'eu': 'cal/(mol K)', // the "entropy unit" of older tables
  'k': 'K',
  'kelvin': 'K',
  'degc': 'degC',
  '°c': 'degC',
  'c': 'degC',
  'celsius': 'degC',
  '℃': 'degC',
  'e.u.': 'cal/(mol K)',
  'bar': 'bar',
  'atm': 'atm',
  'pa': 'Pa',
  'kpa': 'kPa',
  'mpa': 'MPa',
  'r': 'R',
  'cp/r': 'R',
};

/** Lower-case and drop whitespace, so `J/(mol K)`, `J/(mol·K)` and `j/mol/k` meet. */
export function unitKey(text: string): string {
  return text.trim().toLowerCase().replace(/\s+/g, '').replace(/⋅/g, '·');
}

const ENERGY: Record<string, string> = { j: 'J', kj: 'kJ', cal: 'cal', kcal: 'kcal' };
const FACTOR = /(kcal|cal|kj|j|mol|k)(-1)?/y;

/**
 * The canonical name of a per-mole energy or entropy written as a product of factors, as tables and
 * papers print them: `kJ mol-1`, `kJ·mol⁻¹`, `J K^-1 mol^-1`, `J/mol·K`, `cal/mol-K`, `J/(K mol)`.
 * Everything after the first `/` is the denominator (`J/mol·K` is J/(mol K), as engineers mean it).
 * Undefined unless it is exactly one of J, kJ, cal, kcal over mol, or over mol and K.
 */
function molarUnit(text: string): string | undefined {
  const t = text.trim().toLowerCase().replace(/⁻¹/g, '-1').replace(/[−–]/g, '-').replace(/\^/g, '').replace(/mole/g, 'mol');
  const slash = t.indexOf('/');
  const parts = slash < 0 ? [[t, 1]] as const : ([[t.slice(0, slash), 1], [t.slice(slash + 1).replace(/\//g, ' '), -1]] as const);
  const powers = new Map<string, number>();
  for (const [part, side] of parts) {
    // separators between factors; a hyphen joins factors only between letters (mol-K), never before 1
    const p = part.replace(/[\s·.*()]+/g, '').replace(/([a-z])-(?=[a-z])/g, '$1');
    FACTOR.lastIndex = 0;
    while (FACTOR.lastIndex < p.length) {
      const m = FACTOR.exec(p);
      if (!m) return undefined;
      const power = side * (m[2] ? -1 : 1);
      powers.set(m[1]!, (powers.get(m[1]!) ?? 0) + power);
    }
  }
  const energies = [...powers].filter(([f]) => f in ENERGY);
  if (energies.length !== 1 || energies[0]![1] !== 1 || powers.get('mol') !== -1) return undefined;
  const kelvin = powers.get('k') ?? 0;
  if (kelvin !== 0 && kelvin !== -1) return undefined;
  if (powers.size !== (kelvin ? 3 : 2)) return undefined;
  return `${ENERGY[energies[0]![0]]}/${kelvin ? '(mol K)' : 'mol'}`;
}

/** Find a unit of the given dimension by any accepted spelling; undefined when unknown or of another dimension. */
export function findUnit(text: string, dimension: Dimension): UnitDef | undefined {
  const canonical = aliases[unitKey(text)] ?? molarUnit(text);
  if (canonical === undefined) return undefined;
  return defs.find((d) => d.name === canonical && d.dimension === dimension);
}

/** The canonical spellings accepted for a dimension, for error messages. */
export function unitsOf(dimension: Dimension): string[] {
  return defs.filter((d) => d.dimension === dimension).map((d) => d.name);
}

export function unitByName(name: string, dimension: Dimension): UnitDef {
  const d = defs.find((u) => u.name === name && u.dimension === dimension);
  if (!d) throw new Error(`internal: no unit ${name} of ${dimension}`);
  return d;
}
