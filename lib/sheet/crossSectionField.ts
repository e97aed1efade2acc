/**
 * "Solve the cross-section": the sheet's buried circuit solved as a two-dimensional field
 * (lib/thermal/crossSection, physics.md §9, issue 20) beside its IEC 60287 rating, for one
 * candidate — the temperature of every cable at the design current, the governing one, the
 * ampacity of the circuit by the field, each set against the rating's figure, the picture of the
 * field, and the solver's flags. The same function runs in the browser (a worker) and on the server
 * (the saved snapshot, on a coarser mesh); the report it returns is plain JSON.
 *
 * Settling what depends on temperature, as the rating does it:
 * - R_ac/R_dc (lib/electrical/sizing/acFactor.ts): the solver holds a cable's AC factor constant and
 *   its Joule loss is I²·R₂₀[1 + α(T − 20)]·F_ac, so a factor F′ in place of the prepared F is
 *   exactly the current I·√(F′/F) — passed as the solve's current, no re-meshing. The circuit's
 *   cables share the factor at the governing cable's conductor temperature, another circuit's
 *   cables each take theirs at their own (lib/electrical/sizing/groupSolve.ts does the same);
 *   repeated until no factor moves by more than 1e-6 of itself (AC_FACTOR_SETTLED), at most 5 times;
 * - the screen loss factor λ₁ (IEC 60287-1-1 §2.3, the library's function) at each cable's
 *   conductor and screen temperature: the solver holds it constant, so the problem is prepared
 *   again with the λ₁ the last solve gives, until no λ₁·W_c moves by more than 1e-4 of W_c (at most
 *   4 preparations; a result that has not settled says so).
 * The ampacity is the common current of the circuit's cables at which the governing conductor
 * reaches its limit, other circuits at their own currents, by the cross-section's bracketing root
 * finder to 0.1 A of the circuit current, from below; the circuit's factor at the limit, searched
 * again at the factor the answer gives only while that would move the answer by more than 0.01 A.
 */
import { AC_FACTOR_SETTLED, AMPACITY_TOLERANCE_A, CROSS_CHECK_LIMIT_PERCENT } from '../electrical/sizing/checks/ampacity';
import { makeFlag, type AssumptionFlag } from '../electrical/sizing/flags';
import type { GroupResult } from '../electrical/sizing/types';
import { prepareCrossSection, solvePrepared, type CrossSectionConverged, type CrossSectionInput, type CrossSectionResult, type PreparedCrossSection } from '../thermal/crossSection';
import { findLimitCurrent } from '../thermal/crossSection/rootFinder';
import { formatNumber } from '../units';
import { crossSectionInputOf, FIELD_MESHES, fieldSettingsOf, type FieldMapping, type FieldMeshName, type FieldSettings } from './crossSection';
import { pictureWindowOf, samplePicture, type FieldPicture } from './fieldPicture';
import { cableWords, governingCableOf } from './groupWords';
import type { SheetInputs } from './schema';

export const FIELD_REPORT_VERSION = 1 as const;

/** Stated beside every field result, on the sheet, the share page and the PDF (our words). */
export const FIELD_CAUTION =
  'The two-dimensional field is a numerical estimate beside the IEC 60287 rating, which remains the rating of this sheet. It uses the same cables, losses and soil; it differs where the standard simplifies the ground (surface, backfill, ducts, neighbours). Check its assumptions before relying on a difference.';

const MAX_AC_PASSES = 5;
const MAX_SCREEN_PREPARATIONS = 4;
const SCREEN_SETTLED = 1e-4;
const MAX_AMPACITY_EVALUATIONS = 40;
/** Solves one report may take in all (a typical one takes 10 to 25): the bound on the server's work for a save. */
export const MAX_FIELD_SOLVES = 150;

export interface FieldProgress {
  stage: 'rating' | 'meshing' | 'design' | 'ampacity' | 'picture';
  /** What is being done, in words. */
  message: string;
  /** 0 … 1, a rough share of the work done. */
  share: number;
}

