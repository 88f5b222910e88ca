// Published standard formation properties at 298.15 K, 1 bar, for tests. Each row names its source.
// CODATA = CODATA Key Values for Thermodynamics (Cox, Wagman, Medvedev 1989);
// JANAF = NIST-JANAF Thermochemical Tables, 4th ed. (Chase 1998);
// NBS = NBS Tables of Chemical Thermodynamic Properties (Wagman et al. 1982).
// Values marked "from memory" were not checked against a copy of the source.

export interface Published {
  species: string;
  phase: 'g' | 'l' | 'cr' | 'aq';
  dHf: number; // kJ/mol
  dGf: number; // kJ/mol
  S: number; // J/(mol K)
  source: string;
}

export const PUBLISHED: Published[] = [
  { species: 'H2O', phase: 'g', dHf: -241.826, dGf: -228.582, S: 188.835, source: 'CODATA (dHf, S); JANAF (dGf)' },
  { species: 'H2O', phase: 'l', dHf: -285.83, dGf: -237.141, S: 69.95, source: 'CODATA (dHf, S); JANAF (dGf)' },
  { species: 'CO', phase: 'g', dHf: -110.53, dGf: -137.163, S: 197.66, source: 'CODATA (dHf, S); JANAF (dGf)' },
  { species: 'CO2', phase: 'g', dHf: -393.522, dGf: -394.389, S: 213.795, source: 'CODATA (dHf, S); JANAF (dGf)' },
  { species: 'CH4', phase: 'g', dHf: -74.873, dGf: -50.768, S: 186.251, source: 'JANAF' },
  { species: 'C2H6', phase: 'g', dHf: -84.68, dGf: -32.82, S: 229.6, source: 'NBS' },
  { species: 'C2H4', phase: 'g', dHf: 52.467, dGf: 68.421, S: 219.33, source: 'JANAF' },
  { species: 'C2H2', phase: 'g', dHf: 226.73, dGf: 209.2, S: 200.94, source: 'NBS' },
  { species: 'CH3OH', phase: 'g', dHf: -200.66, dGf: -161.96, S: 239.81, source: 'NBS' },
  { species: 'CH3OH', phase: 'l', dHf: -238.66, dGf: -166.27, S: 126.8, source: 'NBS' },
  { species: 'NH3', phase: 'g', dHf: -45.898, dGf: -16.367, S: 192.77, source: 'JANAF' },
  { species: 'NO', phase: 'g', dHf: 90.291, dGf: 86.6, S: 210.758, source: 'JANAF' },
  { species: 'NO2', phase: 'g', dHf: 33.095, dGf: 51.258, S: 240.034, source: 'JANAF' },
  { species: 'N2O4', phase: 'g', dHf: 9.079, dGf: 97.787, S: 304.376, source: 'JANAF' },
  { species: 'SO2', phase: 'g', dHf: -296.842, dGf: -300.125, S: 248.212, source: 'JANAF' },
  { species: 'SO3', phase: 'g', dHf: -395.765, dGf: -371.016, S: 256.769, source: 'JANAF' },
  { species: 'H2S', phase: 'g', dHf: -20.63, dGf: -33.56, S: 205.79, source: 'NBS' },
  { species: 'HCl', phase: 'g', dHf: -92.31, dGf: -95.3, S: 186.902, source: 'CODATA (dHf, S); NBS (dGf)' },
  { species: 'HF', phase: 'g', dHf: -271.1, dGf: -273.2, S: 173.779, source: 'NBS (from memory)' },
  { species: 'C2H5OH', phase: 'g', dHf: -235.1, dGf: -168.49, S: 282.7, source: 'NBS' },
  { species: 'HCN', phase: 'g', dHf: 135.1, dGf: 124.7, S: 201.78, source: 'NBS' },
  { species: 'N2O', phase: 'g', dHf: 82.05, dGf: 104.2, S: 219.85, source: 'NBS' },
  { species: 'O3', phase: 'g', dHf: 142.7, dGf: 163.2, S: 238.93, source: 'NBS' },
  { species: 'OH', phase: 'g', dHf: 38.987, dGf: 34.277, S: 183.708, source: 'JANAF' },
  { species: 'H', phase: 'g', dHf: 217.998, dGf: 203.278, S: 114.717, source: 'CODATA (dHf, S); JANAF (dGf)' },
  { species: 'O', phase: 'g', dHf: 249.173, dGf: 231.736, S: 161.059, source: 'CODATA (dHf, S); JANAF (dGf)' },
  { species: 'CaCO3', phase: 'cr', dHf: -1206.92, dGf: -1128.79, S: 92.9, source: 'NBS (dGf from memory)' },
  { species: 'CaO', phase: 'cr', dHf: -635.09, dGf: -604.03, S: 39.75, source: 'CODATA (dHf, S); NBS (dGf)' },
  { species: 'Fe2O3', phase: 'cr', dHf: -825.503, dGf: -743.523, S: 87.4, source: 'JANAF (from memory for dGf)' },
  { species: 'Al2O3', phase: 'cr', dHf: -1675.7, dGf: -1582.275, S: 50.92, source: 'CODATA (dHf, S); JANAF (dGf)' },
  { species: 'SiO2', phase: 'cr', dHf: -910.94, dGf: -856.64, S: 41.84, source: 'CODATA (dHf, S); NBS (dGf)' },
  // aqueous ions, H+(aq) convention
  { species: 'Cl-', phase: 'aq', dHf: -167.08, dGf: -131.22, S: 56.6, source: 'CODATA (dHf, S); NBS (dGf) (from memory)' },
  { species: 'Na+', phase: 'aq', dHf: -240.34, dGf: -261.905, S: 58.45, source: 'CODATA (from memory)' },
];

export function csvOf(rows: Published[], header = 'species,phase,dHf,dGf,S,source'): string {
  return header + '\n' + rows.map((r) => `${r.species},${r.phase},${r.dHf},${r.dGf},${r.S},"${r.source}"`).join('\n') + '\n';
}
