/**
 * "Open as sizing sheet": a schedule row → the inputs of a sizing sheet (lib/sheet), with the
 * chosen size and its neighbours as candidates, so the designer can look at one circuit in full
 * (profile, comparison, review) and take it through sign-off.
 */
import { defaultSheetInputs, sheetInputsSchema, type SheetInputs } from '../sheet/schema';
import type { Candidate } from '../electrical/sizing/types';
import { DEFAULT_FREQUENCY_HZ, expandFamily, rowDevice, SUPPORTS_OF, type CircuitSizing } from './size';
import type { ScheduleRow } from './row';

/** Sizes either side of the chosen one put on the sheet for comparison. */
const NEIGHBOURS = 2;

export function sheetTitleOf(row: ScheduleRow): string {
  const route = [row.from, row.to].filter((s) => s !== '').join(' → ');
  return (route ? `${row.circuitTag}: ${route}` : row.circuitTag).slice(0, 200);
}

export function scheduleRowToSheetInputs(row: ScheduleRow, sizing: CircuitSizing | null, familyCandidates: readonly Candidate[]): SheetInputs {
  const base = defaultSheetInputs(row.installation);
  const sizes = expandFamily(familyCandidates, row.maxParallel);
  const chosenId = sizing?.status === 'sized' ? sizing.chosen.candidateId : sizing?.status === 'none_passes' ? (sizing.largest?.candidateId ?? null) : null;
  let at = chosenId === null ? -1 : sizes.findIndex((c) => c.id === chosenId);
  if (at < 0) at = sizing?.status === 'none_passes' ? sizes.length - 1 : 0;
  const picked = sizes.slice(Math.max(0, at - NEIGHBOURS), at + NEIGHBOURS + 1);
  const device = rowDevice(row);
  const inputs: SheetInputs = {
    ...base,
    circuit: {
      ...base.circuit,
      designCurrentA: row.designCurrentA,
      nominalVoltageV: row.nominalVoltageV,
      phases: row.phases,
      frequencyHz: row.frequencyHz ?? DEFAULT_FREQUENCY_HZ,
      lengthM: row.lengthM,
      powerFactor: row.powerFactor,
      maxVoltageDropPercent: row.maxVoltageDropPercent,
      reactanceOhmPerM: null,
    },
    fault:
      row.faultCurrentKA !== null && row.clearingTimeS !== null
        ? { checked: true, currentA: row.faultCurrentKA * 1000, durationS: row.clearingTimeS }
        : { ...base.fault, checked: false },
    environment: { ...base.environment, ambientC: row.installation === 'buried' ? null : row.ambientC },
    installation: {
      ...base.installation,
      kind: row.installation,
      ...(row.installation === 'buried' ? { depthM: row.depthM as number, groundC: row.ambientC } : {}),
      // The cross-section of the row (rowArrangement in ./size.ts): the same cable beside it, unnamed.
      formation: row.formation ?? base.installation.formation,
      spacingM: row.spacingMm != null ? row.spacingMm / 1000 : null,
      circuitSpacingM: row.circuitSpacingMm != null ? row.circuitSpacingMm / 1000 : null,
      circuitRow: 'horizontal',
      otherCircuits:
        (row.otherCircuits ?? 0) > 0 && row.otherCircuitCurrentA != null
          ? Array.from({ length: row.otherCircuits as number }, () => ({ label: '', currentA: row.otherCircuitCurrentA as number, sameCable: true, externalDiameterM: null, lossWPerM: null }))
          : [],
    },
    limits: { temperatureLimitC: row.temperatureLimitC, raiseMaterialLimit: false, raiseJustification: '', groupingFactor: row.groupingFactor ?? 1 },
    // The bar system of the row (rowBusbarSystem in ./size.ts), what it gives; the rest as a new sheet has it.
    busbarSystem: {
      ...base.busbarSystem,
      phaseSpacingM: row.phaseSpacingMm != null ? row.phaseSpacingMm / 1000 : null,
      supportSpacingM: row.supportSpanMm != null ? row.supportSpanMm / 1000 : null,
      supports: row.supports != null ? SUPPORTS_OF[row.supports] : null,
      supportStrengthN: row.supportStrengthN ?? null,
    },
    // The row's device (rowDevice in ./size.ts): coordination checked; the loop is the sheet's to enter.
    protection: device
      ? {
          ...base.protection,
          included: true,
          device: { ...base.protection.device, kind: device.kind, ratedCurrentA: device.ratedCurrentA, ...(device.kind === 'breaker-iec60898-1' ? { curve: device.curve } : {}) },
        }
      : base.protection,
    candidates: picked as SheetInputs['candidates'],
    chosenCandidateId: sizing?.status === 'sized' && picked.some((c) => c.id === chosenId) ? chosenId : null,
    notes: `Opened from a schedule, row ${row.rowNumber} (${row.circuitTag}).`,
  };
  // The sheet's own schema has the last word (it fills defaults such as parallel = 1).
  return sheetInputsSchema.parse(inputs);
}
