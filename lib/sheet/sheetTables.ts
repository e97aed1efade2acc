/**
 * The sizing sheet as plain tables — inputs with units, candidates, the chosen candidate's results,
 * the method and standards — shared by the share view, the PDF and the candidate exports so that all
 * three print the same words and the same numbers from the saved snapshot; each candidate's figures
 * come from candidateRow (lib/sheet/candidateRow.ts), which the candidate grid uses too. Pure
 * TypeScript (no React, no server code): the browser and the server both use it. SI units, as stored.
 */
import { flagTitleList } from './flagWords';
import { formatMoney, moneyNumber, withCurrency } from '../units/money';
import type { CandidateEvaluation, CandidateEvaluationOk } from '@/lib/electrical/sizing/types';
import { describeArrangement, sectionPerPhaseMm2, type SheetCandidate } from '@/lib/sheet/candidates';
import type { SheetInputs } from '@/lib/sheet/schema';
import { formatNumber, formatPower, formatQuantity, lossPerLengthWords } from '@/lib/units';
import { candidateRow, type CandidateRow, type ComparisonMarks, type ResultState } from './candidateRow';
import { plainMessage } from './arrangementCheck';
import { FORMATION_WORDS, governingCableOf, groupMethodWords, otherCircuitWords } from './groupWords';
import { systemInputRows } from './systemTables';

export interface InputRow {
  section: string;
  label: string;
  value: string;
  unit: string;
}

const INSTALLATION_WORDS: Record<SheetInputs['installation']['kind'], string> = {
  'bar-on-edge': 'Bars on edge in air',
  'bar-flat': 'Bars laid flat in air',
  'cable-in-air': 'Cables in free air',
  buried: 'Cables buried in the ground',
  enclosure: 'In an enclosure',
};

const n = (value: number, digits = 4) => formatNumber(value, digits);
const orAssumed = (value: number | null, digits = 4) => (value === null ? 'not entered (assumed, flagged)' : n(value, digits));

