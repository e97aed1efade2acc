/**
 * Radiation between a grey surface and large isothermal surroundings (Incropera §1.2.3):
 * q = εσ(Ts⁴ − Tsur⁴) = h_r (Ts − Tsur), h_r = εσ(Ts + Tsur)(Ts² + Tsur²), in kelvin.
 */
import { KELVIN_OFFSET, STEFAN_BOLTZMANN } from './constants';

export function radiationCoefficient(args: { emissivity: number; surfaceC: number; surroundingsC: number }): number {
  const ts = args.surfaceC + KELVIN_OFFSET;
  const tsur = args.surroundingsC + KELVIN_OFFSET;
  return args.emissivity * STEFAN_BOLTZMANN * (ts + tsur) * (ts * ts + tsur * tsur);
}

/** Net radiative flux leaving the surface, W/m². */
export function radiativeFlux(args: { emissivity: number; surfaceC: number; surroundingsC: number }): number {
  const ts = args.surfaceC + KELVIN_OFFSET;
  const tsur = args.surroundingsC + KELVIN_OFFSET;
  return args.emissivity * STEFAN_BOLTZMANN * (ts ** 4 - tsur ** 4);
}
