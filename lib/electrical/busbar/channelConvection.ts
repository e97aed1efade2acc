/**
 * Natural convection in a vertical channel between two parallel plates, open at the bottom and
 * the top (the gap between two bars on edge, or between two packs).
 *
 * Symbols: S the spacing (the gap), L the plate height (the bar width), Ra_S = gβΔT·S³/(να) with
 * ΔT the excess of the plates over the ambient (inlet) air, properties at the film temperature,
 * Nu_S = q″·S/(k·ΔT) per face.
 *
 * - Elenbaas (1942), symmetric isothermal plates:
 *     Nu_S = (1/24)·Ra_S(S/L)·[1 − exp(−35/(Ra_S·S/L))]^¾.
 * - Bar-Cohen & Rohsenow (1984), composite of the fully developed and the isolated-plate limits,
 *   symmetric isothermal plates:
 *     Nu_S = [C₁/(Ra_S·S/L)² + C₂/(Ra_S·S/L)^½]^−½,  C₁ = 576, C₂ = 2.873.
 *   (Both as given in Incropera et al., *Fundamentals of Heat and Mass Transfer*, §9.7, eqs.
 *   9.44–9.45 and Table 9.3 — from memory.) Fully developed limit Nu_S = Ra_S(S/L)/24, which is
 *   exact; isolated-plate limit Nu_L = 0.59·Ra_L^¼ (2.873^−½ = 0.590).
 *
 * Range: Elenbaas' measurements on plates in air span roughly 0.1 < Ra_S·S/L < 1e5 (from memory);
 * outside it the result is an extrapolation and is flagged. Both limits of the composite are
 * physical, so the extrapolation is mild, but it is still not measured.
 *
 * The isolated-plate limit 0.59·Ra^¼ is the empirical laminar plate constant; the similarity
 * solution for Pr = 0.7 (and Churchill & Chu's laminar form, 0.68 + 0.515·Ra^¼) is about 13 %
 * lower. A wide channel would thus out-cool an isolated plate computed by Churchill & Chu, which
 * cannot be: the pack model limits each channel face to the isolated-plate value of the same face
 * (packHeat.ts) and says so.
 */
import { rayleighNumber } from '../../thermal/convection';

export type ChannelCorrelation = 'bar-cohen-rohsenow' | 'elenbaas';

export const CHANNEL_RANGE = { min: 0.1, max: 1e5 } as const;

export function elenbaasNusselt(modifiedRayleigh: number): number {
  if (modifiedRayleigh <= 0) return 0;
  return (modifiedRayleigh / 24) * (1 - Math.exp(-35 / modifiedRayleigh)) ** 0.75;
}

export function barCohenRohsenowNusselt(modifiedRayleigh: number): number {
  if (modifiedRayleigh <= 0) return 0;
  return (576 / (modifiedRayleigh * modifiedRayleigh) + 2.873 / Math.sqrt(modifiedRayleigh)) ** -0.5;
}

export interface ChannelEvaluation {
  /** Heat-transfer coefficient of each face, referred to (T_face − T_ambient), W/(m²·K). */
  h: number;
  nusseltS: number;
  /** Ra_S·S/L. */
  modifiedRayleigh: number;
  inRange: boolean;
  correlation: string;
}

/** Channel of spacing `spacingM` between plates `heightM` tall, both `excessK` above the air at `ambientC`. */
export function channelConvection(args: {
  spacingM: number;
  heightM: number;
  excessK: number;
  ambientC: number;
  correlation?: ChannelCorrelation;
}): ChannelEvaluation {
  const correlation = args.correlation ?? 'bar-cohen-rohsenow';
  const deltaK = Math.abs(args.excessK);
  const { rayleigh, air } = rayleighNumber({ lengthM: args.spacingM, surfaceC: args.ambientC + deltaK, ambientC: args.ambientC });
  const modifiedRayleigh = (rayleigh * args.spacingM) / args.heightM;
  const nusseltS = correlation === 'elenbaas' ? elenbaasNusselt(modifiedRayleigh) : barCohenRohsenowNusselt(modifiedRayleigh);
  return {
    h: (nusseltS * air.conductivity) / args.spacingM,
    nusseltS,
    modifiedRayleigh,
    inRange: modifiedRayleigh >= CHANNEL_RANGE.min && modifiedRayleigh <= CHANNEL_RANGE.max && air.inTable,
    correlation:
      correlation === 'elenbaas'
        ? 'Elenbaas (1942) symmetric isothermal vertical channel'
        : 'Bar-Cohen & Rohsenow (1984) composite, symmetric isothermal vertical channel (C₁ = 576, C₂ = 2.873)',
  };
}
