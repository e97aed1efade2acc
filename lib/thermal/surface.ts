/**
 * Heat exchange at a surface boundary (physics.md §2):
 *   q_s(Ts) = h_c(Ts)·(Ts − T∞) + εσ(Ts⁴ − Tsur⁴) − q_absorbed      [W/m², leaving]
 * and its linearisation for the outer iteration.
 */
import { ABSOLUTE_ZERO_C, KELVIN_OFFSET, STEFAN_BOLTZMANN } from './constants';
import { evaluateConvection } from './convection';
import { radiationCoefficient } from './radiation';
import type { ConvectionEvaluation } from './types';
import type { NormalizedSurface } from './normalized';

/** The exchange at one surface temperature, without its slope. */
export interface SurfaceFlux {
  /** °C at which it was evaluated */
  surfaceC: number;
  /** Net heat leaving per m² of surface, W/m². */
  netFlux: number;
  /** Secant convective coefficient, W/(m²·K). */
  hConv: number;
  /** Secant radiative coefficient, W/(m²·K). */
  hRad: number;
  convection: ConvectionEvaluation | undefined;
}

/** The exchange and its slope: what a linearisation about this temperature needs. */
export interface SurfaceExchange extends SurfaceFlux {
  /** d(netFlux)/dTs, W/(m²·K). */
  slope: number;
}

/** Guards the property table and T⁴ against an absurd intermediate iterate below 0 K. */
const LOWEST_EVALUATION_C = ABSOLUTE_ZERO_C + 1;

function convectiveFlux(s: NormalizedSurface, surfaceC: number, deltaK: number): number {
  return s.convection ? evaluateConvection(s.convection, surfaceC, s.ambient, deltaK).h * deltaK : s.fixedH * deltaK;
}

/**
 * Exchange at surface temperature `surfaceTemperatureC`. `deltaK` = Ts − T∞ may be passed when
 * the caller knows it more precisely than the difference of two temperatures near 300 would
 * give (the solver works in rises above a reference, so that tiny rises keep their digits).
 * No slope: the energy balance and the reported diagnostics need only the value, and the slope
 * costs two more evaluations of the correlation.
 */
export function surfaceFlux(s: NormalizedSurface, surfaceTemperatureC: number, deltaK?: number): SurfaceFlux {
  const clamped = surfaceTemperatureC < LOWEST_EVALUATION_C;
  const surfaceC = clamped ? LOWEST_EVALUATION_C : surfaceTemperatureC;
  const delta = clamped ? surfaceC - s.ambient : (deltaK ?? surfaceTemperatureC - s.ambient);
  return fluxAt(s, surfaceC, delta);
}

function fluxAt(s: NormalizedSurface, surfaceC: number, delta: number): SurfaceFlux {
  const convection = s.convection ? evaluateConvection(s.convection, surfaceC, s.ambient, delta) : undefined;
  const hConv = convection ? convection.h : s.fixedH;
  const hRad = s.emissivity > 0 ? radiationCoefficient({ emissivity: s.emissivity, surfaceC, surroundingsC: s.surroundings }) : 0;
  const netFlux = hConv * delta + hRad * (delta + (s.ambient - s.surroundings)) - s.absorbedFlux;
  return { surfaceC, netFlux, hConv, hRad, convection };
}

/** Exchange and slope at `surfaceTemperatureC` (see surfaceFlux for `deltaK`). */
export function evaluateSurface(s: NormalizedSurface, surfaceTemperatureC: number, deltaK?: number): SurfaceExchange {
  const clamped = surfaceTemperatureC < LOWEST_EVALUATION_C;
  const surfaceC = clamped ? LOWEST_EVALUATION_C : surfaceTemperatureC;
  const delta = clamped ? surfaceC - s.ambient : (deltaK ?? surfaceTemperatureC - s.ambient);
  const flux = fluxAt(s, surfaceC, delta);

  let convSlope = s.fixedH;
  if (s.convection) {
    // Correlations are piecewise (property table, regime switches), so differentiate
    // numerically. The step shrinks with ΔT so that near ΔT = 0, where h itself vanishes for some
    // correlations, the slope is that of the nearby curve and not of a chord across zero.
    const step = 1e-4 * Math.abs(delta) + 1e-9;
    const downStep = Math.min(step, surfaceC - LOWEST_EVALUATION_C);
    const up = convectiveFlux(s, surfaceC + step, delta + step);
    const down = convectiveFlux(s, surfaceC - downStep, delta - downStep);
    convSlope = (up - down) / (step + downStep);
  }
  let radSlope = 0;
  if (s.emissivity > 0) {
    const ts = surfaceC + KELVIN_OFFSET;
    radSlope = 4 * s.emissivity * STEFAN_BOLTZMANN * ts * ts * ts;
  }
  return {
    surfaceC,
    netFlux: flux.netFlux,
    hConv: flux.hConv,
    hRad: flux.hRad,
    convection: flux.convection,
    slope: convSlope + radSlope,
  };
}

/** True when the surface's exchange does not depend on its temperature (fixed h, no radiation). */
export function isLinearSurface(s: NormalizedSurface): boolean {
  return s.convection === undefined && s.emissivity === 0;
}

/**
 * The slope used to linearise q_s about Ts*: q_s(Ts) ≈ q_s(Ts*) + g·(Ts − Ts*).
 * Newton's choice g = dq_s/dTs converges quadratically for convex q_s (natural convection,
 * radiation); where the derivative falls below the secant coefficient (forced convection, whose h
 * drops slowly with film temperature) the secant h_c + h_r is used instead, which still converges
 * monotonically. The converged state does not depend on g — only the speed does. A tiny floor
 * keeps a plate at exactly ambient (h → 0) from cutting its heat path in the first pass.
 * (§2 of physics.md writes the radiation linearisation in secant form, h_r; both give the same
 * fixed point, and the secant coefficients are what the result reports.)
 */
export function linearisationSlope(e: SurfaceExchange, linear: boolean): number {
  // A linear surface is used as given: a floor there would invent a heat path.
  if (linear) return e.slope;
  return Math.max(e.slope, e.hConv + e.hRad, 1e-6);
}
