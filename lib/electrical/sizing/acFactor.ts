/**
 * R_ac/R_dc of a prepared candidate at a conductor temperature, with the flags its method needs.
 * Cables: IEC 60287-1-1 §2.1 skin and proximity. Bars: the maker's ratio, or the plane-conductor
 * solution (a lower bound, flagged).
 */
import { acResistance, barAcResistanceRatio, resistanceAt } from '../resistance';
import { FlagSet, fmt } from './flags';
import type { PreparedCandidate, PreparedConditions } from './prepare';
import type { BarCandidate, CableCandidate } from './types';

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

export function acFactorFunction(c: PreparedCandidate, k: PreparedConditions): AcFactorFunction {
  if (k.frequencyHz === 0) return () => ({ factor: 1, method: 'direct current' });
  if (c.kind === 'bar') {
    const bar = c.source as BarCandidate;
    if (bar.acResistanceRatio !== undefined) {
      const ratio = bar.acResistanceRatio;
      return () => ({ factor: ratio, method: "bar maker's R_ac/R_dc" });
    }
    const w = c.widthM as number;
    const t = c.thicknessM as number;
    return (temperatureC, flags) => {
      const resistance = resistanceAt({ r20: c.r20, alpha20: c.alpha20, temperature: temperatureC });
      const r = barAcResistanceRatio({ resistance, width: w, thickness: t, frequency: k.frequencyHz });
      flags?.add(
        'AC_FACTOR_LOWER_BOUND',
        `R_ac/R_dc = ${fmt(r.ratio, 4)} comes from the plane-conductor skin-effect formula, which ignores current crowding at the bar edges and the proximity of other bars and phases, so the true ratio is higher; enter the bar maker's ratio or accept this lower bound.`,
        { ratio: r.ratio },
      );
      return { factor: r.ratio, method: r.method, skinDepthM: r.skinDepthM };
    };
  }
  const cable = c.source as CableCandidate;
  const dc = c.conductorDiameterM as number;
  const De = c.outerDiameterM as number;
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
    const r = acResistance({
      r20: c.r20,
      alpha20: c.alpha20,
      temperature: temperatureC,
      frequency: k.frequencyHz,
      ks: cable.ks,
      kp: cable.kp,
      // Every circuit has at least two current-carrying conductors near each other.
      proximity: { conductorDiameter: dc, spacing, cables },
    });
    if (flags) {
      if (spacingAssumed) {
        flags.add('PROXIMITY_SPACING_ASSUMED', `No cable spacing was entered; for the proximity effect the cables are taken as touching (axis spacing ${fmt(De)} m), the cautious case.`);
      }
      if (r.skinRange !== 'xs<=2.8' || !r.proximityInRange) {
        flags.add('AC_FORMULA_OUT_OF_RANGE', `x_s = ${fmt(r.xs)}${r.xp === null ? '' : `, x_p = ${fmt(r.xp)}`}: beyond 2.8 the IEC 60287-1-1 skin-effect expression switches to its large-conductor forms and the proximity expression is outside its stated range; for such large conductors use the maker's AC resistance.`, { xs: r.xs });
      }
    }
    return { factor: r.acFactor, method: 'IEC 60287-1-1 §2.1 (skin and proximity)', ys: r.ys, yp: r.yp, xs: r.xs, xp: r.xp };
  };
}
