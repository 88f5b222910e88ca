// Resolve a table's header: which canonical column each position holds, and in which unit.
import { InputError, excerpt } from '../errors.js';
import { findUnit, unitsOf, type UnitDef } from '../units/table.js';
import { COLUMNS, canonicalColumn, type ColumnDef } from './columns.js';

export interface ColumnSlot {
  def: ColumnDef;
  index: number; // 0-based position in the row
  unit?: UnitDef; // numbers with a dimension
  header: string; // the header as the user wrote it
}

export interface HeaderLayout {
  slots: ColumnSlot[];
  byName: Map<string, ColumnSlot>;
  width: number;
  ignored: { header: string; index: number }[];
}

const BRACKET = /^(.*?)\s*\[([^\]]*)\]\s*$/;

/**
 * @param headerMap user header -> canonical column (from the manifest), matched before the canonical names
 * @param units canonical column -> unit (from the manifest); a bracketed unit in the header wins over it
 */
export function resolveHeader(
  cells: string[],
  file: string,
  line: number,
  headerMap: Record<string, string>,
  units: Record<string, string>,
  requireIdentity = true,
): HeaderLayout {
  const slots: ColumnSlot[] = [];
  const byName = new Map<string, ColumnSlot>();
  const ignored: { header: string; index: number }[] = [];
  const mapLower = new Map(Object.entries(headerMap).map(([k, v]) => [k.trim().toLowerCase(), v]));

  cells.forEach((raw, index) => {
    const header = raw.trim();
    const m = BRACKET.exec(header);
    const bare = m ? m[1]! : header;
    const bracketUnit = m ? m[2]!.trim() : undefined;
    const mapped = mapLower.get(header.toLowerCase()) ?? mapLower.get(bare.toLowerCase());
    const def = canonicalColumn(mapped ?? bare);
    if (!def && !m && mapped === undefined && header.includes('[')) {
      // "dHf [kJ]/mol]", "dHf [kJ/mol] x": a known column whose unit is mangled is not an unknown column to ignore
      const named = canonicalColumn(header.slice(0, header.indexOf('[')).trim());
      if (named) {
        throw new InputError('unknown-unit', `header "${excerpt(header)}" names column ${named.name}, but its unit cannot be read: write it in one pair of brackets at the end, e.g. "${named.name} [${named.defaultUnit ?? 'unit'}]"`, { file, line, field: header });
      }
    }
    if (!def) {
      if (mapped !== undefined) {
        throw new InputError('unknown-column', `the manifest maps header "${excerpt(header)}" to "${excerpt(mapped)}", which is not a column thermovet knows (known: ${COLUMNS.map((c) => c.name).join(', ')})`, { file, line, field: header });
      }
      ignored.push({ header, index });
      return;
    }
    if (byName.has(def.name)) {
      throw new InputError('duplicate-column', `column "${def.name}" appears twice in the header (positions ${byName.get(def.name)!.index + 1} and ${index + 1})`, { file, line, field: header });
    }
    const unitText = bracketUnit ?? units[def.name] ?? def.defaultUnit;
    let unit: UnitDef | undefined;
    if (def.dimension) {
      unit = findUnit(unitText ?? '', def.dimension);
      if (!unit) {
        throw new InputError('unknown-unit', `unknown unit "${excerpt(unitText ?? '')}" for column ${def.name}; accepted: ${unitsOf(def.dimension).join(', ')}`, { file, line, field: header });
      }
    } else if (bracketUnit !== undefined && bracketUnit !== '') {
      throw new InputError('unknown-unit', `column ${def.name} takes no unit, but the header declares "${excerpt(bracketUnit)}"`, { file, line, field: header });
    }
    const slot: ColumnSlot = { def, index, unit, header };
    slots.push(slot);
    byName.set(def.name, slot);
  });

  if (!requireIdentity) return { slots, byName, width: cells.length, ignored };
  if (!byName.has('species') && !byName.has('formula')) {
    throw new InputError('missing-column', 'the header has neither a "species" nor a "formula" column', { file, line });
  }
  if (!byName.has('phase')) {
    throw new InputError('missing-column', 'the header has no "phase" column (g, l, cr or aq)', { file, line });
  }
  return { slots, byName, width: cells.length, ignored };
}
