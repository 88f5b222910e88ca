import { describe, expect, it } from 'vitest';
import { ATM_BAR, CAL_J, R_J_PER_MOL_K, findUnit, unitsOf } from '../../pipeline/units/table.js';
import { fromDeclared, toDeclared } from '../../pipeline/units/convert.js';

// Exact definitions: thermochemical calorie = 4.184 J (by definition); standard atmosphere = 101325 Pa
// (by definition); R = 8.314462618 J/(mol K) (CODATA 2018, exact since the 2019 SI).
describe('unit table', () => {
  it('uses the exact defined constants', () => {
    expect(CAL_J).toBe(4.184);
    expect(ATM_BAR).toBe(1.01325);
    expect(R_J_PER_MOL_K).toBe(8.314462618);
  });

  it.each([
    ['kJ/mol', 'molar-energy', -241.826, -241826],
    ['kcal/mol', 'molar-energy', -57.796, -57.796 * 4184],
    ['cal/mol', 'molar-energy', 1000, 4184],
    ['J/mol', 'molar-energy', 5, 5],
    ['cal/(mol K)', 'molar-entropy', 45.106, 45.106 * 4.184],
    ['J/(mol K)', 'molar-entropy', 188.835, 188.835],
    ['degC', 'temperature', 25, 298.15],
    ['K', 'temperature', 298.15, 298.15],
    ['atm', 'pressure', 1, 1.01325],
    ['Pa', 'pressure', 100000, 1],
    ['bar', 'pressure', 1, 1],
    ['R', 'heat-capacity', 3.5, 3.5 * 8.314462618],
  ] as const)('%s converts %s values exactly', (name, dim, v, si) => {
    const u = findUnit(name, dim)!;
    expect(u).toBeDefined();
    expect(v * u.factor + u.offset).toBeCloseTo(si, 9);
  });

  it('accepts common spellings', () => {
    for (const s of ['J/(mol K)', 'J/(mol·K)', 'j/mol/k', 'J/(mol*K)', ' J / (mol K) ']) expect(findUnit(s, 'molar-entropy')?.name).toBe('J/(mol K)');
    expect(findUnit('°C', 'temperature')?.name).toBe('degC');
    expect(findUnit('KCAL/MOL', 'molar-energy')?.name).toBe('kcal/mol');
  });

  it('reads per-mole units written as products of factors, as tables and papers print them', () => {
    for (const s of ['kJ mol-1', 'kJ·mol⁻¹', 'kJ mol^-1', 'kJ/mole', 'kJ mol−1']) expect(findUnit(s, 'molar-energy')?.name, s).toBe('kJ/mol');
    expect(findUnit('kcal mol-1', 'molar-energy')?.name).toBe('kcal/mol');
    for (const s of ['J mol-1 K-1', 'J K-1 mol-1', 'J/mol·K', 'J/mol-K', 'J/K/mol', 'J/(K·mol)', 'J·mol⁻¹·K⁻¹', 'J/(mole K)'])
      expect(findUnit(s, 'molar-entropy')?.name, s).toBe('J/(mol K)');
    for (const s of ['cal mol-1 K-1', 'cal/mol-K', 'cal/K/mol', 'e.u.']) expect(findUnit(s, 'molar-entropy')?.name, s).toBe('cal/(mol K)');
    expect(findUnit('℃', 'temperature')?.name).toBe('degC');
    // a product that is not energy per mole (per kelvin) stays unknown
    for (const s of ['kJ', 'mol-1', 'J mol', 'J/mol K-1', 'J/(mol K K)', 'J mol-1 mol-1', 'kcal/(mol K)', 'J/mol·K·s', '1/K'])
      expect([findUnit(s, 'molar-energy'), findUnit(s, 'molar-entropy')], s).toEqual([undefined, undefined]);
    expect(findUnit('kJ mol-1', 'molar-entropy')).toBeUndefined();
  });

  it('refuses unknown units and units of another dimension', () => {
    expect(findUnit('furlongs', 'molar-energy')).toBeUndefined();
    expect(findUnit('kJ/mol', 'temperature')).toBeUndefined();
    expect(findUnit('', 'molar-energy')).toBeUndefined();
    expect(unitsOf('temperature')).toEqual(['K', 'degC']);
  });

  it('converts back to the declared unit', () => {
    expect(toDeclared(-241826, 'dHf', 'kJ/mol')).toBeCloseTo(-241.826, 12);
    expect(toDeclared(213.795, 'S', 'cal/(mol K)')).toBeCloseTo(213.795 / 4.184, 12);
    expect(toDeclared(373.15, 'cp_Tmin', 'degC')).toBeCloseTo(100, 12);
    expect(fromDeclared(-57.8, 'dHf', 'kcal/mol')).toBeCloseTo(-57.8 * 4184, 9);
  });
});
