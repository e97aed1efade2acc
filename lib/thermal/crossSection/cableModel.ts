/**
 * Each cable's own 1-D radial model (physics.md §1, §9), coupled to the 2-D field at the circle
 * that bounds it (the cable's outer surface, or its duct's).
 *
 * The cable's layers are not meshed in 2-D. In the coverings there is no source, so the exact
 * 1-D steady solution is a chain of cylindrical-layer resistances R_i = ρ_i/(2π)·ln(r_i/r_{i−1})
 * (Incropera §3.3.1) — what the 1-D finite-volume solver reproduces exactly on any mesh — with
 * heat entering the chain where it is generated:
 *   • the conductor's Joule loss W_c = I²R₂₀[1 + α(T_c − 20)]·F_ac at the conductor (its own small
 *     internal drop q‴r_c²/(4k) is neglected, as IEC 60287 does);
 *   • losses proportional to it (λ·W_c, screens and armour as in IEC 60287-1-1) and fixed losses
 *     at the outer face of a given covering;
 *   • the dielectric loss W_d inside the insulation. With the field of a coaxial cable, E ∝ 1/r,
 *     the loss density goes as 1/r², the heat crossing radius r is W_d·ln(r/r_i)/ln(r_o/r_i) and
 *     its drop across the layer is exactly W_d·R/2 — the "half of T1" of IEC 60287-1-1 eq. (1).
 * A duct adds the air T4′(θm) and the wall T4″ (ductAir.ts) in series with all the heat.
 *
 * Heat through covering i: Q_i = W_c·(1 + Λ_{<i}) + W_fixed,<i + W_d·(1 | ½ | 0), so the
 * conductor stands above the circle by
 *     T_c − T_s = A·W_c + F,  A = Σ R_i(1 + Λ_{<i}) + (1 + Λ)·R_duct,  F = the fixed losses' part.
 * With W_c = a + b·T_c (a = I²R₂₀F_ac(1 − 20α), b = I²R₂₀F_acα; R(T) is linear in T) this solves
 * in closed form, T_c = (T_s + a·A + F)/(1 − b·A), and the cable's total heat is LINEAR in the
 * circle temperature: W(T_s) = W(T_ref) + β·(T_s − T_ref), β = (1 + Λ)·b/(1 − b·A) ≥ 0. The
 * solver takes β as the cable's S_p (Patankar's linearisation, exact here) and W(T_ref) as its
 * S_u, both spread over the circle's nodes (solve.ts). If b·A ≥ 1 the coverings alone cannot pass the heat at any
 * surface temperature: runaway inside the cable.
 */
import { ThermalInputError } from '../errors';
import { ductAirResistance } from './ductAir';
import type { CableLosses } from './types';
import type { NormalizedCable } from './validate';

export interface CableChain {
  /** K·m/W per W/m of conductor loss: T_c − T_s = A·W_c + F. */
  A: number;
  /** K: the fixed and dielectric losses' share of T_c − T_s. */
  F: number;
  /** Σλ */
  lambda: number;
  /** W/m, fixed + dielectric. */
  fixedWatts: number;
  /** K·m/W, duct air (T4′) at the given mean air temperature; 0 without a duct. */
  ductAir: number;
  /** K·m/W, duct wall (T4″); 0 without a duct. */
  ductWall: number;
}

/** Heat through each covering per W of conductor loss, and the part from the fixed losses, W/m. */
function coveringFlows(cable: NormalizedCable): { perConductorWatt: number[]; fixed: number[] } {
  const n = cable.coveringResistances.length;
  const perConductorWatt: number[] = [];
  const fixed: number[] = [];
  for (let i = 0; i < n; i++) {
    let share = 1;
    for (const p of cable.proportional) if (p.after < i) share += p.factor;
    let watts = 0;
    for (const f of cable.fixed) if (f.after < i) watts += f.watts;
    if (cable.dielectric) {
      if (cable.dielectric.inCovering < i) watts += cable.dielectric.watts;
      else if (cable.dielectric.inCovering === i) watts += cable.dielectric.watts / 2;
    }
    perConductorWatt.push(share);
    fixed.push(watts);
  }
  return { perConductorWatt, fixed };
}

