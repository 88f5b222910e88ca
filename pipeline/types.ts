// The data model every stage shares. Internal units are SI throughout:
// J/mol for energies, J/(mol K) for entropies and heat capacities, K for temperatures, bar for pressure.

export type Severity = 'error' | 'warning' | 'info';
export type Phase = 'g' | 'l' | 'cr' | 'aq';
export const PHASES: readonly Phase[] = ['g', 'l', 'cr', 'aq'];

/** Where something came from: a file and its 1-based physical line; column is 1-based when known. */
export interface Location {
  file: string;
  line: number;
  column?: number;
  field?: string;
}

/** A known slip that explains a residual or a value, with the value it should have had. */
export interface Diagnosis {
  cause: string; // e.g. 'kJ-read-as-J', 'cal-read-as-J', 'sign', 'atm-vs-bar', 'cp-over-R-as-J'
  field: string; // canonical column the slip is in
  corrected: number; // corrected value in the column's declared (input) unit
  unit: string; // that unit, for display
  residualAfter: number; // residual after the correction, kJ/mol (or the rule's residual unit)
}

/** A finding is data: the text is rendered from the rule's template at the edge. */
export interface Finding {
  rule: string;
  severity: Severity;
  messageId: string;
  params: Record<string, number | string>;
  message: string;
  species?: string;
  phase?: Phase | string;
  location: Location;
  diagnosis?: Diagnosis;
  impact?: { reaction: string; maxAbsDeltaLnK: number; T_K?: number }[];
  waived?: { by: string; reason: string; expires: string };
}

/** The findings of a report: an array, or a finding store (finding-store.ts) whose findings are made as they are read. */
export interface FindingList extends Iterable<Finding> {
  readonly length: number;
}

export interface Formula {
  elements: Record<string, number>;
  charge: number;
}

export type CpModelName = 'poly' | 'shomate' | 'nasa7' | 'nasa9' | 'table';
export const CP_MODELS: readonly CpModelName[] = ['poly', 'shomate', 'nasa7', 'nasa9', 'table'];

/** A Cp correlation as the row declared it. Temperatures are already in K. */
export interface CpSpec {
  model: CpModelName;
  /** coefficients exactly as declared, in the model's published order and native unit */
  coeffs: number[];
  /** poly: the powers of T, one per coefficient */
  exponents?: number[];
  /** table: the listed temperatures in K, one per coefficient (Cp value) */
  temps?: number[];
  /** poly and table: the cp_unit declared ('J/(mol K)', 'cal/(mol K)', 'R'); others: their native unit */
  unit: string;
  /** poly and table: factor that turns a declared coefficient into J/(mol K); 1 for the other models */
  unitFactor: number;
  Tmin: number; // K
  Tmax: number; // K
  location: Location;
}

/**
 * One fitted range of a Cp correlation, analytic in SI units.
 * intCp and intCpOverT are antiderivatives with an arbitrary constant; differences are what count.
 */
export interface CpSegment {
  model: CpModelName;
  Tmin: number;
  Tmax: number;
  cp(T: number): number; // J/(mol K)
  intCp(T: number): number; // ∫Cp dT, J/mol (+ const)
  intCpOverT(T: number): number; // ∫Cp/T dT, J/(mol K) (+ const)
  /** Absolute H(T) and S(T) implied by constants the model carries (shomate F/G/H, nasa7 a6/a7, nasa9 b1/b2). */
  embedded?: { H(T: number): number; S(T: number): number };
  location: Location;
}

/**
 * A species' whole Cp description: its segments joined, extended beyond its ends by the nearest
 * segment's own formula (which is exactly what a user who extrapolates gets).
 */
export interface CpCurve {
  segments: CpSegment[]; // sorted by Tmin
  Tmin: number;
  Tmax: number;
  cp(T: number): number; // J/(mol K)
  dH(T: number): number; // H(T) - H(298.15), J/mol, integrated through the joins
  dS(T: number): number; // S(T) - S(298.15), J/(mol K)
  /** kelvin outside every segment (0 inside one); in a gap between segments, the distance to the nearer one */
  outside(T: number): number;
}

/** One value of a formation property as one row gave it. */
export interface RowValues {
  dHf?: number; // J/mol
  dGf?: number; // J/mol
  S?: number; // J/(mol K)
  u_dHf?: number;
  u_dGf?: number;
  u_S?: number;
  P_ref: number; // bar
  source: string;
  location: Location;
}

/** Row after unit conversion and parsing, ready to be folded into a Species. */
export interface SpeciesRow {
  species: string;
  formulaText: string;
  formula: Formula;
  phase: Phase;
  /** state word from the name or phase column, e.g. 'graphite', 'diamond', 'rhombic' */
  state?: string;
  values: RowValues;
  cp?: CpSpec;
  /** 1-based column of each canonical field in the source, for locating findings. */
  columns: Record<string, number>;
  /** unit each canonical field was declared in (for diagnosis messages). */
  units: Record<string, string>;
}

