import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseFormula, splitPhaseSuffix } from '../../pipeline/chemistry/formula.js';
import {
  ReferenceDataError,
  elementEntropySum,
  elementOf,
  isReferenceState,
  loadReference,
} from '../../pipeline/chemistry/reference.js';
import { packageRoot } from '../../pipeline/paths.js';

const T = 298.15; // K
const ref = loadReference();

const CODATA = 'CODATA Key Values for Thermodynamics (Cox, Wagman, Medvedev 1989)';
const NBS = 'NBS Tables of Chemical Thermodynamic Properties (Wagman et al. 1982, J. Phys. Chem. Ref. Data 11 Suppl. 2)';

/** Gibbs–Helmholtz residual ΔfG° − (ΔfH° − T·ΔfS°) in kJ/mol, from kJ/mol and J/(mol K) inputs. */
function residualKJ(text: string, dHf_kJ: number, dGf_kJ: number, S_JmolK: number, phase?: string): number {
  const elS = elementEntropySum(parseFormula(text), ref, phase);
  if (elS === undefined) throw new Error(`no reference entropy for ${text}`);
  return dGf_kJ - (dHf_kJ - (T * (S_JmolK - elS)) / 1000);
}

describe('loadReference', () => {
  it('loads the shipped file and records its sha256', () => {
    const path = join(packageRoot(), 'datasets', 'reference', 'elements.json');
    expect(ref.path).toBe(path);
    expect(ref.sha256).toBe(createHash('sha256').update(readFileSync(path)).digest('hex'));
    expect(ref.sha256).toMatch(/^[0-9a-f]{64}$/);
  });

  it('covers the elements engineers need most', () => {
    const required = 'H He Li Be B C N O F Ne Na Mg Al Si P S Cl Ar K Ca Ti Cr Mn Fe Co Ni Cu Zn Br Kr Ag I Xe Hg Pb Ba Sn'.split(' ');
    for (const el of required) {
      const e = ref.elements[el];
      expect(e, el).toBeDefined();
      expect(e.source.length, el).toBeGreaterThan(10);
      expect(['published (checked against the source)', 'from memory'], el).toContain(e.provenance);
    }
  });

  it('has the conventional reference species', () => {
    const want: [string, string, number, string, string][] = [
      ['H', 'H2', 2, 'g', 'gas'],
      ['N', 'N2', 2, 'g', 'gas'],
      ['O', 'O2', 2, 'g', 'gas'],
      ['F', 'F2', 2, 'g', 'gas'],
      ['Cl', 'Cl2', 2, 'g', 'gas'],
      ['Br', 'Br2', 2, 'l', 'liquid'],
      ['I', 'I2', 2, 'cr', 'crystal'],
      ['Hg', 'Hg', 1, 'l', 'liquid'],
      ['C', 'C', 1, 'cr', 'graphite'],
      ['S', 'S', 1, 'cr', 'rhombic'],
      ['P', 'P', 1, 'cr', 'white'],
      ['Sn', 'Sn', 1, 'cr', 'white'],
      ['Ar', 'Ar', 1, 'g', 'gas'],
      ['Fe', 'Fe', 1, 'cr', 'alpha'],
    ];
    for (const [el, formula, atoms, phase, state] of want) {
      expect(ref.elements[el], el).toMatchObject({ formula, atoms, phase, state });
    }
  });

  it('carries the published entropies, on the 1 bar basis', () => {
    // J/(mol K) at 298.15 K, 1 bar; each checked against the source (CODATA 1989)
    const published: [string, number][] = [
      ['H', 130.68], // H2(g), CODATA 1989
      ['O', 205.152], // O2(g), CODATA 1989
      ['N', 191.609], // N2(g), CODATA 1989
      ['C', 5.74], // graphite, CODATA 1989
      ['S', 32.054], // rhombic, CODATA 1989
      ['Cl', 223.081], // Cl2(g), CODATA 1989
      ['Ar', 154.846], // CODATA 1989
      ['P', 41.09], // white P, CODATA 1989
      ['Al', 28.3], // CODATA 1989
      ['Si', 18.81], // CODATA 1989
      ['Na', 51.3], // CODATA 1989
      ['Zn', 41.63], // CODATA 1989
      ['B', 5.9], // CODATA 1989
    ];
    for (const [el, S] of published) {
      expect(ref.elements[el].S, el).toBe(S);
      expect(ref.elements[el].source, el).toBe(CODATA);
      expect(ref.elements[el].provenance, el).toBe('published (checked against the source)');
    }
    // O2 on the 1 atm basis would be lower by R ln(1.01325) = 0.109 J/(mol K) (fact of the trade)
    expect(Math.abs(ref.elements.O.S - (205.152 - 0.109))).toBeGreaterThan(0.1);
    expect(ref.elements.Fe.source).toBe(NBS); // Fe 27.28, NBS 1982, from memory
    expect(ref.elements.Fe.provenance).toBe('from memory');
  });

  it('keeps red phosphorus and diamond as non-reference states', () => {
    expect(ref.elements.P.otherStates.find((o) => o.state === 'red')?.S).toBe(22.8); // NBS 1982, checked
    expect(ref.elements.C.otherStates.find((o) => o.state === 'diamond')?.S).toBe(2.377); // NBS 1982, from memory
    expect(ref.electron?.S).toBe(20.979); // e-(g), JANAF 1998, from memory
  });

  describe('refuses a broken file, naming the field', () => {
    const dir = mkdtempSync(join(tmpdir(), 'thermovet-ref-'));
    const good = JSON.parse(readFileSync(ref.path, 'utf8')) as { elements: Record<string, Record<string, unknown>> };
    const write = (name: string, doc: unknown): string => {
      const p = join(dir, name);
      writeFileSync(p, typeof doc === 'string' ? doc : JSON.stringify(doc));
      return p;
    };
    const variant = (mutate: (d: typeof good) => void) => {
      const d = structuredClone(good);
      mutate(d);
      return d;
    };
    it.each([
      ['not JSON', '{ "elements": ', undefined],
      ['no elements', { foo: 1 }, 'elements'],
      ['unknown symbol', variant((d) => (d.elements.Xx = { ...d.elements.O })), 'elements.Xx'],
      ['formula and atoms disagree', variant((d) => (d.elements.O.atoms = 1)), 'elements.O.formula'],
      ['formula of another element', variant((d) => (d.elements.O.formula = 'N2')), 'elements.O.formula'],
      ['negative entropy', variant((d) => (d.elements.C.S = -5.74)), 'elements.C.S'],
      ['entropy as text', variant((d) => (d.elements.C.S = '5.74')), 'elements.C.S'],
      ['bad phase', variant((d) => (d.elements.C.phase = 'solid')), 'elements.C.phase'],
      ['missing source', variant((d) => delete d.elements.C.source), 'elements.C.source'],
      ['hydrogen not H2 gas', variant((d) => delete d.elements.H), 'elements.H'],
    ])('%s', (name, doc, field) => {
      const p = write(`${name.replace(/\s+/g, '-')}.json`, doc);
      let caught: unknown;
      try {
        loadReference(p);
      } catch (err) {
        caught = err;
      }
      expect(caught).toBeInstanceOf(ReferenceDataError);
      expect((caught as ReferenceDataError).field).toBe(field);
      expect((caught as ReferenceDataError).path).toBe(p);
    });
    it('a missing file', () => {
      expect(() => loadReference(join(dir, 'nope.json'))).toThrow(ReferenceDataError);
    });
    it('an intact copy loads, with its own hash', () => {
      const p = write('copy.json', `${JSON.stringify(good)}\n`);
      const r = loadReference(p);
      expect(r.elements.O.S).toBe(205.152);
      expect(r.sha256).not.toBe(ref.sha256);
    });
  });
});

