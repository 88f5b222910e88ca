// Conversions between the internal SI units and the unit a column was declared in.
import { unitByName, type Dimension } from './table.js';
import { COLUMN_BY_NAME } from '../ingest/columns.js';

/** SI value -> the declared unit of canonical column `field` (unit name as recorded on ingest). */
export function toDeclared(valueSI: number, field: string, unitName: string | undefined): number {
  const dim: Dimension | undefined = COLUMN_BY_NAME.get(field)?.dimension;
  if (!dim || !unitName) return valueSI;
  const u = unitByName(unitName, dim);
  return (valueSI - u.offset) / u.factor;
}

/** Declared-unit value -> SI. */
export function fromDeclared(value: number, field: string, unitName: string | undefined): number {
  const dim: Dimension | undefined = COLUMN_BY_NAME.get(field)?.dimension;
  if (!dim || !unitName) return value;
  const u = unitByName(unitName, dim);
  return value * u.factor + u.offset;
}