/** Every input of the circuit with its unit, in the order of the inputs form. */
/** `currency`: the team's (teams.currency), named with the energy price; '' leaves the price unlabelled. */
export function inputRows(inputs: SheetInputs, currency = ''): InputRow[] {
  const { circuit, fault, environment, installation, limits, economics } = inputs;
  const rows: InputRow[] = [
    { section: 'Circuit', label: 'Design current', value: n(circuit.designCurrentA), unit: 'A' },
    { section: 'Circuit', label: 'Voltage U0 (line to neutral)', value: n(circuit.nominalVoltageV), unit: 'V' },
    { section: 'Circuit', label: 'Phases', value: String(circuit.phases), unit: '' },
    { section: 'Circuit', label: 'Frequency', value: circuit.frequencyHz === 0 ? '0 (DC)' : n(circuit.frequencyHz), unit: 'Hz' },
    { section: 'Circuit', label: 'Route length', value: n(circuit.lengthM), unit: 'm' },
    { section: 'Circuit', label: 'Power factor', value: n(circuit.powerFactor, 3), unit: '' },
    { section: 'Circuit', label: 'Allowed voltage drop', value: circuit.maxVoltageDropPercent === null ? 'none set' : n(circuit.maxVoltageDropPercent, 3), unit: '%' },
    {
      section: 'Circuit',
      label: 'Reactance',
      value: circuit.reactanceOhmPerM === null ? 'not entered (0.08 default, flagged)' : n(circuit.reactanceOhmPerM * 1000, 4),
      unit: 'mΩ/m',
    },
    { section: 'Fault', label: 'Short circuit checked', value: fault.checked ? 'yes' : 'no', unit: '' },
  ];
  if (fault.checked) {
    rows.push(
      { section: 'Fault', label: 'Prospective fault current', value: n(fault.currentA / 1000), unit: 'kA' },
      { section: 'Fault', label: 'Clearing time', value: n(fault.durationS, 3), unit: 's' },
    );
  }
  rows.push(
    { section: 'Surroundings', label: 'Ambient', value: orAssumed(environment.ambientC), unit: '°C' },
    { section: 'Surroundings', label: 'Air speed', value: n(environment.windSpeedMPerS, 3), unit: 'm/s' },
    { section: 'Surroundings', label: 'Outdoors in sun', value: environment.outdoorSun ? 'yes' : 'no', unit: '' },
  );
  if (environment.outdoorSun) {
    rows.push(
      { section: 'Surroundings', label: 'Sun irradiance', value: n(environment.irradianceWPerM2), unit: 'W/m²' },
      { section: 'Surroundings', label: 'Solar absorptivity', value: orAssumed(environment.solarAbsorptivity, 3), unit: '' },
    );
  }
  rows.push({ section: 'Installation', label: 'Installation', value: INSTALLATION_WORDS[installation.kind], unit: '' });
  if (installation.kind === 'cable-in-air' || installation.kind === 'buried' || (installation.kind === 'enclosure' && installation.enclosureInside === 'cable-in-air')) {
    const others = installation.otherCircuits;
    rows.push(
      { section: 'Installation', label: 'Formation', value: FORMATION_WORDS[installation.formation], unit: '' },
      { section: 'Installation', label: 'Cable spacing (axis to axis)', value: installation.spacingM === null ? 'touching' : n(installation.spacingM * 1000), unit: 'mm' },
      { section: 'Installation', label: 'Other circuits beside it', value: String(others.length), unit: '' },
      {
        section: 'Installation',
        label: 'Spacing between circuits and runs (centre to centre)',
        value: installation.circuitSpacingM === null ? 'touching' : n(installation.circuitSpacingM * 1000),
        unit: 'mm',
      },
      { section: 'Installation', label: 'Row of circuits', value: installation.circuitRow, unit: '' },
    );
    others.forEach((o, i) => rows.push({ section: 'Installation', label: `Other circuit ${i + 1}`, value: otherCircuitWords(o, i), unit: '' }));
    if (installation.formation !== 'trefoil') rows.push({ section: 'Installation', label: 'Phases transposed', value: installation.transposed ? 'yes' : 'no', unit: '' });
  }
  if (installation.kind === 'buried') {
    rows.push(
      { section: 'Installation', label: 'Depth of the cable axis', value: n(installation.depthM, 3), unit: 'm' },
      { section: 'Installation', label: 'Soil thermal resistivity', value: orAssumed(installation.soilResistivityKmPerW, 3), unit: 'K·m/W' },
      { section: 'Installation', label: 'Ground temperature', value: orAssumed(installation.groundC), unit: '°C' },
      {
        section: 'Installation',
        label: 'Ducts',
        value: installation.duct.used ? `${installation.duct.material}, ${n(installation.duct.innerDiameterM * 1000)} / ${n(installation.duct.outerDiameterM * 1000)}` : 'none',
        unit: installation.duct.used ? 'mm inside / outside' : '',
      },
      {
        section: 'Installation',
        label: 'Backfill',
        value: installation.backfill.used
          ? `${n(installation.backfill.widthM, 3)} × ${n(installation.backfill.heightM, 3)} m at ${n(installation.backfill.centreDepthM ?? installation.depthM, 3)} m, ${n(installation.backfill.resistivityKmPerW, 3)}`
          : 'none',
        unit: installation.backfill.used ? 'K·m/W' : '',
      },
    );
  }
  if (installation.kind === 'enclosure') {
    rows.push(
      { section: 'Installation', label: 'Inside the enclosure', value: INSTALLATION_WORDS[installation.enclosureInside], unit: '' },
      { section: 'Installation', label: 'Enclosure derating', value: n(installation.enclosureDerating, 3), unit: '' },
    );
  }
  // The bus-bar system, the protection and the harmonics (sheet version 6).
  rows.push(...systemInputRows(inputs));
  rows.push(
    { section: 'Limits', label: 'Own temperature limit', value: limits.temperatureLimitC === null ? 'none (material limits govern)' : n(limits.temperatureLimitC), unit: '°C' },
    { section: 'Limits', label: 'Own limit replaces material limits', value: limits.raiseMaterialLimit ? 'yes' : 'no', unit: '' },
    { section: 'Limits', label: 'Grouping factor', value: n(limits.groupingFactor, 3), unit: '' },
    { section: 'Life-cycle cost', label: 'Included', value: economics.included ? 'yes' : 'no', unit: '' },
  );
  if (economics.included) {
    rows.push(
      { section: 'Life-cycle cost', label: 'Loss load factor', value: n(economics.lossLoadFactor, 3), unit: '' },
      { section: 'Life-cycle cost', label: 'Hours per year', value: n(economics.hoursPerYear), unit: 'h' },
      { section: 'Life-cycle cost', label: 'Energy price', value: economics.energyPricePerKWh, unit: currency ? `${currency} per kWh` : 'per kWh' },
      { section: 'Life-cycle cost', label: 'Discount rate', value: n(economics.discountRatePercent, 3), unit: '%' },
      { section: 'Life-cycle cost', label: 'Years', value: String(economics.years), unit: 'years' },
      { section: 'Life-cycle cost', label: 'Load growth', value: n(economics.loadGrowthPercent, 3), unit: '% a year' },
      { section: 'Life-cycle cost', label: 'Energy price growth', value: n(economics.energyPriceGrowthPercent, 3), unit: '% a year' },
    );
  }
  return rows;
}