describe('elementEntropySum', () => {
  // Expected sums are built from the published element entropies named in the test above
  // (CODATA 1989: H2 130.68, O2 205.152, N2 191.609, C 5.74; Ca 41.59 CODATA from memory).
  it.each([
    ['H2O', 130.68 + 205.152 / 2],
    ['CO2', 5.74 + 205.152],
    ['CH4', 5.74 + 2 * 130.68],
    ['NH3', 191.609 / 2 + 1.5 * 130.68],
    ['CaCO3', 41.59 + 5.74 + 1.5 * 205.152],
    ['O2', 205.152],
    ['O', 205.152 / 2],
    ['O3', 1.5 * 205.152],
    ['CuSO4·5H2O', 33.15 + 32.054 + 4.5 * 205.152 + 5 * 130.68], // Cu 33.15 CODATA, from memory
  ])('%s', (text, expected) => {
    expect(elementEntropySum(parseFormula(text), ref)).toBeCloseTo(expected, 9);
  });

  it('gives ΔfS° = 0 for an element in its reference state', () => {
    for (const el of Object.keys(ref.elements)) {
      const e = ref.elements[el];
      expect(e.S - (elementEntropySum(parseFormula(e.formula), ref) ?? Number.NaN), el).toBeCloseTo(0, 12);
    }
  });

  it('is undefined when an element has no reference entry', () => {
    expect(elementEntropySum(parseFormula('PuO2'), ref)).toBeUndefined();
  });

  it('applies the aqueous-ion convention: Σν·S°(el) − (z/2)·S°(H2)', () => {
    const h2 = 130.68; // CODATA 1989
    expect(elementEntropySum(parseFormula('H+'), ref)).toBeCloseTo(h2 / 2 - h2 / 2, 12); // S°(H+,aq) = 0 ⇒ ΔfS° = 0
    expect(elementEntropySum(parseFormula('Na+'), ref, 'aq')).toBeCloseTo(51.3 - h2 / 2, 12);
    expect(elementEntropySum(parseFormula('Cl-'), ref, 'aq')).toBeCloseTo(223.081 / 2 + h2 / 2, 12);
    expect(elementEntropySum(parseFormula('SO4^2-'), ref, 'aq')).toBeCloseTo(32.054 + 2 * 205.152 + h2, 12);
  });

  it('applies the electron convention to gas-phase ions: Σν·S°(el) − z·S°(e−,g)', () => {
    const eS = 20.979; // e-(g), JANAF 1998, from memory
    expect(elementEntropySum(parseFormula('e-'), ref, 'g')).toBeCloseTo(eS, 12); // so ΔfS°(e−,g) = 0
    expect(elementEntropySum(parseFormula('Na+'), ref, 'g')).toBeCloseTo(51.3 - eS, 12);
    expect(elementEntropySum(parseFormula('O2^-'), ref, 'g')).toBeCloseTo(205.152 + eS, 12);
  });
});

