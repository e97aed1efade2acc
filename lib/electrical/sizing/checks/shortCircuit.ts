/** Check: short-circuit withstand by the IEC 60949 adiabatic method. */
import { adiabaticK, minimumSection, shortCircuitFinalTemperature } from '../../shortCircuit';
import type { SizingContext } from '../context';
import { MODEL_TEXT, SHORT_CIRCUIT_TEXT } from '../flagText';

/** Short-circuit temperature of a bare copper or aluminium bar and its supports when none is given, °C (common practice, from memory). */
export const BARE_BAR_SHORT_CIRCUIT_LIMIT_C = 200;
/** Where that figure comes from, as the catalogue cites it beside the value. */
export const BARE_BAR_SHORT_CIRCUIT_LIMIT_SOURCE =
  'IEC 60865-1 recommended highest conductor temperature in a short circuit for bare copper and aluminium (from memory); the supports and joints may allow less: check their rating';
import type { ShortCircuitCheck } from '../types';

export function shortCircuitCheck(ctx: SizingContext, hotSpotC: number | null): ShortCircuitCheck {
  const { cand, cond, flags } = ctx;
  const fault = cond.fault;
  if (!fault) return { checked: false, reason: 'no fault current and duration entered' };
  let scLimit = cand.shortCircuitLimitC;
  if (scLimit === undefined && cand.kind === 'bar') {
    // A bare bar's fault limit is its metal's and its supports': a default, said so.
    scLimit = BARE_BAR_SHORT_CIRCUIT_LIMIT_C;
    flags.add('BAR_SHORT_CIRCUIT_LIMIT_DEFAULTED', MODEL_TEXT.barShortCircuitLimitDefaulted(scLimit), { limitC: scLimit });
  }
  if (scLimit === undefined) {
    flags.add('SHORT_CIRCUIT_NOT_CHECKED', SHORT_CIRCUIT_TEXT.noLimit(cand.kind));
    return { checked: false, reason: 'no short-circuit temperature limit for the covering', currentA: fault.currentA, durationS: fault.durationS };
  }
  const initialC = fault.initialFrom === 'operating' && hotSpotC !== null ? hotSpotC : cand.contactLimit.temperatureC;
  const finalRaw = shortCircuitFinalTemperature({
    material: cand.material,
    current: fault.currentA / cand.conductorsPerPhase,
    duration: fault.durationS,
    section: cand.sectionPerConductorMm2,
    initial: initialC,
  });
  const finalC = Number.isFinite(finalRaw) ? finalRaw : null;
  const withstands = finalC !== null && finalC <= scLimit;
  const check: ShortCircuitCheck = {
    checked: true,
    currentA: fault.currentA,
    durationS: fault.durationS,
    initialC,
    finalC,
    limitC: scLimit,
    sectionPerPhaseMm2: cand.sectionPerPhaseMm2,
    withstands,
  };
  if (scLimit > initialC) {
    const kFactor = adiabaticK({ material: cand.material, initial: initialC, final: scLimit });
    const minimumMm2 = minimumSection({ material: cand.material, current: fault.currentA, duration: fault.durationS, initial: initialC, final: scLimit });
    // A limit a hair above the starting temperature leaves k ≈ 0 and no finite section: say so
    // in the flag instead of reporting an infinite section.
    if (kFactor > 0 && Number.isFinite(minimumMm2)) {
      check.kFactor = kFactor;
      check.minimumSectionMm2 = minimumMm2;
    }
  }
  if (!withstands) {
    flags.add(
      'SHORT_CIRCUIT_EXCEEDED',
      SHORT_CIRCUIT_TEXT.exceeded({ currentA: fault.currentA, durationS: fault.durationS, initialC, finalC, limitC: scLimit, minimumSectionMm2: check.minimumSectionMm2 }),
      { finalC: finalC ?? Number.MAX_VALUE, limitC: scLimit },
    );
  }
  return check;
}