export interface FieldReportCable {
  /** The field's temperatures at the design current, °C (null on runaway; a cable given by its heat has only its surface). */
  conductorC: number | null;
  surfaceC: number | null;
  heatWPerM: number | null;
  /** The IEC rating's temperatures for the same cable (evaluation.group). */
  iecConductorC: number | null;
  iecSurfaceC: number | null;
  /** Field − IEC conductor temperature, K. */
  differenceK: number | null;
}

export interface FieldReport {
  reportVersion: typeof FIELD_REPORT_VERSION;
  candidateId: string;
  candidateLabel: string;
  designCurrentA: number;
  status: 'converged' | 'runaway' | 'not-converged';
  /** Why there are no temperatures, when status is not 'converged'. */
  message?: string;
  surface: { kind: 'isothermal' | 'convective'; temperatureC: number; heatTransferCoefficientWPerM2K?: number };
  domain: { widthM: number; depthM: number };
  mesh: { name: FieldMeshName; words: string; cells: number; nx: number; ny: number; smallestCellM: number; largestCellM: number; cellsAcrossCable: number; refinement: number };
  /** The cross-section with the FIELD's temperatures (same cables and order as the rating's group), for the words and the drawing. */
  group: GroupResult;
  cables: FieldReportCable[];
  limitC: number;
  /** The governing cable by the field (index into the cables) and its conductor temperature. */
  governing: { cable: number; words: string; conductorC: number; marginK: number } | null;
  iecGoverning: { cable: number; words: string; conductorC: number | null } | null;
  /** The governing conductor by the field less the rating's governing conductor, K. */
  governingDifferenceK: number | null;
  ampacity: {
    /** A per phase, by the field (null when it could not be found). */
    fieldA: number | null;
    iecA: number;
    /** 100·(field − IEC)/IEC. */
    differencePercent: number | null;
    /** Index of the cable that reaches its limit first at the field's ampacity. */
    governingCable: number | null;
    /** Set when the field's search gave no current. */
    message?: string;
    /** Where the IEC ampacity was governed by a covering's own limit rather than the conductor's. */
    iecLimitedBy?: string;
  };
  heat: { generatedWPerM: number; toSurfaceWPerM: number; toBottomWPerM: number; energyResidual: number } | null;
  solves: number;
  /** The solver's own flags, in words of the sheet. */
  flags: Array<{ code: string; severity: 'note' | 'review'; message: string }>;
  /** How the field was set up. */
  notes: string[];
  /** Flags for the sheet's review (CROSS_SECTION_FIELD_HOTTER), when the field runs hotter than the rating allows. */
  reviewFlags: AssumptionFlag[];
  /** False when λ₁ had not settled within its preparations. */
  screenLossesSettled: boolean;
  picture: FieldPicture | null;
  elapsedMs: number;
}

export interface FieldRunOptions {
  settings?: FieldSettings;
  /** Columns of the picture (rows follow the window's shape). */
  pictureColumns?: number;
  onProgress?: (progress: FieldProgress) => void;
}

interface SolveState {
  mapping: FieldMapping;
  prepared: PreparedCrossSection;
  solves: number;
  /** Solves left for the whole report (shared by every preparation). */
  budget: { left: number };
}

const now = () => (typeof performance !== 'undefined' ? performance.now() : Date.now());

/** One solve with each cable's AC factor (the current scaled by √(F/F_prepared)). */
function solveWith(state: SolveState, modelCurrents: number[], factors: number[]): CrossSectionResult {
  state.solves++;
  if (--state.budget.left < 0) throw new Error(`the field needed more than ${MAX_FIELD_SOLVES} solves; no figure is given`);
  const currentsA = modelCurrents.map((i, k) => i * Math.sqrt(factors[k] / state.mapping.acFactors[k]));
  return solvePrepared(state.prepared, { currentsA });
}