/** One candidate of the comparison with its result; numbers unrounded (the snapshot's own), SI. */
export interface CandidateRecord {
  id: string;
  label: string;
  kind: 'cable' | 'bar';
  material: string;
  arrangement: string;
  sectionPerPhaseMm2: number;
  chosen: boolean;
  evaluated: boolean;
  state: string;
  /** The shown state, or 'error' when the candidate has no result. */
  stateKey: ResultState | 'error';
  passes: boolean | null;
  hotSpotC: number | null;
  limitC: number | null;
  limitSource: string | null;
  marginK: number | null;
  marginPercent: number | null;
  ampacityA: number | null;
  /** True when the candidate may carry no current at all (see candidateRow). */
  noCurrentAllowed: boolean;
  /** Null when not evaluated or when no current is allowed (utilisationText says which). */
  utilisationPercent: number | null;
  utilisationText: string;
  lossWPerM: number | null;
  voltageDropPercent: number | null;
  /** The sheet's voltage-drop limit, per cent; null when none is set (the grid shows the verdict beside the figure). */
  voltageDropLimitPercent: number | null;
  shortCircuit: string;
  massKg: number | null;
  materialCost: string | null;
  lifeCycleCost: string | null;
  flagCounts: CandidateRow['flagCounts'];
  flagCodes: string[];
  marks: string[];
  /** The governing cable of the rated group in words, its conductor temperature (°C) and the method (candidateRow). */
  governingCable: string | null;
  governingCableC: number | null;
  groupMethod: string | null;
  /** The bus-bar system and the protection (candidateRow): the governing bar, the forces, the device's coordination. */
  hottestBar: string | null;
  forces: CandidateRow['forces'];
  stressRatio: number | null;
  supportForceN: number | null;
  supportForceRatio: number | null;
  deviceCurrentA: number | null;
  coordination: CandidateRow['coordination'];
  smallestDeviceA: number | null;
  disconnection: CandidateRow['disconnection'];
  error: string | null;
}

/** The results the records are read from: a saved snapshot, or the browser's live comparison. */
export interface CandidateResults extends ComparisonMarks {
  evaluations: readonly CandidateEvaluation[];
  chosenCandidateId: string | null;
}

/**
 * Every candidate of a sheet with its result, in the sheet's order. The figures come from
 * candidateRow; `missing` is the word for a candidate with no result yet ('No saved result' for a
 * snapshot, 'Computing…' on the live sheet).
 */
