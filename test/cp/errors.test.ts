// Specifications that do not fit their model are CpSpecErrors with stable codes and the row's location.

import { describe, expect, test } from 'vitest';
import { buildSegment, CpSpecError, expectedCoeffCount } from '../../pipeline/cp/index.js';
import type { CpModelName, CpSpec } from '../../pipeline/types.js';

const loc = { file: 'species.csv', line: 7, column: 12, field: 'cp_coeffs' };

function spec(model: string, coeffs: number[], extra: Partial<CpSpec> = {}): CpSpec {
  return { model: model as CpModelName, coeffs, unit: 'J/(mol K)', unitFactor: 1, Tmin: 300, Tmax: 1000, location: loc, ...extra };
}

function codeOf(s: CpSpec): string | undefined {
  try {
    buildSegment(s);
  } catch (e) {
    expect(e).toBeInstanceOf(CpSpecError);
    expect(e).toBeInstanceOf(Error);
    const err = e as CpSpecError;
    expect(err.name).toBe('CpSpecError');
    expect(err.message.length).toBeGreaterThan(10);
    expect(err.location).toEqual(loc);
    return err.code;
  }
  return undefined;
}

const n = (k: number): number[] => Array.from({ length: k }, (_, i) => i + 1);

describe.each([
  { name: 'poly without exponents', s: spec('poly', [1, 2]), code: 'cp-exponent-count' },
  { name: 'poly with fewer exponents than coefficients', s: spec('poly', [1, 2, 3], { exponents: [0, 1] }), code: 'cp-exponent-count' },
  { name: 'poly with no coefficients', s: spec('poly', [], { exponents: [] }), code: 'cp-exponent-count' },
  { name: 'poly with a non-finite exponent', s: spec('poly', [1], { exponents: [NaN] }), code: 'cp-not-finite' },
  { name: 'shomate with 6 coefficients', s: spec('shomate', n(6)), code: 'cp-coeff-count' },
  { name: 'shomate with 9 coefficients', s: spec('shomate', n(9)), code: 'cp-coeff-count' },
  { name: 'nasa7 with 6 coefficients', s: spec('nasa7', n(6)), code: 'cp-coeff-count' },
  { name: 'nasa7 with 9 coefficients (a NASA-9 row labelled nasa7)', s: spec('nasa7', n(9)), code: 'cp-coeff-count' },
  { name: 'nasa9 with 7 coefficients (a NASA-7 row labelled nasa9)', s: spec('nasa9', n(7)), code: 'cp-coeff-count' },
  { name: 'nasa9 with 10 coefficients', s: spec('nasa9', n(10)), code: 'cp-coeff-count' },
  { name: 'nasa7 with an infinite coefficient', s: spec('nasa7', [1, 2, 3, Infinity, 5, 6, 7]), code: 'cp-not-finite' },
  { name: 'table without temperatures', s: spec('table', [30, 31]), code: 'cp-temp-count' },
  { name: 'table with one point', s: spec('table', [30], { temps: [300] }), code: 'cp-temp-count' },
  { name: 'table with more values than temperatures', s: spec('table', [30, 31, 32], { temps: [300, 400] }), code: 'cp-temp-count' },
  { name: 'table with a repeated temperature', s: spec('table', [30, 31, 32], { temps: [300, 400, 400] }), code: 'cp-temps-not-ascending' },
  { name: 'table with descending temperatures', s: spec('table', [30, 31, 32], { temps: [500, 400, 300] }), code: 'cp-temps-not-ascending' },
  { name: 'table starting at 0 K', s: spec('table', [0, 31], { temps: [0, 300] }), code: 'cp-temps-not-positive' },
  { name: 'table with a NaN value', s: spec('table', [30, NaN], { temps: [300, 400] }), code: 'cp-not-finite' },
  { name: 'an unknown model', s: spec('nasa8', n(8)), code: 'cp-unknown-model' },
])('$name', ({ s, code }) => {
  test(`throws CpSpecError ${code} with the row's location`, () => {
    expect(codeOf(s)).toBe(code);
  });
});

test('the boundary counts are accepted', () => {
  expect(() => buildSegment(spec('poly', [1], { exponents: [0] }))).not.toThrow();
  expect(() => buildSegment(spec('shomate', n(7)))).not.toThrow();
  expect(() => buildSegment(spec('shomate', n(8)))).not.toThrow();
  expect(() => buildSegment(spec('nasa7', n(7)))).not.toThrow();
  expect(() => buildSegment(spec('nasa9', n(9)))).not.toThrow();
  expect(() => buildSegment(spec('table', [30, 31], { temps: [300, 301] }))).not.toThrow();
});

test('the message says what was given and what the model takes', () => {
  try {
    buildSegment(spec('nasa7', n(9)));
  } catch (e) {
    expect((e as Error).message).toMatch(/nasa7/);
    expect((e as Error).message).toMatch(/7/);
    expect((e as Error).message).toMatch(/9/);
  }
  expect.assertions(3);
});

test('expectedCoeffCount describes every model', () => {
  expect(expectedCoeffCount('shomate')).toMatch(/7.*8/);
  expect(expectedCoeffCount('nasa7')).toMatch(/^7/);
  expect(expectedCoeffCount('nasa9')).toMatch(/^9/);
  expect(expectedCoeffCount('poly')).toMatch(/exponent/);
  expect(expectedCoeffCount('table')).toMatch(/temperature/);
});
