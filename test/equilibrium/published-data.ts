// Published property data for the equilibrium checks, each number with its source.
//
// Formation values at 298.15 K, 1 bar: as /work/shared/reference-values.json gives them (CODATA Key
// Values for Thermodynamics, Cox, Wagman and Medvedev 1989; NIST-JANAF Thermochemical Tables, 4th ed.,
// Chase 1998), with the provenance that file records.
// Shomate coefficients [Tmin, Tmax, A, B, C, D, E, F, G, H]: the NIST Chemistry WebBook Shomate fits
// of the JANAF data, from memory; checked against JANAF Cp values in shomate-vs-janaf below.
import { loadReference } from '../../pipeline/chemistry/reference.js';
import type { Species } from '../../pipeline/types.js';
import { species } from './helpers.js';

export const REFERENCE = loadReference();

export const SHOMATE = {
  // NIST WebBook, water (gas), 500–1700 K, from memory. No range below 500 K is published, so from
  // 298.15 to 500 K the fit is extrapolated (its Cp at 298.15 K is 33.59, JANAF's 33.59 — see below).
  H2O: [[500, 1700, 30.092, 6.832514, 6.793435, -2.53448, 0.082139, -250.881, 223.3967, -241.8264]],
  CO: [[298, 1300, 25.56759, 6.09613, 4.054656, -2.671301, 0.131021, -118.0089, 227.3665, -110.5271]], // from memory
  CO2: [[298, 1200, 24.99735, 55.18696, -33.69137, 7.948387, -0.136638, -403.6075, 228.2431, -393.5224]], // from memory
  H2: [
    [298, 1000, 33.066178, -11.363417, 11.432816, -2.772874, -0.158558, -9.980797, 172.707974, 0], // from memory
    [1000, 2500, 18.563083, 12.257357, -2.859786, 0.268238, 1.97799, -1.147438, 156.288133, 0], // from memory
  ],
  N2: [
    [100, 500, 28.98641, 1.853978, -9.647459, 16.63537, 0.000117, -8.671914, 226.4168, 0], // from memory
    [500, 2000, 19.50583, 19.88705, -8.598535, 1.369784, 0.527601, -4.935202, 212.39, 0], // from memory
  ],
  NH3: [[298, 1400, 19.99563, 49.77119, -15.37599, 1.921168, 0.189174, -53.30667, 203.8591, -45.89806]], // from memory
} as const satisfies Record<string, readonly (readonly number[])[]>;

/** JANAF Cp, J/(mol K), to check the recalled Shomate fits against. */
export const JANAF_CP: { species: keyof typeof SHOMATE; T: number; cp: number; source: string }[] = [
  { species: 'H2O', T: 298.15, cp: 33.59, source: 'JANAF (Chase 1998), water gas; reference-values.json, checked against the source' },
  { species: 'H2O', T: 500, cp: 35.226, source: 'JANAF (Chase 1998), water gas; reference-values.json, from memory' },
  { species: 'H2O', T: 1000, cp: 41.268, source: 'JANAF (Chase 1998), water gas; reference-values.json, from memory' },
  { species: 'CO', T: 500, cp: 29.794, source: 'JANAF (Chase 1998), carbon monoxide; reference-values.json, from memory' },
  { species: 'CO', T: 1000, cp: 33.183, source: 'JANAF (Chase 1998), carbon monoxide; reference-values.json, from memory' },
  { species: 'CO2', T: 298.15, cp: 37.129, source: 'JANAF (Chase 1998), carbon dioxide; reference-values.json, checked against the source' },
  { species: 'CO2', T: 500, cp: 44.627, source: 'JANAF (Chase 1998), carbon dioxide; reference-values.json, from memory' },
  { species: 'CO2', T: 1000, cp: 54.308, source: 'JANAF (Chase 1998), carbon dioxide; reference-values.json, from memory' },
  { species: 'H2', T: 500, cp: 29.26, source: 'JANAF (Chase 1998), hydrogen; from memory' },
  { species: 'H2', T: 1000, cp: 30.205, source: 'JANAF (Chase 1998), hydrogen; from memory' },
  { species: 'N2', T: 500, cp: 29.58, source: 'JANAF (Chase 1998), nitrogen; from memory' },
  { species: 'N2', T: 1000, cp: 32.697, source: 'JANAF (Chase 1998), nitrogen; from memory' },
  { species: 'NH3', T: 298.15, cp: 35.652, source: 'JANAF (Chase 1998), ammonia; reference-values.json, from memory' },
  { species: 'NH3', T: 500, cp: 42.048, source: 'JANAF (Chase 1998), ammonia; reference-values.json, from memory' },
  { species: 'NH3', T: 1000, cp: 56.491, source: 'JANAF (Chase 1998), ammonia; reference-values.json, from memory' },
];