/** One species in one phase, its rows folded together. */
export interface Species {
  key: string; // `${name}|${phase}`
  name: string;
  formulaText: string;
  formula: Formula;
  phase: Phase;
  state?: string;
  dHf?: number; // J/mol
  dGf?: number; // J/mol
  S?: number; // J/(mol K)
  u: { dHf?: number; dGf?: number; S?: number };
  P_ref: number; // bar
  /** every row's formation values, in input order (cross-source checks read these) */
  values: RowValues[];
  cp: CpSpec[]; // sorted by Tmin
  /** location of the first row, used for species-level findings */
  location: Location;
  columns: Record<string, number>;
  units: Record<string, string>;
}

export interface UseWindow {
  Tmin?: number;
  Tmax?: number;
  temperatures?: number[];
}

export interface Tolerances {
  gibbsErrorKJ: number; // residual above this is an error (kJ/mol)
  gibbsWarningKJ: number; // residual above this is a warning (kJ/mol)
}

export interface CheckContext {
  options: OptionsNormalized;
  reference: ReferenceData;
}

/** Element reference states and their standard entropies, from datasets/reference. */
export interface ReferenceData {
  /** element symbol -> its reference-state species */
  elements: Record<
    string,
    { species: string; formula: string; atoms: number; phase: Phase; state: string; S: number; source: string }
  >;
  sha256: string;
  path: string;
}

export type FailOn = 'error' | 'warning' | 'never';

/** What the inside of the pipeline reads: complete, validated, no undefined defaults. */
export interface OptionsNormalized {
  name: string; // dataset name for reports
  tables: { path: string; format: 'csv' | 'tsv' | 'json' | 'ndjson' }[];
  headerMap: Record<string, string>; // user header -> canonical column
  units: Record<string, string>; // canonical column -> unit
  useWindow: UseWindow;
  reactionsFile?: string;
  waiversFile?: string;
  tolerances: Tolerances;
  failOn: FailOn;
  manifestPath?: string;
}

export interface Rule {
  id: string;
  severity: Severity;
  docs: string;
  description: string;
  messages: Record<string, string>;
  /** species-level rules; structural findings from ingest carry their own rule ids */
  check?(species: Species, ctx: CheckContext): Finding[];
}

export interface Summary {
  rows: number;
  accepted: number;
  rejected: number;
  species: number;
  errors: number;
  warnings: number;
  infos: number;
}

/** A species' Cp correlation as the report shows it (charts read this; they compute nothing themselves). */
export interface CpSummary {
  models: string[]; // distinct models, in range order
  ranges: { model: string; Tmin: number; Tmax: number; file: string; line: number }[];
  cp298?: number; // J/(mol K) at 298.15 K (extrapolated when outside every range)
  /** Cp at the use window's ends (and listed temperatures), with kelvin outside the fitted ranges */
  atWindow: { T: number; cp: number; outsideK: number }[];
  /** a sampled curve for charts, present for at most CHART_SPECIES_LIMIT species (those in reactions first, then those with Cp findings, then the rest with a Cp correlation) */
  samples?: { T: number; cp: number; outsideK: number }[];
}

export interface SpeciesSummary {
  key: string;
  name: string;
  phase: string;
  formula: string; // Hill order, with charge
  dHf?: number; // kJ/mol
  dGf?: number; // kJ/mol
  S?: number; // J/(mol K)
  gibbsResidual?: number; // kJ/mol, when all three are given and the elements are known
  location: Location;
  cp?: CpSummary;
}

export interface ReactionPoint {
  T: number; // K
  lnK: number; // rigorous route
  lnKShortcut: number; // constant-ΔrH° route from 298.15 K
  dG: number; // ΔrG°(T), kJ/mol
  dH: number; // ΔrH°(T), kJ/mol
  dS: number; // ΔrS°(T), J/(mol K)
  u_lnK?: number; // standard uncertainty propagated from stated uncertainties
  /** species whose Cp is extrapolated at T, by how many kelvin, and the Cp the correlation gives there */
  extrapolated: { species: string; outsideK: number; cp: number }[];
  /** species with no Cp correlation at all: the reaction is then computed with ΔrCp = 0 */
  cpMissing?: string[];
}

export interface ReactionResult {
  id: string;
  equation: string;
  file: string;
  line: number;
  balanced: boolean;
  points: ReactionPoint[];
  /** species ranked by their share of u(ln K)² at the worst point */
  uncertaintyRanking?: { species: string; share: number }[];
}

export const CHART_SPECIES_LIMIT = 200;

/**
 * The species summaries of a report, in species order. check() makes each one when it is read, so a
 * 10^6-row report never holds them all; iterating twice makes them twice. An array is one too.
 */
export interface SummaryList extends Iterable<SpeciesSummary> {
  readonly length: number;
}

export interface Report {
  tool: { name: string; version: string };
  dataset?: { name: string; useWindow: UseWindow };
  summary: Summary;
  findings: FindingList;
  species?: SummaryList;
  reactions?: ReactionResult[];
  provenance: {
    generatedAt: string;
    inputs: { path: string; bytes: number; sha256: string }[];
    reference: { path: string; sha256: string };
    options: Record<string, unknown>;
    rules: string[];
  };
}