export function candidateRecords(candidates: SheetCandidate[], results: CandidateResults | null, missing = 'No saved result', otherLabels: readonly string[] = []): CandidateRecord[] {
  return candidates.map((candidate) => {
    const e: CandidateEvaluation | undefined = results?.evaluations.find((x) => x.id === candidate.id);
    const base = {
      id: candidate.id,
      label: candidate.label,
      kind: candidate.kind,
      material: candidate.material,
      arrangement: describeArrangement(candidate),
      sectionPerPhaseMm2: sectionPerPhaseMm2(candidate),
      chosen: results?.chosenCandidateId === candidate.id,
    };
    if (!e || !e.ok) {
      return {
        ...base,
        evaluated: false,
        state: e ? 'Not evaluated' : missing,
        stateKey: 'error',
        passes: null,
        hotSpotC: null,
        limitC: null,
        limitSource: null,
        marginK: null,
        marginPercent: null,
        ampacityA: null,
        noCurrentAllowed: false,
        utilisationPercent: null,
        utilisationText: '',
        lossWPerM: null,
        voltageDropPercent: null,
        voltageDropLimitPercent: null,
        shortCircuit: '',
        massKg: null,
        materialCost: null,
        lifeCycleCost: null,
        flagCounts: { blocker: 0, review: 0, note: 0 },
        flagCodes: [],
        marks: [],
        governingCable: null,
        governingCableC: null,
        groupMethod: null,
        hottestBar: null,
        forces: null,
        stressRatio: null,
        supportForceN: null,
        supportForceRatio: null,
        deviceCurrentA: null,
        coordination: null,
        smallestDeviceA: null,
        disconnection: null,
        error: e && !e.ok ? (e.error.field ? plainMessage(e.error.message, e.error.field) : e.error.message) : null,
      };
    }
    const row = candidateRow(e, results ?? {}, otherLabels);
    return {
      ...base,
      evaluated: true,
      state: row.state,
      stateKey: row.stateKey,
      passes: row.passes,
      hotSpotC: row.hotSpotC,
      limitC: row.limitC,
      limitSource: row.limitSource,
      marginK: row.marginK,
      marginPercent: row.marginPercent,
      ampacityA: row.ampacityA,
      noCurrentAllowed: row.noCurrentAllowed,
      // Empty when no current is allowed: a spreadsheet reads that better than a huge number.
      utilisationPercent: row.utilisationPercent,
      utilisationText: row.utilisationText,
      lossWPerM: row.lossWPerM,
      voltageDropPercent: row.voltageDropPercent,
      voltageDropLimitPercent: row.voltageDropLimitPercent,
      shortCircuit: row.shortCircuit,
      massKg: row.massKg,
      materialCost: row.materialCost,
      lifeCycleCost: row.lifeCycleCost,
      flagCounts: row.flagCounts,
      flagCodes: row.flagCodes,
      marks: row.marks,
      governingCable: row.governingCable,
      governingCableC: row.governingCableC,
      groupMethod: row.groupMethod,
      hottestBar: row.hottestBar,
      forces: row.forces,
      stressRatio: row.stressRatio,
      supportForceN: row.supportForceN,
      supportForceRatio: row.supportForceRatio,
      deviceCurrentA: row.deviceCurrentA,
      coordination: row.coordination,
      smallestDeviceA: row.smallestDeviceA,
      disconnection: row.disconnection,
      error: null,
    };
  });
}

