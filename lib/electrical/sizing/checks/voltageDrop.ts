/** Check: voltage drop, IEC 60364-5-52 Annex G, at the design current. */
import { ANNEX_G_DEFAULT_REACTANCE_OHM_PER_M, voltageDrop } from '../../voltageDrop';
import type { SizingContext } from '../context';
import { DEFAULT_TEXT, RESULT_TEXT } from '../flagText';
import type { CandidateEvaluationOk } from '../types';

export function voltageDropCheck(ctx: SizingContext): CandidateEvaluationOk['voltageDrop'] {
  const { cand, cond, flags } = ctx;
  const dc = cond.frequencyHz === 0;
  if (!dc && cond.reactanceOhmPerM === undefined && cand.kind === 'cable') flags.add('REACTANCE_ASSUMED', DEFAULT_TEXT.reactance());
  const reactance = dc ? 0 : cond.reactanceOhmPerM ?? ANNEX_G_DEFAULT_REACTANCE_OHM_PER_M / cand.parallel;
  const vd = voltageDrop({
    phases: cond.phases,
    current: cond.designCurrentA,
    length: cond.lengthM,
    section: cand.sectionPerPhaseMm2,
    material: cand.material,
    powerFactor: dc ? 1 : cond.powerFactor,
    reactance,
    nominalVoltage: cond.nominalVoltageV,
  });
  if (cond.maxVoltageDropPercent === undefined) return vd;
  if (vd.percent > cond.maxVoltageDropPercent) {
    flags.add('VOLTAGE_DROP_EXCEEDED', RESULT_TEXT.voltageDropExceeded(vd.percent, cond.maxVoltageDropPercent), { percent: vd.percent });
  }
  return { ...vd, limitPercent: cond.maxVoltageDropPercent };
}