describe('Gibbs–Helmholtz residuals of published data are near zero', () => {
  // ΔfH° and ΔfG° in kJ/mol, S° in J/(mol K), 298.15 K, 1 bar. Tolerance 0.1 kJ/mol: the published
  // values are rounded to about 0.01–0.1 kJ/mol and come from compilations whose element entropies
  // differ from ours by up to a few 0.1 J/(mol K).
  it.each([
    // species, ΔfH°, ΔfG°, S°, sources
    ['H2O(g)', -241.826, -228.582, 188.835, 'ΔfH° CODATA 1989 (checked); ΔfG° JANAF 1998 (checked); S° CODATA 1989 (checked)'],
    ['H2O(l)', -285.83, -237.141, 69.95, 'ΔfH° CODATA 1989 (from memory); ΔfG° JANAF 1998 (checked); S° CODATA 1989 (checked)'],
    ['CO2(g)', -393.522, -394.389, 213.795, 'ΔfH° JANAF 1998 (checked); ΔfG° JANAF 1998 (from memory); S° JANAF 1998 (from memory)'],
    ['CH4(g)', -74.873, -50.768, 186.251, 'ΔfH° JANAF 1998 (checked); ΔfG° JANAF 1998 (from memory); S° JANAF 1998 (checked)'],
    ['NH3(g)', -45.898, -16.367, 192.77, 'ΔfH° JANAF 1998 (from memory); ΔfG° JANAF 1998 (checked); S° CODATA 1989 (checked)'],
    ['CaCO3(cr,calcite)', -1206.92, -1128.79, 92.9, 'ΔfH° NBS 1982 (checked); ΔfG° NBS 1982 (from memory); S° NBS 1982 (checked)'],
    ['Al2O3(cr,corundum)', -1675.7, -1582.275, 50.92, 'ΔfH° CODATA 1989 (checked); ΔfG° JANAF 1998 (checked); S° CODATA 1989 (checked)'],
    ['SO2(g)', -296.842, -300.125, 248.212, 'ΔfH°, ΔfG°, S° JANAF 1998 (checked)'],
    ['SO3(g)', -395.765, -371.016, 256.769, 'ΔfH°, ΔfG°, S° JANAF 1998 (checked)'],
    ['H(g)', 217.998, 203.278, 114.717, 'ΔfH° CODATA 1989 (checked); ΔfG° JANAF 1998 (from memory); S° CODATA 1989 (checked)'],
  ])('%s', (text, dHf, dGf, S) => {
    const { formula } = splitPhaseSuffix(text);
    expect(Math.abs(residualKJ(formula, dHf, dGf, S))).toBeLessThan(0.1);
  });

  it('catches a wrong element entropy: O atoms instead of O2 would move H2O(g) by ~17 kJ/mol', () => {
    // S°(O,g) = 161.059 J/(mol K), CODATA 1989 (from memory)
    const wrong = (-228.582) - (-241.826 - (T * (188.835 - (130.68 + 161.059))) / 1000);
    expect(Math.abs(wrong)).toBeGreaterThan(10);
  });
});

