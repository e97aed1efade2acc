/**
 * The air between a cable and its duct wall, by the published duct-air constants (not by an
 * equivalent conductivity): IEC 60287-2-1, cables in ducts,
 *     T4′ = U / (1 + 0.1·(V + Y·θm)·De)   K·m/W,
 * De the cable's outer diameter in mm, θm the mean temperature of the air in °C. The duct wall
 * adds T4″ = ρ_duct/(2π)·ln(D_o/D_i) (a cylindrical layer, Incropera §3.3.1).
 *
 * The constants below are from memory (the IEC 60287-2-1 table of U, V, Y by kind of duct),
 * not read from the standard at hand; a reviewer should compare them with the edition in use.
 * Because T4′ depends on θm, the solver's outer iteration re-evaluates it from the last pass.
 */
import type { DuctAirConstants, DuctKind } from './types';

export const DUCT_AIR_CONSTANTS: Readonly<Record<DuctKind, DuctAirConstants>> = {
  'metallic-conduit': { U: 5.2, V: 1.4, Y: 0.011 },
  'fibre-in-air': { U: 5.2, V: 0.83, Y: 0.006 },
  'fibre-in-concrete': { U: 5.2, V: 0.91, Y: 0.01 },
  'asbestos-cement-in-air': { U: 5.2, V: 1.2, Y: 0.006 },
  'asbestos-cement-in-concrete': { U: 5.2, V: 1.1, Y: 0.011 },
  earthenware: { U: 1.87, V: 0.28, Y: 0.0036 },
  plastic: { U: 1.87, V: 0.312, Y: 0.0037 },
};

/** T4′, K·m/W, of the air space around a cable of outer diameter `cableDiameterM`. */
export function ductAirResistance(air: DuctAirConstants, cableDiameterM: number, meanAirC: number): number {
  const deMm = cableDiameterM * 1000;
  return air.U / (1 + 0.1 * (air.V + air.Y * meanAirC) * deMm);
}
