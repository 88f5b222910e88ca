// The finding store keeps findings compactly and makes them again when read: what comes out must be
// what went in, for any finding, and its order after sort() must be compareFindings' order.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compareFindings, summarize } from '../../pipeline/check.js';
import { FindingStore } from '../../pipeline/finding-store.js';
import { makeFinding } from '../../pipeline/rules/finding.js';
import type { Finding, Rule } from '../../pipeline/types.js';

const ruleA: Rule = {
  id: 'store-test-a',
  severity: 'error',
  docs: 'none',
  description: 'test rule A',
  messages: { one: '{species} has {value} {unit} at {T} K', two: 'nothing to fill', three: 'left {missing} alone, {x}' },
};
const ruleB: Rule = { id: 'store-test-b', severity: 'warning', docs: 'none', description: 'test rule B', messages: { one: 'B says {x} and {y}' } };

const text = fc.oneof(fc.string(), fc.string({ unit: 'binary' }), fc.constantFrom('', 'ΔfG° − T·S°', 'kJ/mol', '"quoted"\n\\', '\ud800 lone'));
const num = fc.oneof(fc.double(), fc.constantFrom(0, -0, NaN, Infinity, -Infinity, 1e-300, 5e-324, 2 ** 53, 0.1 + 0.2));
const params = fc.dictionary(fc.oneof(fc.constantFrom('species', 'value', 'unit', 'T', 'x', 'y', '0', '12'), fc.string({ maxLength: 4 })), fc.oneof(text, num), { maxKeys: 5 });
const location = fc.record(
  {
    file: fc.constantFrom('a.csv', 'b.csv', 'dir/Ä.tsv', ''),
    // lines and columns as tables give them, and a few the store's 32-bit columns cannot hold
    line: fc.oneof(fc.integer({ min: 0, max: 30 }), fc.constantFrom(2.5, 2 ** 40, -0)),
    column: fc.oneof(fc.integer({ min: 0, max: 3 }), fc.constantFrom(1.5, 2 ** 33)),
    field: fc.constantFrom('dHf', 'S', 'cp_coeffs'),
  },
  { requiredKeys: ['file', 'line'] },
);
const extras = fc.record(
  {
    species: text,
    phase: fc.constantFrom('g', 'l', 'cr', 'aq', 'odd phase'),
    diagnosis: fc.record({ cause: fc.constantFrom('sign', 'kJ-read-as-J'), field: fc.constantFrom('dHf', 'S'), corrected: fc.double(), unit: fc.constant('kJ/mol'), residualAfter: fc.double() }),
    impact: fc.array(fc.record({ reaction: text, maxAbsDeltaLnK: fc.double({ min: 0, max: 50, noNaN: true }), T_K: fc.integer({ min: 300, max: 2000 }) }), { maxLength: 3 }),
    waived: fc.record({ by: text, reason: text, expires: fc.constant('2030-01-01') }),
  },
  { requiredKeys: [] },
);

/** A finding as a rule makes it, or one made by hand whose message is not its template filled in. */
const findingArb: fc.Arbitrary<Finding> = fc
  .tuple(fc.constantFrom<[Rule, string]>([ruleA, 'one'], [ruleA, 'two'], [ruleA, 'three'], [ruleB, 'one']), params, location, extras, fc.option(text, { nil: undefined }), fc.constantFrom<Finding['severity'] | undefined>(undefined, 'info'))
  .map(([[rule, id], p, loc, x, handMessage, severity]) => {
    const f = makeFinding(rule, id, p, loc, { ...(x.species !== undefined ? { species: x.species } : {}), ...(x.phase !== undefined ? { phase: x.phase } : {}), ...(x.diagnosis ? { diagnosis: x.diagnosis } : {}), ...(severity ? { severity } : {}) });
    if (x.impact) f.impact = x.impact;
    if (x.waived) f.waived = x.waived;
    if (handMessage !== undefined) f.message = handMessage;
    return f;
  });

function stored(findings: readonly Finding[]): FindingStore {
  const store = new FindingStore();
  for (const f of findings) store.add(f);
  return store;
}

describe('finding store', () => {
  it('gives back every finding as it was added: params, message, location, species, phase, diagnosis, impact, waiver', () => {
    fc.assert(
      fc.property(fc.array(findingArb, { maxLength: 40 }), (findings) => {
        const store = stored(findings);
        expect(store.length).toBe(findings.length);
        expect(summarize(0, 0, 0, 0, store.severities())).toEqual(summarize(0, 0, 0, 0, findings));
        findings.forEach((f, i) => {
          const back = store.at(i);
          expect(Object.getPrototypeOf(back)).toBe(Object.prototype);
          expect(back).toEqual(f);
          for (const [k, v] of Object.entries(f.params)) expect(Object.is(back.params[k], v)).toBe(true); // −0, NaN, ±Infinity kept
        });
      }),
      { numRuns: 300 },
    );
  });

  it('sorts as compareFindings sorts an array (a stable sort)', () => {
    fc.assert(
      fc.property(fc.array(findingArb, { maxLength: 60 }), (findings) => {
        const store = stored(findings);
        store.sort();
        expect([...store]).toEqual([...findings].sort(compareFindings));
      }),
      { numRuns: 300 },
    );
  });

  it('keeps each message when two rules share an id but not their templates', () => {
    const early = makeFinding(ruleB, 'one', { x: 1, y: 'a' }, { file: 'f.csv', line: 2 });
    const impostor: Rule = { ...ruleB, messages: { one: 'other words for {x}' } };
    const late = makeFinding(impostor, 'one', { x: 2, y: 'b' }, { file: 'f.csv', line: 3 });
    const store = stored([early, late]);
    expect(store.at(0).message).toBe('B says 1 and a');
    expect(store.at(1).message).toBe('other words for 2');
  });

  it('reads rule and species key without making the finding, and takes impacts by position', () => {
    const store = stored([makeFinding(ruleA, 'two', {}, { file: 'z.csv', line: 9 }, { species: 'CO2', phase: 'g' }), makeFinding(ruleB, 'one', { x: 1, y: 2 }, { file: 'a.csv', line: 1 })]);
    store.sort();
    expect(store.rule(0)).toBe('store-test-b');
    expect(store.speciesKey(0)).toBeUndefined();
    expect(store.speciesKey(1)).toBe('CO2|g');
    store.setImpact(1, [{ reaction: 'R1', maxAbsDeltaLnK: 2.5, T_K: 800 }]);
    expect(store.at(1).impact).toEqual([{ reaction: 'R1', maxAbsDeltaLnK: 2.5, T_K: 800 }]);
    expect(store.at(0).impact).toBeUndefined();
  });
});
