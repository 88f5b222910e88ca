// The chemical elements by symbol, H (Z = 1) to Og (Z = 118), in order of atomic number
// (IUPAC names and symbols as approved through 2016, when Nh, Mc, Ts and Og were named).

const SYMBOLS_IN_Z_ORDER = [
  'H', 'He',
  'Li', 'Be', 'B', 'C', 'N', 'O', 'F', 'Ne',
  'Na', 'Mg', 'Al', 'Si', 'P', 'S', 'Cl', 'Ar',
  'K', 'Ca', 'Sc', 'Ti', 'V', 'Cr', 'Mn', 'Fe', 'Co', 'Ni', 'Cu', 'Zn', 'Ga', 'Ge', 'As', 'Se', 'Br', 'Kr',
  'Rb', 'Sr', 'Y', 'Zr', 'Nb', 'Mo', 'Tc', 'Ru', 'Rh', 'Pd', 'Ag', 'Cd', 'In', 'Sn', 'Sb', 'Te', 'I', 'Xe',
  'Cs', 'Ba',
  'La', 'Ce', 'Pr', 'Nd', 'Pm', 'Sm', 'Eu', 'Gd', 'Tb', 'Dy', 'Ho', 'Er', 'Tm', 'Yb', 'Lu',
  'Hf', 'Ta', 'W', 'Re', 'Os', 'Ir', 'Pt', 'Au', 'Hg', 'Tl', 'Pb', 'Bi', 'Po', 'At', 'Rn',
  'Fr', 'Ra',
  'Ac', 'Th', 'Pa', 'U', 'Np', 'Pu', 'Am', 'Cm', 'Bk', 'Cf', 'Es', 'Fm', 'Md', 'No', 'Lr',
  'Rf', 'Db', 'Sg', 'Bh', 'Hs', 'Mt', 'Ds', 'Rg', 'Cn', 'Nh', 'Fl', 'Mc', 'Lv', 'Ts', 'Og',
] as const;

/** Every valid element symbol (118 of them), case-sensitive. */
export const ELEMENT_SYMBOLS: ReadonlySet<string> = new Set<string>(SYMBOLS_IN_Z_ORDER);

/** Atomic number of each symbol (1-based), e.g. ATOMIC_NUMBER.get('Fe') === 26. */
export const ATOMIC_NUMBER: ReadonlyMap<string, number> = new Map(
  SYMBOLS_IN_Z_ORDER.map((sym, i) => [sym, i + 1] as const),
);

/** True when `sym` is exactly an element symbol (case matters: 'Co' is cobalt, 'CO' is not a symbol). */
export function isElement(sym: string): boolean {
  return ELEMENT_SYMBOLS.has(sym);
}

/**
 * Elements that are not metals for the purpose of reading a bare charge such as `O2-`:
 * nonmetals, noble gases and the metalloids. For these a trailing `<digits><sign>` can mean either
 * a multiply charged atom or a singly charged molecule (O²⁻ oxide or O₂⁻ superoxide), so the
 * formula parser asks for an explicit notation instead of guessing.
 */
export const NON_METALS: ReadonlySet<string> = new Set([
  'H', 'He', 'B', 'C', 'N', 'O', 'F', 'Ne', 'Si', 'P', 'S', 'Cl', 'Ar', 'Ge', 'As', 'Se', 'Br', 'Kr',
  'Sb', 'Te', 'I', 'Xe', 'At', 'Rn', 'Ts', 'Og',
]);

/** Group 17: monatomic anions of these carry charge −1 only, so `I3-` can only be the triiodide ion. */
export const HALOGENS: ReadonlySet<string> = new Set(['F', 'Cl', 'Br', 'I', 'At', 'Ts']);