/** Columns of the candidate exports: header with unit, and the cell of a record. */
export const CANDIDATE_EXPORT_COLUMNS: ReadonlyArray<{ header: string; value: (r: CandidateRecord) => string | number | null }> = [
  { header: 'candidate id', value: (r) => r.id },
  { header: 'candidate', value: (r) => r.label },
  { header: 'chosen', value: (r) => (r.chosen ? 'yes' : 'no') },
  { header: 'kind', value: (r) => r.kind },
  { header: 'material', value: (r) => r.material },
  { header: 'arrangement', value: (r) => r.arrangement },
  { header: 'section per phase (mm²)', value: (r) => r.sectionPerPhaseMm2 },
  { header: 'state', value: (r) => r.state },
  { header: 'hot spot (°C)', value: (r) => r.hotSpotC },
  { header: 'limit (°C)', value: (r) => r.limitC },
  { header: 'limit set by', value: (r) => r.limitSource },
  { header: 'margin (K)', value: (r) => r.marginK },
  { header: 'margin (%)', value: (r) => r.marginPercent },
  { header: 'ampacity (A)', value: (r) => r.ampacityA },
  { header: 'utilisation (%)', value: (r) => r.utilisationPercent },
  { header: 'loss of the circuit (W/m)', value: (r) => r.lossWPerM },
  { header: 'voltage drop (%)', value: (r) => r.voltageDropPercent },
  { header: 'short circuit', value: (r) => r.shortCircuit },
  { header: 'conductor mass (kg)', value: (r) => r.massKg },
  // Amounts as numbers rounded to cents; the currency is in the header (candidateExportHeaders).
  { header: 'material cost', value: (r) => moneyNumber(r.materialCost) },
  { header: 'life-cycle cost', value: (r) => moneyNumber(r.lifeCycleCost) },
  { header: 'governing cable', value: (r) => r.governingCable },
  { header: 'governing cable conductor (°C)', value: (r) => r.governingCableC },
  { header: 'group rated by', value: (r) => r.groupMethod },
  { header: 'governing bar', value: (r) => r.hottestBar },
  { header: 'short-circuit forces', value: (r) => r.forces },
  { header: 'stress ratio', value: (r) => r.stressRatio },
  { header: 'support force (N)', value: (r) => r.supportForceN },
  { header: 'support force / rated', value: (r) => r.supportForceRatio },
  { header: 'device I_n or I_r (A)', value: (r) => r.deviceCurrentA },
  { header: 'overload coordination', value: (r) => r.coordination },
  { header: 'smallest coordinated device (A)', value: (r) => r.smallestDeviceA },
  { header: 'disconnection', value: (r) => r.disconnection },
  { header: 'assumption flags', value: (r) => flagTitleList(r.flagCodes) },
  // The codes too, for a spreadsheet that filters on them (they are the API's stable keys).
  { header: 'flag codes', value: (r) => r.flagCodes.join(' ') },
  { header: 'marked', value: (r) => r.marks.join('; ') },
  { header: 'not evaluated because', value: (r) => r.error },
];

export interface ChosenResultRow {
  label: string;
  value: string;
}

/** The chosen candidate's results in words and numbers with units, SI. */
export function chosenResultRows(e: CandidateEvaluationOk, lengthM: number, otherLabels: readonly string[] = [], currency = ''): ChosenResultRow[] {
  const money = (v: string | null) => (currency ? formatMoney(v, currency) : (v ?? '—'));
  const t = (c: number | null | undefined) => (c === null || c === undefined ? '—' : formatQuantity(c, 'temperature', 'si'));
  const sc = e.shortCircuit;
  const vd = e.voltageDrop;
  const row = candidateRow(e);
  return [
    { label: 'Result', value: row.state },
    { label: 'Design current', value: `${n(e.designCurrentA)} A` },
    { label: 'Hot spot', value: e.hotSpotC === null ? 'no steady state (thermal runaway)' : t(e.hotSpotC) },
    { label: 'Limit', value: `${t(e.limit.temperatureC)} (${e.limit.layer ?? e.limit.source})` },
    { label: 'Margin', value: e.marginK === null ? '—' : `${formatQuantity(e.marginK, 'temperatureRise', 'si')}${e.marginPercent === null ? '' : ` (${n(e.marginPercent, 3)} % of the allowed rise)`}` },
    { label: 'Ampacity', value: `${n(e.ampacityA)} A` },
    ...groupRows(e, otherLabels),
    { label: 'Utilisation', value: row.utilisationText },
    { label: 'Ambient used', value: t(e.ambientC) },
    { label: 'Conductor temperature (mean)', value: t(e.conductorC) },
    { label: 'AC/DC resistance ratio', value: n(e.acFactor, 4) },
    {
      label: 'Loss of the circuit',
      value: e.lossWPerM === null ? '—' : `${lossPerLengthWords(e.lossWPerM, 'si')}, ${formatPower(e.lossWPerM * lengthM)} over the route`,
    },
    {
      label: 'Voltage drop (IEC 60364-5-52 Annex G)',
      value: `${n(vd.volts, 3)} V, ${n(vd.percent, 3)} %${vd.limitPercent === undefined ? '' : ` of ${n(vd.limitPercent, 3)} % allowed: ${vd.percent <= vd.limitPercent ? 'passes' : 'fails'}`}`,
    },
    {
      label: 'Short circuit (IEC 60949 adiabatic)',
      value: !sc.checked
        ? `not checked${sc.reason ? `: ${sc.reason}` : ''}`
        : `${n((sc.currentA ?? 0) / 1000)} kA for ${n(sc.durationS ?? 0, 3)} s: ${sc.finalC === null || sc.finalC === undefined ? 'beyond the method' : t(sc.finalC)} of ${t(sc.limitC)} allowed; needs at least ${formatQuantity(sc.minimumSectionMm2 ?? 0, 'areaMm2', 'si')}: ${sc.withstands ? 'passes' : 'fails'}`,
    },
    { label: 'Conductor mass', value: `${n(e.massKg)} kg` },
    { label: 'Material cost / life-cycle cost', value: `${money(e.materialCost)} / ${money(e.lifeCycleCost)}` },
  ];
}

