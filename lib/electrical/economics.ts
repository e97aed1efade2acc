/**
 * Losses, energy cost over the life, and conductor material cost.
 *
 * Energy cost follows the form of IEC 60287-3-2 (economic optimisation of cable sizes), from
 * memory of §4:
 *   C_J = I_max²·R·l·N_p·N_c·(T·P + D)·Q / (1 + i/100)
 *   Q   = Σ_{n=1..N} r^{n−1} = (1 − r^N)/(1 − r),   r = (1 + a/100)²(1 + b/100)/(1 + i/100)
 * where I_max is the first-year peak load, R the AC resistance per metre at the operating
 * temperature, T = μ·(hours per year) the equivalent hours at peak loss (μ the loss load factor),
 * P the energy price, D a demand charge per watt-year, a the load growth, b the energy price
 * growth and i the discount rate, all in % per year, N the years of life. The first year's cost
 * is paid at its end, hence the 1/(1 + i/100).
 *
 * Money uses decimal.js (a private clone, so the app's global Decimal settings are untouched);
 * physics (watts, kWh) stays in binary floating point.
 */
import Decimal from 'decimal.js';
import { ElectricalInputError, requireFinite, requireInteger, requireNonNegative, requireRange } from './errors';

/** 34 significant digits (IEEE decimal128) so growth sums over decades lose nothing visible. */
export const Money = Decimal.clone({ precision: 34, rounding: Decimal.ROUND_HALF_EVEN });
export type Money = Decimal;
export type MoneyInput = string | number | Decimal;

export function toMoney(value: unknown, field: string): Decimal {
  if (Decimal.isDecimal(value)) {
    const d = new Money(value as Decimal);
    if (!d.isFinite()) throw new ElectricalInputError(field, 'must be a finite amount');
    return d;
  }
  if (typeof value === 'number') return new Money(requireFinite(value, field));
  if (typeof value === 'string' && /^\s*[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?\s*$/.test(value)) {
    return new Money(value.trim());
  }
  throw new ElectricalInputError(field, `must be a decimal amount (got ${String(value)})`);
}

function nonNegativeMoney(value: unknown, field: string): Decimal {
  const d = toMoney(value, field);
  if (d.isNegative()) throw new ElectricalInputError(field, 'must not be negative');
  return d;
}

export interface LossEnergyCostInput {
  /** Joule loss of the whole circuit at the first-year peak current, W (I_max²·R·l·N_p·N_c). */
  peakLossW: number;
  /** Loss load factor μ (0..1): mean loss / peak loss over a year. */
  lossLoadFactor: number;
  /** Hours per year the circuit is energised (default 8760). */
  hoursPerYear?: number;
  /** Energy price P per kWh, in the sheet's currency. */
  energyPricePerKWh: MoneyInput;
  /** Demand charge D per kW of peak loss per year (default 0). */
  demandChargePerKWYear?: MoneyInput;
  /** a: growth of the peak load, % per year. */
  loadGrowthPercent?: number;
  /** b: growth of the energy price, % per year. */
  energyPriceGrowthPercent?: number;
  /** i: discount (capitalisation) rate, % per year. */
  discountRatePercent: number;
  /** N: economic life, years. */
  years: number;
}

export interface LossEnergyCostResult {
  /** Energy lost in the first year, kWh. */
  firstYearEnergyKWh: number;
  /** Cost of the first year's losses (undiscounted), currency. */
  firstYearCost: Decimal;
  /** r of IEC 60287-3-2. */
  r: Decimal;
  /** Q of IEC 60287-3-2. */
  q: Decimal;
  /** Present value of the losses over the life, currency. */
  presentValue: Decimal;
}

/** Present value of the Joule-loss energy over the life, in the form of IEC 60287-3-2. */
export function lossEnergyCost(input: LossEnergyCostInput): LossEnergyCostResult {
  const peakLossW = requireNonNegative(input?.peakLossW, 'peakLossW');
  const mu = requireRange(input.lossLoadFactor, 'lossLoadFactor', 0, 1);
  const hours = input.hoursPerYear === undefined ? 8760 : requireRange(input.hoursPerYear, 'hoursPerYear', 0, 8784);
  const price = nonNegativeMoney(input.energyPricePerKWh, 'energyPricePerKWh');
  const demand = input.demandChargePerKWYear === undefined ? new Money(0) : nonNegativeMoney(input.demandChargePerKWYear, 'demandChargePerKWYear');
  // Growth may be negative (declining load), but not −100 % or below.
  const a = requireRange(input.loadGrowthPercent ?? 0, 'loadGrowthPercent', -100, 100, { minExclusive: true });
  const b = requireRange(input.energyPriceGrowthPercent ?? 0, 'energyPriceGrowthPercent', -100, 100, { minExclusive: true });
  const i = requireRange(input.discountRatePercent, 'discountRatePercent', -100, 100, { minExclusive: true });
  const years = requireInteger(input.years, 'years', 0, 200);

  const equivalentHours = mu * hours;
  const firstYearEnergyKWh = (peakLossW * equivalentHours) / 1000;
  const peakLossKW = new Money(peakLossW).div(1000);
  const firstYearCost = new Money(firstYearEnergyKWh).mul(price).add(peakLossKW.mul(demand));

  const one = new Money(1);
  const aa = one.add(new Money(a).div(100));
  const bb = one.add(new Money(b).div(100));
  const ii = one.add(new Money(i).div(100));
  const r = aa.mul(aa).mul(bb).div(ii);
  const q = r.eq(1) ? new Money(years) : one.sub(r.pow(years)).div(one.sub(r));
  const presentValue = firstYearCost.mul(q).div(ii);
  return { firstYearEnergyKWh, firstYearCost, r, q, presentValue };
}

/** Conductor mass, kg: density × section × length × number of conductors. */
export function conductorMass(args: {
  sectionMm2: number;
  lengthM: number;
  densityKgPerM3: number;
  conductors?: number;
}): number {
  const section = requireNonNegative(args?.sectionMm2, 'sectionMm2');
  const length = requireNonNegative(args.lengthM, 'lengthM');
  const density = requireNonNegative(args.densityKgPerM3, 'densityKgPerM3');
  const n = args.conductors === undefined ? 1 : requireInteger(args.conductors, 'conductors', 0, 1e6);
  return section * 1e-6 * length * density * n;
}

/** Material cost from a mass and a price per kilogram (decimal). */
export function materialCost(args: { massKg: number; pricePerKg: MoneyInput }): Decimal {
  const mass = requireNonNegative(args?.massKg, 'massKg');
  return new Money(mass).mul(nonNegativeMoney(args.pricePerKg, 'pricePerKg'));
}
