/**
 * Shapes of the verification registry: each case names its published source, its inputs, the
 * reference value(s) and the tolerance, and computes Ampwarden's value with the product's own
 * library (passed in, so that a test can swap one function for a broken one and watch the
 * matching case fail). Plain TypeScript: runs in the browser and in vitest alike.
 */
import type { ProductLibrary } from './library';

/** Which method of the product a case covers; the sizing sheet links results by these. */
export const METHOD_AREAS = [
  'conduction',
  'convection',
  'radiation',
  'joule-runaway',
  'iec60287-resistance',
  'skin-effect',
  'ampacity',
  'short-circuit',
  'voltage-drop',
  'catalogue',
  'linear-algebra',
] as const;
export type MethodArea = (typeof METHOD_AREAS)[number];

/** Plain names for the method areas (page headings, PDF). */
export const METHOD_AREA_LABELS: Readonly<Record<MethodArea, string>> = {
  conduction: 'Conduction (finite-volume heat balance)',
  convection: 'Convection',
  radiation: 'Radiation',
  'joule-runaway': 'Joule heating and thermal runaway',
  'iec60287-resistance': 'Conductor resistance (IEC 60287-1-1)',
  'skin-effect': 'Skin effect (IEC 60287-1-1)',
  ampacity: 'Ampacity',
  'short-circuit': 'Short circuit (IEC 60949)',
  'voltage-drop': 'Voltage drop (IEC 60364-5-52 Annex G)',
  catalogue: 'Catalogue data (IEC 60228)',
  'linear-algebra': 'Linear algebra (tridiagonal solve)',
};

/**
 * How the reference was obtained, in the words of references.md: a standard's clause, a
 * textbook section, a recalled value ("from memory"), a fact of the trade ("common practice"),
 * an exact constant, or an independent computation done inside the case.
 */
export type SourceKind = 'standard' | 'textbook' | 'from memory' | 'common practice' | 'exact constant' | 'independent computation';

export interface CaseSource {
  kind: SourceKind;
  /** The citation as a reviewer would look it up (clause, section, equation, table). */
  citation: string;
  /** True when the value was recalled rather than read from the document: keep the label. */
  fromMemory?: boolean;
}

export interface CaseInput {
  name: string;
  value: number | string;
  unit?: string;
}

export type Tolerance =
  /** Pass when |Ampwarden − reference| ≤ value (in the quantity's unit). */
  | { kind: 'absolute'; value: number }
  /** Pass when |Ampwarden − reference| ≤ value·|reference|. */
  | { kind: 'relative'; value: number };

/** One compared number of a case. */
export interface Quantity {
  /** Key of the value in `compute()`'s answer. */
  key: string;
  label: string;
  unit: string;
  /** The outside value (closed form evaluated at the inputs, table entry, hand-worked figure). */
  reference: number;
  tolerance: Tolerance;
}

/** Finite-volume profile beside the closed form (field cases). */
export interface ProfileComparison {
  /** What the position means, e.g. 'x (m)' or 'r (m)'. */
  positionLabel: string;
  /** Cell centres, m. */
  positions: number[];
  /** Finite-volume temperatures at the cell centres, °C. */
  solver: number[];
  /** Closed form at the same cell centres, °C. */
  closedFormAtNodes: number[];
  /** Closed form on a fine, even grid for the plotted curve. */
  curve: { positions: number[]; temperatures: number[] };
  cells: number;
}

/** Error against the closed form as the mesh is refined. */
export interface ConvergenceStudy {
  cells: number[];
  /** Largest nodal |T_FV − T_exact|, K, for each entry of `cells`. */
  maxErrors: number[];
  /** Slope of log(error) against log(1/cells), least squares over the finest `fitPoints` meshes. */
  measuredOrder: number;
  fitPoints: number;
}

/** What `compute()` answers. */
export interface CaseComputation {
  /** Ampwarden's value for every quantity key. */
  values: Record<string, number>;
  profile?: ProfileComparison;
  convergence?: ConvergenceStudy;
  /** Anything a reviewer should read beside the numbers (solver diagnostics). */
  details?: string[];
}

export interface VerificationCase {
  /** Stable, URL-safe id (anchors on the page: /verification#case-<id>). */
  id: string;
  title: string;
  area: MethodArea;
  source: CaseSource;
  inputs: CaseInput[];
  quantities: Quantity[];
  /** How the reference was worked out (the arithmetic for hand-worked cases). */
  notes?: string;
  /** True for cases with a finite-volume profile and a convergence study. */
  field?: boolean;
  compute(library: ProductLibrary): CaseComputation;
}

export interface QuantityResult {
  key: string;
  label: string;
  unit: string;
  reference: number;
  value: number;
  /** Ampwarden − reference. */
  deviation: number;
  /** (Ampwarden − reference)/|reference|; null when the reference is 0. */
  relativeDeviation: number | null;
  tolerance: Tolerance;
  pass: boolean;
}

export interface CaseResult {
  id: string;
  title: string;
  area: MethodArea;
  source: CaseSource;
  inputs: CaseInput[];
  notes?: string;
  quantities: QuantityResult[];
  pass: boolean;
  /** Set when compute() threw or left a quantity out: the case fails and says why. */
  error?: string;
  profile?: ProfileComparison;
  convergence?: ConvergenceStudy;
  details?: string[];
}
