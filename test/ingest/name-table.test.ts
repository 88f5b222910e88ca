// The species store's name table must behave exactly like JavaScript strings in a Map: the same
// identity, the same text back, and the same order as `<` (UTF-16 code units), including names with
// characters beyond the Basic Multilingual Plane, lone surrogates and very long names.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { NameTable } from '../../pipeline/name-table.js';

const order = (a: string, b: string): number => (a < b ? -1 : a > b ? 1 : 0);

describe('name table', () => {
  it('gives each distinct name one id, finds it again, and returns its text unchanged', () => {
    const t = new NameTable();
    const names = ['CO2', 'H2O', 'CO2 ', 'co2', '', 'Δ-phase', 'n-butane', '\ud83d\udd25 fire', '\ud800lone', 'x'.repeat(10_000)];
    const ids = names.map((n) => t.id(n));
    expect(new Set(ids).size).toBe(names.length);
    expect(names.map((n) => t.id(n))).toEqual(ids); // again: the same ids
    expect(names.map((n) => t.find(n))).toEqual(ids);
    expect(ids.map((id) => t.name(id))).toEqual(names);
    expect(t.find('CO')).toBe(-1);
    expect(t.size).toBe(names.length);
  });

  it('keeps finding every name as it grows past its initial pool and index (10^5 names)', () => {
    const t = new NameTable();
    const n = 100_000;
    for (let i = 0; i < n; i++) expect(t.id(`species ${i}`)).toBe(i);
    for (let i = 0; i < n; i += 997) expect(t.find(`species ${i}`)).toBe(i);
    expect(t.name(n - 1)).toBe(`species ${n - 1}`);
  });

  it('orders names as < orders the strings (UTF-16 code units), for any strings', () => {
    // U+E000–U+FFFF sorts after a surrogate pair under code units, before it under code points
    const t = new NameTable();
    const a = t.id('\uffe0');
    const b = t.id('\ud83d\ude00');
    expect(Math.sign(t.compare(a, b))).toBe(order('\uffe0', '\ud83d\ude00'));
    fc.assert(
      fc.property(fc.string({ unit: 'binary' }), fc.string({ unit: 'binary' }), (x, y) => {
        const table = new NameTable();
        expect(Math.sign(table.compare(table.id(x), table.id(y)))).toBe(order(x, y));
      }),
      { numRuns: 2000 },
    );
  });
});