/** Solves at the given model currents with the AC factors settled (the circuit's own at `ratedFactor` when given). */
function settledSolve(state: SolveState, modelCurrents: number[], startFactors: number[], ratedFactor?: number): { result: CrossSectionResult; factors: number[] } {
  const { mapping } = state;
  let factors = startFactors.map((f, k) => (ratedFactor !== undefined && mapping.cables[k].role === 'rated' ? ratedFactor : f));
  let result = solveWith(state, modelCurrents, factors);
  for (let pass = 1; pass < MAX_AC_PASSES && result.converged; pass++) {
    const temps = result.cables.map((c) => c.conductorC);
    const hottestRated = Math.max(...mapping.rated.map((k) => temps[k]));
    const next = mapping.cables.map((c, k) =>
      c.role === 'fixed' ? 1 : c.role === 'rated' ? (ratedFactor ?? mapping.acFactorAt(hottestRated)) : mapping.acFactorAt(temps[k]),
    );
    if (next.every((f, k) => Math.abs(f - factors[k]) <= AC_FACTOR_SETTLED * factors[k])) break;
    factors = next;
    result = solveWith(state, modelCurrents, factors);
  }
  return { result, factors };
}

/** The input with the screen loss factors given. */
function withLambdas(input: CrossSectionInput, lambdas: number[]): CrossSectionInput {
  return {
    ...input,
    cables: input.cables.map((c, k) => (c.proportionalLosses ? { ...c, proportionalLosses: c.proportionalLosses.map((p) => ({ ...p, factor: lambdas[k] })) } : c)),
  };
}

/** λ₁ of every cable at a converged solve's temperatures, and whether they moved from `lambdas`. */
function nextLambdas(mapping: FieldMapping, result: CrossSectionConverged, lambdas: number[]): { lambdas: number[]; settled: boolean } {
  if (!mapping.lambdaAt || mapping.screenCovering === undefined) return { lambdas, settled: true };
  const screen = mapping.screenCovering;
  const next = mapping.cables.map((c, k) => (c.role === 'fixed' ? 0 : mapping.lambdaAt!(k, result.cables[k].conductorC, result.cables[k].coveringOuterC[screen])));
  const settled = next.every((l, k) => Math.abs(l - lambdas[k]) <= SCREEN_SETTLED);
  return { lambdas: next, settled };
}

/**
 * Runs `step` on a problem prepared with the screen losses at their current λ₁, preparing again
 * with the λ₁ its result gives until they settle. Without screen losses: one preparation.
 */
function withSettledScreens<T>(
  mapping: FieldMapping,
  lambdas: number[],
  solves: { count: number; budget: { left: number } },
  step: (state: SolveState) => { value: T; converged: CrossSectionConverged | null },
): { value: T; lambdas: number[]; settled: boolean; state: SolveState } {
  let current = lambdas;
  for (let preparation = 1; ; preparation++) {
    const state: SolveState = { mapping, prepared: prepareCrossSection(withLambdas(mapping.input, current)), solves: 0, budget: solves.budget };
    const { value, converged } = step(state);
    solves.count += state.solves;
    if (!converged) return { value, lambdas: current, settled: true, state };
    const next = nextLambdas(mapping, converged, current);
    if (next.settled) return { value, lambdas: current, settled: true, state };
    if (preparation >= MAX_SCREEN_PREPARATIONS) return { value, lambdas: current, settled: false, state };
    current = next.lambdas;
  }
}

/** The group of the rating with the field's temperatures in it (and its governing cable). */
function fieldGroupOf(iec: GroupResult, mapping: FieldMapping, result: CrossSectionResult): GroupResult {
  const converged = result.converged ? result : null;
  const governing = converged?.governing?.index ?? null;
  return {
    ...iec,
    method: 'Two-dimensional finite-volume field of the ground, each cable its own radial model joined to it (finite volumes, Patankar 1980)',
    cables: iec.cables.map((c, k) => {
      const solved = converged?.cables[k];
      const fixed = mapping.cables[k].role === 'fixed';
      return {
        ...c,
        conductorC: solved && !fixed ? solved.conductorC : null,
        surfaceC: solved ? solved.surfaceC : null,
        heatWPerM: solved ? solved.losses.totalWPerM : fixed ? mapping.cables[k].enteredHeatWPerM : null,
        riseFromOthersK: null,
      };
    }),
    governingCable: governing,
  };
}