describe('aqueous ions: the sign of the convention term, checked on published data', () => {
  // |residual| < 0.1 kJ/mol with the derived sign; the opposite sign gives tens of kJ/mol.
  const cases: [string, number, number, number, string][] = [
    ['Cl-', -167.159, -131.228, 56.5, 'NBS 1982 (from memory; also quoted as CODATA 1989, whose key values are ΔfH° −167.080, S° 56.60)'],
    ['Na+', -240.34, -261.905, 58.45, 'ΔfH° and S° CODATA 1989 (from memory); ΔfG° NBS 1982 (from memory)'],
    ['Na+', -240.12, -261.905, 59.0, 'NBS 1982 (from memory)'],
    ['Ca2+', -542.83, -553.58, -53.1, 'NBS 1982 (from memory)'],
  ];
  it.each(cases)('%s (ΔfH° %d)', (text, dHf, dGf, S) => {
    expect(Math.abs(residualKJ(text, dHf, dGf, S, 'aq'))).toBeLessThan(0.1);
  });
  it.each(cases)('%s with the opposite sign is far off', (text, dHf, dGf, S) => {
    const f = parseFormula(text);
    const neutralSum = elementEntropySum({ elements: f.elements, charge: 0 }, ref) ?? Number.NaN;
    const oppositeSum = neutralSum + (f.charge / 2) * 130.68;
    const r = dGf - (dHf - (T * (S - oppositeSum)) / 1000);
    expect(Math.abs(r)).toBeGreaterThan(30);
  });
});

describe('isReferenceState and elementOf', () => {
  const yes = (text: string) => {
    const s = splitPhaseSuffix(text);
    return isReferenceState(parseFormula(s.formula), s.phase ?? '', s.state, ref);
  };
  it.each([
    ['O2(g)', true],
    ['H2(g)', true],
    ['N2(g)', true],
    ['Cl2(g)', true],
    ['Br2(l)', true],
    ['I2(cr)', true],
    ['Hg(l)', true],
    ['Ar(g)', true],
    ['C(cr)', true],
    ['C(graphite)', true],
    ['C(cr,graphite)', true],
    ['S(cr)', true],
    ['S(rhombic)', true],
    ['S(cr,alpha)', true],
    ['P(cr,white)', true],
    ['Fe(cr)', true],
    ['Fe(cr,alpha)', true],
    ['Fe(α)', true],
    ['Sn(cr,white)', true],
    ['O(g)', false],
    ['O3(g)', false],
    ['O2(l)', false],
    ['H(g)', false],
    ['C(cr,diamond)', false],
    ['C(g)', false],
    ['S(cr,monoclinic)', false],
    ['P(cr,red)', false],
    ['Br2(g)', false],
    ['Hg(g)', false],
    ['I2(g)', false],
    ['Fe(cr,gamma)', false],
    ['Sn(cr,gray)', false],
    ['H2O(g)', false],
    ['H+(aq)', false],
    ['O2^-(g)', false],
    ['Pu(cr)', false],
  ])('%s -> %s', (text, expected) => {
    expect(yes(text)).toBe(expected);
  });

  it('accepts phase synonyms, generic words, and the three-argument form', () => {
    const O2 = parseFormula('O2');
    const C = parseFormula('C');
    expect(isReferenceState(O2, 'g', ref)).toBe(true);
    expect(isReferenceState(O2, 'gas', undefined, ref)).toBe(true);
    expect(isReferenceState(C, 's', ref)).toBe(true);
    expect(isReferenceState(C, 'cr', 'cr graphite', ref)).toBe(true);
    expect(isReferenceState(C, 'cr', 'crystal', ref)).toBe(true);
    expect(isReferenceState(C, 'cr', 'diamond', ref)).toBe(false);
    expect(isReferenceState(C, 'aq', ref)).toBe(false);
    expect(isReferenceState(C, 'cr', 'toString', ref)).toBe(false);
  });

  it('elementOf names the single element of a species', () => {
    expect(elementOf(parseFormula('O3'))).toBe('O');
    expect(elementOf(parseFormula('O2^-'))).toBe('O');
    expect(elementOf(parseFormula('C'))).toBe('C');
    expect(elementOf(parseFormula('H2O'))).toBeUndefined();
    expect(elementOf(parseFormula('e-'))).toBeUndefined();
  });
});
