/**
 * R_ac/R_dc of a prepared candidate at a conductor temperature, with the flags its method needs.
 * Cables: IEC 60287-1-1 §2.1 skin and proximity. Bars: the maker's ratio, or the plane-conductor
 * solution (a lower bound, flagged).
 */
import { acResistanceOf } from '../resistance';
import { CURRENT_DISTRIBUTION_METHOD } from '../busbar';
import { singleBarAcFactor, type BusbarSystemModel } from './busbarSystem';
import { DEFAULT_TEXT, MODEL_TEXT } from './flagText';
import { FlagSet } from './flags';
import type { PreparedCandidate, PreparedConditions } from './prepared';

export interface AcFactorDetail {
  factor: number;
  method: string;
  ys?: number;
  yp?: number;
  xs?: number;
  xp?: number | null;
  skinDepthM?: number;
}

export type AcFactorFunction = (temperatureC: number, flags?: FlagSet) => AcFactorDetail;

export function acFactorFunction(c: PreparedCandidate, k: PreparedConditions, busbar?: BusbarSystemModel): AcFactorFunction {
  if (k.frequencyHz === 0) return () => ({ factor: 1, method: 'direct current' });
  if (c.kind === 'bar') {
    if (c.acResistanceRatio !== undefined) {
      const ratio = c.acResistanceRatio;
      return () => ({ factor: ratio, method: "bar maker's R_ac/R_dc" });
    }
    if (!busbar) throw new Error('a bar needs its bus-bar system for its AC resistance');
    const factorAt = singleBarAcFactor(busbar, k.ambientC, c.contactLimit.temperatureC);
    return (temperatureC, flags) => {
      const factor = factorAt(temperatureC);
      flags?.add('BAR_AC_FACTOR_COMPUTED', MODEL_TEXT.barAcFactorComputed(factor, !busbar.phaseSpacingAssumed), { ratio: factor });
      return { factor, method: CURRENT_DISTRIBUTION_METHOD };
    };
  }
  const dc = c.conductorDiameterM;
  const De = c.outerDiameterM;
  let spacing: number;
  let cables: 2 | 3;
  let spacingAssumed = false;
  if (c.cores > 1) {
    // IEC 60287-1-1 §2.1.4: for multi-core cables s = d_c + t, t the insulation between conductors.
    spacing = dc + 2 * c.layers[0].thicknessM;
    cables = c.loadedCores >= 3 ? 3 : 2;
  } else {
    cables = k.phases === 3 ? 3 : 2;
    if (k.spacingM === undefined) {
      spacing = De; // touching: the closest they can lie, the largest proximity effect
      spacingAssumed = true;
    } else {
      spacing = Math.max(k.spacingM, De);
    }
  }
  return (temperatureC, flags) => {
    const r = acResistanceOf({
      r20OhmPerM: c.r20,
      alpha20PerK: c.alpha20,
      temperatureC,
      frequencyHz: k.frequencyHz,
      ks: c.ks ?? 1,
      kp: c.kp ?? 1,
      // Every circuit has at least two current-carrying conductors near each other (spacing ≥ d_c by construction).
      proximity: { conductorDiameterM: dc, spacingM: spacing, cables },
    });
    if (flags) {
      if (spacingAssumed) {
        flags.add('PROXIMITY_SPACING_ASSUMED', DEFAULT_TEXT.proximitySpacing(De));
      }
      if (r.skinRange !== 'xs<=2.8' || !r.proximityInRange) {
        flags.add('AC_FORMULA_OUT_OF_RANGE', MODEL_TEXT.acFormulaRange(r.xs, r.xp), { xs: r.xs });
      }
    }
    return { factor: r.acFactor, method: 'IEC 60287-1-1 §2.1 (skin and proximity)', ys: r.ys, yp: r.yp, xs: r.xs, xp: r.xp };
  };
}