/** "cables[3] is shallow…" → "the top cable of this circuit is shallow…". */
function inSheetWords(message: string, group: GroupResult, otherLabels: readonly string[]): string {
  return message.replace(/cables\[(\d+)\]/g, (whole, index: string) => {
    const k = Number(index);
    return k < group.cables.length ? `the ${cableWords(group, k, otherLabels)}` : whole;
  });
}

const c4 = (v: number) => `${formatNumber(v, 4)} °C`;
/** "the centre cable of this circuit", but "every cable of this circuit alike" as it stands. */
const the = (words: string) => (words.startsWith('every ') ? words : `the ${words}`);

/**
 * Solves the cross-section of one candidate of the sheet (see the module comment). Throws
 * ElectricalInputError naming the sheet's field for bad input; a field without a steady state is a
 * result (status 'runaway'), not an error.
 */
export function solveSheetCrossSection(inputs: SheetInputs, candidateId: string, options: FieldRunOptions = {}): FieldReport {
  const started = now();
  const settings = options.settings ?? fieldSettingsOf(inputs, 'sheet');
  const progress = options.onProgress ?? (() => {});
  const otherLabels = inputs.installation.otherCircuits.map((o) => o.label);

  progress({ stage: 'rating', message: 'Rating the candidate by IEC 60287', share: 0.02 });
  const mapping = crossSectionInputOf(inputs, candidateId, settings);
  const { evaluation } = mapping.basis;
  const iec = evaluation.group!;
  const solves = { count: 0, budget: { left: MAX_FIELD_SOLVES } };

  // At the design current.
  progress({ stage: 'meshing', message: 'Meshing the ground and preparing the solver', share: 0.06 });
  const designCurrents = mapping.cables.map((c) => c.modelCurrentA);
  let designFactors = mapping.acFactors;
  const design = withSettledScreens(mapping, mapping.lambdas, solves, (state) => {
    progress({ stage: 'design', message: 'Solving the field at the design current', share: 0.12 });
    const solved = settledSolve(state, designCurrents, designFactors);
    designFactors = solved.factors;
    return { value: solved.result, converged: solved.result.converged ? solved.result : null };
  });
  const result = design.value;

  // The ampacity: the circuit's cables at a common current, the others at theirs.
  let evaluations = 0;
  const toleranceModelA = mapping.toModelA(AMPACITY_TOLERANCE_A);
  let ampacityOutcome: { modelA: number; result: CrossSectionConverged; zero: boolean } | { message: string };
  try {
    let ratedFactor = mapping.acFactorAt(mapping.limitC);
    let guess = mapping.toModelA(evaluation.ampacityA > 0 ? evaluation.ampacityA : evaluation.designCurrentA);
    const search = withSettledScreens(mapping, design.lambdas, solves, (state) => {
      let probeFactors = designFactors;
      let root: ReturnType<typeof findLimitCurrent<CrossSectionConverged>> | undefined;
      for (let pass = 0; pass < 4; pass++) {
        root = findLimitCurrent<CrossSectionConverged>(
          (modelA) => {
            evaluations++;
            progress({ stage: 'ampacity', message: `Searching the ampacity in the field: solve ${evaluations}`, share: Math.min(0.95, 0.2 + 0.05 * evaluations) });
            const currents = mapping.cables.map((c) => (c.role === 'rated' ? modelA : c.modelCurrentA));
            // Each probe starts from the last one's factors: near the answer they no longer move.
            const { result: r, factors } = settledSolve(state, currents, probeFactors, ratedFactor);
            if (r.converged) probeFactors = factors;
            if (r.converged) return { kind: 'value', excessK: -r.governing!.marginK!, payload: r };
            if (r.status === 'runaway') return { kind: 'runaway' };
            throw new Error(`the field did not settle at ${formatNumber(mapping.fromModelA(modelA), 4)} A: ${r.message}`);
          },
          { guessA: guess, toleranceA: toleranceModelA, maxEvaluations: MAX_AMPACITY_EVALUATIONS },
        );
        if (root.zero) break;
        const settledFactor = mapping.acFactorAt(root.payload.governing!.conductorC);
        // I ∝ 1/√F at the limit: a factor that moves by δ moves the ampacity by about δ/2 of itself.
        // Searching again is worth it only when that exceeds a tenth of the search's own tolerance.
        if ((Math.abs(settledFactor - ratedFactor) / ratedFactor / 2) * root.currentA <= toleranceModelA / 10) break;
        ratedFactor = settledFactor;
        guess = root.currentA;
      }
      return { value: root!, converged: root!.payload };
    });
    ampacityOutcome = { modelA: search.value.zero ? 0 : search.value.currentA, result: search.value.payload, zero: search.value.zero };
    if (!search.settled) design.settled = false;
  } catch (error) {
    ampacityOutcome = { message: error instanceof Error ? error.message : String(error) };
  }

  progress({ stage: 'picture', message: 'Drawing the field', share: 0.97 });
  const group = fieldGroupOf(iec, mapping, result);
  const cables: FieldReportCable[] = iec.cables.map((c, k) => {
    const f = group.cables[k];
    return {
      conductorC: f.conductorC,
      surfaceC: f.surfaceC,
      heatWPerM: f.heatWPerM,
      iecConductorC: c.conductorC,
      iecSurfaceC: c.surfaceC,
      differenceK: f.conductorC !== null && c.conductorC !== null ? f.conductorC - c.conductorC : null,
    };
  });
  const fieldGoverning = governingCableOf(group, otherLabels);
  const iecGoverning = governingCableOf(iec, otherLabels);
  const governing =
    result.converged && result.governing && fieldGoverning
      ? { cable: result.governing.index, words: fieldGoverning.words, conductorC: result.governing.conductorC, marginK: result.governing.marginK ?? mapping.limitC - result.governing.conductorC }
      : null;
  const governingDifferenceK = governing && iecGoverning?.conductorC != null ? governing.conductorC - iecGoverning.conductorC : null;

  const fieldA = 'modelA' in ampacityOutcome ? mapping.fromModelA(ampacityOutcome.modelA) : null;
  const iecA = evaluation.ampacityA;
  const ampacity: FieldReport['ampacity'] = {
    fieldA,
    iecA,
    differencePercent: fieldA !== null && iecA > 0 ? (100 * (fieldA - iecA)) / iecA : null,
    governingCable: 'result' in ampacityOutcome ? (ampacityOutcome.result.governing?.index ?? null) : null,
    ...('message' in ampacityOutcome ? { message: ampacityOutcome.message } : {}),
    ...(evaluation.limit.source === 'layer' ? { iecLimitedBy: `the ${evaluation.limit.layer ?? 'covering'}’s own limit of ${c4(evaluation.limit.temperatureC)}` } : {}),
  };

  const flags = (result.converged ? result.flags : []).map((f) => ({ code: f.code, severity: f.severity, message: inSheetWords(f.message, group, otherLabels) }));
  const reviewFlags: AssumptionFlag[] = [];
  const label = evaluation.label;
  if (!result.converged) {
    reviewFlags.push(makeFlag('CROSS_SECTION_FIELD_HOTTER', `The two-dimensional field of ${label} has no steady state at the design current (${result.status === 'runaway' ? 'thermal runaway' : 'the solver did not settle'}), where the IEC rating gives one.`));
  } else if (governing && governing.marginK < 0) {
    reviewFlags.push(
      makeFlag(
        'CROSS_SECTION_FIELD_HOTTER',
        `The two-dimensional field of ${label} puts ${the(governing.words)} at ${c4(governing.conductorC)} at the design current, above its ${c4(mapping.limitC)} limit${iecGoverning?.conductorC != null ? ` (the IEC rating: ${c4(iecGoverning.conductorC)})` : ''}.`,
        { fieldC: governing.conductorC, limitC: mapping.limitC },
      ),
    );
  } else if (ampacity.differencePercent !== null && ampacity.differencePercent < -CROSS_CHECK_LIMIT_PERCENT) {
    reviewFlags.push(
      makeFlag(
        'CROSS_SECTION_FIELD_HOTTER',
        `The two-dimensional field gives ${label} an ampacity of ${formatNumber(fieldA!, 4)} A, ${formatNumber(-ampacity.differencePercent, 3)} % below the IEC rating’s ${formatNumber(iecA, 4)} A (more than ${CROSS_CHECK_LIMIT_PERCENT} %).`,
        { fieldA: fieldA!, iecA, differencePercent: ampacity.differencePercent },
      ),
    );
  }

  const notes = [...mapping.notes];
  if (iec.method.includes('§4.2.4')) {
    notes.push('The IEC rating takes this circuit’s own touching cables by the closed form of IEC 60287-2-1 §4.2.4 (their surfaces as one isotherm, equal losses); the field solves each cable, as the superposition of §4.2.3 does — part of any difference comes from there.');
  }
  if (mapping.lambdaAt) notes.push(design.settled ? 'Screen losses λ₁ settled at the field’s own temperatures.' : 'Screen losses λ₁ had not settled within four preparations: the figures carry the last λ₁.');
  const mesh = FIELD_MESHES[settings.mesh];
  const meshReport = result.mesh;
  const converged = result.converged ? result : null;
  const picture =
    converged && options.pictureColumns !== 0
      ? samplePicture(converged.field, pictureWindowOf(iec.cables, iec.bank), options.pictureColumns ?? 96, mapping.centreXM)
      : null;
  const input = mapping.input;
  return {
    reportVersion: FIELD_REPORT_VERSION,
    candidateId,
    candidateLabel: label,
    designCurrentA: evaluation.designCurrentA,
    status: result.status,
    ...(result.converged ? {} : { message: result.message }),
    surface:
      input.surface.kind === 'isothermal'
        ? { kind: 'isothermal', temperatureC: input.surface.temperatureC }
        : { kind: 'convective', temperatureC: input.surface.airTemperatureC, heatTransferCoefficientWPerM2K: input.surface.heatTransferCoefficientWPerM2K },
    domain: { ...input.domain },
    mesh: {
      name: settings.mesh,
      words: mesh.words,
      cells: meshReport.cells,
      nx: meshReport.nx,
      ny: meshReport.ny,
      smallestCellM: meshReport.smallestCellM,
      largestCellM: meshReport.largestCellM,
      cellsAcrossCable: mesh.cellsAcrossCable,
      refinement: mesh.refinement,
    },
    group,
    cables,
    limitC: mapping.limitC,
    governing,
    iecGoverning: iecGoverning ? { cable: iecGoverning.cable, words: iecGoverning.words, conductorC: iecGoverning.conductorC } : null,
    governingDifferenceK,
    ampacity,
    heat: converged ? { ...converged.heat } : null,
    solves: solves.count,
    flags,
    notes,
    reviewFlags,
    screenLossesSettled: design.settled,
    picture,
    elapsedMs: now() - started,
  };
}

