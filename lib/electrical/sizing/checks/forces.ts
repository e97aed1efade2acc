/** Check: short-circuit forces on a bus-bar system, IEC 60865-1 (lib/electrical/busbar/forces.ts). */
import { systemForces } from '../busbarSystem';
import type { SizingContext } from '../context';
import { MODEL_TEXT } from '../flagText';
import type { ForcesResult } from '../types';

export function forcesCheck(ctx: SizingContext): ForcesResult | null {
  const { cand, cond, busbar, flags } = ctx;
  if (cand.kind !== 'bar' || !busbar || !cond.fault) return null;
  const r = systemForces(busbar, cand, cond);
  if (!r) {
    flags.add('FORCES_NOT_CHECKED', MODEL_TEXT.forcesNotChecked());
    return null;
  }
  for (const f of r.flags) flags.add(f.code, f.message);
  return {
    method: r.method,
    kappa: r.kappa,
    peakCurrentA: r.peakCurrentA,
    mainForceN: r.mainForceN,
    totalStressPa: r.totalStressPa,
    yieldStrengthPa: r.yieldStrengthPa,
    stressRatio: r.stressRatio,
    subConductorStressRatio: r.subConductorStressRatio,
    supportForceAN: r.supportForceAN,
    supportForceBN: r.supportForceBN,
    supportForceRatio: r.supportForceRatio,
    passes: r.passes,
    largestSupportSpacingM: r.largestSupportSpacingM,
    largestSupportSpacingLimitedBy: r.largestSupportSpacingLimitedBy,
  };
}