/** The six gases with published formation data and the recalled Shomate fits. */
export function publishedSpecies(): Species[] {
  return [
    // ΔfH° CODATA 1989 (checked), S° CODATA 1989 (checked), ΔfG° JANAF 1998 (checked)
    species({ name: 'H2O', phase: 'g', dHf_kJ: -241.826, dGf_kJ: -228.582, S: 188.835, shomate: SHOMATE.H2O.map((r) => [...r]) }),
    // ΔfH° CODATA 1989 (checked), S° CODATA 1989 (checked), ΔfG° JANAF 1998 (from memory)
    species({ name: 'CO', phase: 'g', dHf_kJ: -110.53, dGf_kJ: -137.163, S: 197.66, shomate: SHOMATE.CO.map((r) => [...r]) }),
    // ΔfH° JANAF 1998 (checked), S° JANAF 1998 (from memory; CODATA 213.785 ± 0.010), ΔfG° JANAF (from memory)
    species({ name: 'CO2', phase: 'g', dHf_kJ: -393.522, dGf_kJ: -394.389, S: 213.795, shomate: SHOMATE.CO2.map((r) => [...r]) }),
    // reference element; S° CODATA 1989 (checked)
    species({ name: 'H2', phase: 'g', dHf_kJ: 0, dGf_kJ: 0, S: 130.68, shomate: SHOMATE.H2.map((r) => [...r]) }),
    // reference element; S° CODATA 1989 (checked)
    species({ name: 'N2', phase: 'g', dHf_kJ: 0, dGf_kJ: 0, S: 191.609, shomate: SHOMATE.N2.map((r) => [...r]) }),
    // ΔfH° JANAF 1998 (from memory), S° CODATA 1989 (checked), ΔfG° JANAF 1998 (checked)
    species({ name: 'NH3', phase: 'g', dHf_kJ: -45.898, dGf_kJ: -16.367, S: 192.77, shomate: SHOMATE.NH3.map((r) => [...r]) }),
  ];
}

/**
 * log10 K from NIST-JANAF 4th ed. (Chase 1998) ΔfG°(T) / log Kf tables, as /work/shared/reference-values.json
 * ("equilibrium_checks") derives them: water-gas shift from the carbon monoxide, carbon dioxide and
 * water (gas) tables (H2 is the reference element, log Kf = 0); ammonia synthesis as 2 × log Kf of the
 * ammonia table (H-083). dG in kJ/mol.
 */
export const EQUILIBRIUM_CHECKS = [
  { equation: 'CO(g) + H2O(g) = CO2(g) + H2(g)', T: 500, log10K: 2.1389, dG: -20.474, tables: 'JANAF CO, CO2, H2O(g) ΔfG°(500 K); checked against the source' },
  { equation: 'CO(g) + H2O(g) = CO2(g) + H2(g)', T: 800, log10K: 0.6263, dG: -9.593, tables: 'JANAF CO, CO2, H2O(g) ΔfG°(800 K); from memory' },
  { equation: 'CO(g) + H2O(g) = CO2(g) + H2(g)', T: 1000, log10K: 0.1578, dG: -3.021, tables: 'JANAF CO, CO2, H2O(g) ΔfG°(1000 K); from memory' },
  { equation: 'CO(g) + H2O(g) = CO2(g) + H2(g)', T: 1200, log10K: -0.1369, dG: 3.146, tables: 'JANAF CO, CO2, H2O(g) ΔfG°(1200 K); from memory' },
  { equation: 'N2(g) + 3 H2(g) = 2 NH3(g)', T: 500, log10K: -1.0029, dG: 9.6, tables: '2 × JANAF log Kf(NH3, H-083) at 500 K; checked against the source' },
  { equation: 'N2(g) + 3 H2(g) = 2 NH3(g)', T: 700, log10K: -4.0578, dG: 54.38, tables: '2 × JANAF log Kf(NH3, H-083) at 700 K; checked against the source' },
];