export type FieldCheckOutcome = { ok: true; report: FieldReport } | { ok: false; message: string; field?: string };

/**
 * The field for the saved snapshot: the chosen candidate on the coarser mesh, when the option is
 * on; undefined when it is off or nothing is chosen. A failure is an outcome (shown, and it stops
 * approval like any optional check that could not be computed), never an exception.
 */
export function savedFieldCheck(inputs: SheetInputs): FieldCheckOutcome | undefined {
  if (!inputs.crossSection.checked || inputs.chosenCandidateId === null) return undefined;
  try {
    return { ok: true, report: solveSheetCrossSection(inputs, inputs.chosenCandidateId, { settings: fieldSettingsOf(inputs, 'saved'), pictureColumns: 48 }) };
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    const field = error && typeof error === 'object' && 'field' in error ? String((error as { field: unknown }).field) : undefined;
    return field ? { ok: false, message, field } : { ok: false, message };
  }
}

// ───────────────────────────── in words (the PDF; the share page shows the same report) ─────────────────────────────

const ROLE_WORDS = { rated: 'being sized', 'same-cable': 'same cable, own current', fixed: 'given by its heat' } as const;
const signed = (v: number, digits: number) => `${v >= 0 ? '+' : '−'}${formatNumber(Math.abs(v), digits)}`;
const orDash = (v: number | null) => (v === null ? '—' : formatNumber(v, 4));