export function cableChain(cable: NormalizedCable, meanAirC: number, field: string): CableChain {
  const flows = coveringFlows(cable);
  let lambda = 0;
  for (const p of cable.proportional) lambda += p.factor;
  let fixedWatts = 0;
  for (const f of cable.fixed) fixedWatts += f.watts;
  if (cable.dielectric) fixedWatts += cable.dielectric.watts;
  let A = 0;
  let F = 0;
  cable.coveringResistances.forEach((r, i) => {
    A += r * flows.perConductorWatt[i];
    F += r * flows.fixed[i];
  });
  let ductAir = 0;
  let ductWall = 0;
  if (cable.duct) {
    ductAir = ductAirResistance(cable.duct.air, cable.cableOuterDiameter, meanAirC);
    if (!(ductAir > 0 && Number.isFinite(ductAir))) {
      throw new ThermalInputError(`${field}.duct.air`, `the duct-air constants give no positive resistance at a mean air temperature of ${meanAirC.toFixed(1)} °C`);
    }
    ductWall = cable.duct.wallResistance;
    A += (1 + lambda) * (ductAir + ductWall);
    F += fixedWatts * (ductAir + ductWall);
  }
  return { A, F, lambda, fixedWatts, ductAir, ductWall };
}

export interface JouleLine {
  /** W/m at 0 °C-equivalent: W_c = a + b·T_c */
  a: number;
  b: number;
}

export function jouleLine(cable: NormalizedCable, currentA: number): JouleLine {
  const k = currentA * currentA * cable.r20 * cable.acFactor;
  return { a: k * (1 - 20 * cable.alpha20), b: k * cable.alpha20 };
}

/** True when the cable's own coverings run away (no steady state at any surface temperature). */
export function runsAwayInside(chain: CableChain, joule: JouleLine): boolean {
  return !(joule.b * chain.A < 1);
}

export function conductorTemperature(chain: CableChain, joule: JouleLine, circleC: number): number {
  return (circleC + joule.a * chain.A + chain.F) / (1 - joule.b * chain.A);
}

/** The cable's total heat as a line in the circle temperature: W(T_s) = heatAt(T_ref) + slope·(T_s − T_ref). */
export function cableHeatLine(chain: CableChain, joule: JouleLine, referenceC: number): { heatAtReference: number; slope: number } {
  const tc = conductorTemperature(chain, joule, referenceC);
  const heatAtReference = (1 + chain.lambda) * (joule.a + joule.b * tc) + chain.fixedWatts;
  const slope = ((1 + chain.lambda) * joule.b) / (1 - joule.b * chain.A);
  return { heatAtReference, slope };
}

export interface CableState {
  conductorC: number;
  coveringOuterC: number[];
  surfaceC: number;
  /** Mean temperature of the duct air (cable surface and duct inner wall), °C; circle temperature without a duct. */
  meanAirC: number;
  losses: CableLosses;
}

/** Temperatures through the cable and its losses, given the solved circle temperature. */
export function cableState(cable: NormalizedCable, chain: CableChain, joule: JouleLine, circleC: number): CableState {
  const conductorC = conductorTemperature(chain, joule, circleC);
  const conductorWPerM = joule.a + joule.b * conductorC;
  const proportionalWPerM = chain.lambda * conductorWPerM;
  let fixedWPerM = 0;
  for (const f of cable.fixed) fixedWPerM += f.watts;
  const dielectricWPerM = cable.dielectric?.watts ?? 0;
  const totalWPerM = conductorWPerM + proportionalWPerM + fixedWPerM + dielectricWPerM;
  const flows = coveringFlows(cable);
  const coveringOuterC: number[] = [];
  let t = conductorC;
  cable.coveringResistances.forEach((r, i) => {
    t -= r * (flows.perConductorWatt[i] * conductorWPerM + flows.fixed[i]);
    coveringOuterC.push(t);
  });
  const surfaceC = t;
  const ductInnerC = circleC + totalWPerM * chain.ductWall;
  const meanAirC = cable.duct ? 0.5 * (surfaceC + ductInnerC) : circleC;
  return {
    conductorC,
    coveringOuterC,
    surfaceC,
    meanAirC,
    losses: { conductorWPerM, proportionalWPerM, fixedWPerM, dielectricWPerM, totalWPerM },
  };
}