/** The governing cable and the group's method, for a cable with a rated cross-section. */
function groupRows(e: CandidateEvaluationOk, otherLabels: readonly string[]): ChosenResultRow[] {
  if (!e.group) return [];
  const governing = governingCableOf(e.group, otherLabels);
  return [
    {
      label: 'Governing cable',
      value: governing ? `${governing.words}${governing.conductorC === null ? '' : `, ${formatQuantity(governing.conductorC, 'temperature', 'si')}`}` : 'none (no steady state)',
    },
    { label: 'Group rated by', value: `${groupMethodWords(e.group)}. ${e.group.method}.` },
  ];
}

/** What the result rests on, in our words, naming the published methods (physics.md). */
export const METHOD_LINES: readonly string[] = [
  'Heat balance: steady one-dimensional finite-volume method (Patankar 1980) through the conductor and its coverings, with temperature-dependent Joule heating ρ(T) = ρ20[1 + α20(T − 20 °C)] (IEC 60287-1-1 Table 1 coefficients).',
  'Surfaces: natural convection by the Churchill and Chu (1975) correlations, forced convection by Churchill and Bernstein (1977) or flat-plate correlations, radiation with the Stefan–Boltzmann law, absorbed sun per IEC 60287-2-1 where outdoors.',
  'Cables are rated as the group they lie in: in free air by the IEC 60287-2-1 §4.2.1 surface law of the arrangement (an isolated cable by the correlations and radiation above); in the ground by superposition with images (IEC 60287-2-1 §4.2.3), each cable’s heat at its own temperature, the closed forms of §4.2.4 for a touching trefoil or row, ducts and backfill by §4.2.7; the hottest cable governs. Skin and proximity effects by IEC 60287-1-1 §2.1, screen losses by §2.3 where the screen is given.',
  'Bus bars are rated as the three-phase system they form: each bar’s share of the current and its R_ac/R_dc by the filament (partial-inductance) method, each bar of a pack in its own heat balance (outer faces as plates, gaps as channels by Bar-Cohen and Rohsenow 1984, radiation by view factors), the hottest bar governing; the maker’s AC/DC ratio where entered. Short-circuit forces on the bars and supports by IEC 60865-1 with i_p from IEC 60909-0, where the supports are described.',
  'Protection, where a device is given: overload coordination by IEC 60364-4-43 §433.1 with I_z the rated ampacity above, automatic disconnection by IEC 60364-4-41 §411 with the conductors at their fault temperature, the protective conductor by IEC 60364-5-54 §543.1, third harmonics by IEC 60364-5-52 Annex E.',
  'Ampacity: the highest current at which the governing temperature stays at or under its limit, found by bracketing; cross-checked against an IEC 60287-style closed form.',
  'Voltage drop: IEC 60364-5-52 Annex G. Short circuit: IEC 60949 adiabatic method. Life-cycle cost: IEC 60287-3-2 loss-cost approach, where included.',
];

export function formatDate(value: Date | string | null | undefined): string {
  if (!value) return '—';
  const date = typeof value === 'string' ? new Date(value) : value;
  return `${date.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

/** Headers of the candidate export, the money columns with the team's currency. */
export const MONEY_EXPORT_HEADERS: ReadonlySet<string> = new Set(['material cost', 'life-cycle cost']);
export function candidateExportHeaders(currency: string): string[] {
  return CANDIDATE_EXPORT_COLUMNS.map((c) => (MONEY_EXPORT_HEADERS.has(c.header) ? withCurrency(c.header, currency) : c.header));
}