/** The report as sentences, °C and A: what the field gives against the IEC rating, and how it was solved. */
export function fieldReportSentences(report: FieldReport): { results: string[]; method: string } {
  const a = report.ampacity;
  const results: string[] = [];
  if (report.status !== 'converged') results.push(`No steady state in the field at the design current: ${report.message ?? report.status}.`);
  if (report.governing) {
    results.push(
      `Governing by the field: ${the(report.governing.words)}, ${c4(report.governing.conductorC)} at ${formatNumber(report.designCurrentA, 4)} A against its ${c4(report.limitC)} limit` +
        (report.iecGoverning?.conductorC != null ? `; by the IEC rating: ${the(report.iecGoverning.words)}, ${c4(report.iecGoverning.conductorC)}` : '') +
        (report.governingDifferenceK !== null ? ` (field − IEC ${signed(report.governingDifferenceK, 3)} K).` : '.'),
    );
  }
  results.push(
    `Ampacity by the field ${a.fieldA === null ? 'not found' : `${formatNumber(a.fieldA, 4)} A`}, by the IEC rating ${formatNumber(a.iecA, 4)} A` +
      (a.differencePercent !== null ? ` (field − IEC ${signed(a.differencePercent, 3)} %).` : '.') +
      (a.message ? ` ${a.message}.` : '') +
      (a.iecLimitedBy ? ` The IEC ampacity is governed by ${a.iecLimitedBy}; the field's is against the conductor's limit.` : ''),
  );
  const surface =
    report.surface.kind === 'isothermal'
      ? `the ground surface held at ${c4(report.surface.temperatureC)}`
      : `the ground surface giving heat to air at ${c4(report.surface.temperatureC)} through ${formatNumber(report.surface.heatTransferCoefficientWPerM2K!, 3)} W/(m²·K)`;
  const method =
    `Solved on ${report.mesh.words}: ${report.mesh.cells} cells (${report.mesh.nx} × ${report.mesh.ny}, ${report.mesh.cellsAcrossCable} across a cable, smallest ${formatNumber(report.mesh.smallestCellM * 1000, 3)} mm) over ${formatNumber(report.domain.widthM, 3)} m × ${formatNumber(report.domain.depthM, 3)} m, ${surface}; ${report.solves} solves` +
    (report.heat ? `, energy balance closed to ${report.heat.energyResidual.toExponential(1)}.` : '.');
  return { results, method };
}

/** One row per cable: words, role, field conductor, IEC conductor, difference, field surface (°C, K; '—' where none). */
export function fieldCableRows(report: FieldReport, otherLabels: readonly string[] = []): Array<{ cable: string; role: string; field: string; iec: string; difference: string; surface: string; governs: boolean }> {
  return report.cables.map((c, k) => ({
    cable: cableWords(report.group, k, otherLabels),
    role: ROLE_WORDS[report.group.cables[k].role],
    field: orDash(c.conductorC),
    iec: orDash(c.iecConductorC),
    difference: c.differenceK === null ? '—' : signed(c.differenceK, 3),
    surface: orDash(c.surfaceC),
    governs: report.governing?.cable === k,
  }));
}
