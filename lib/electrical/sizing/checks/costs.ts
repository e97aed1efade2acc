/** Check: conductor mass, material cost and the present value of the losses over the life (IEC 60287-3-2 form). */
import type Decimal from 'decimal.js';
import { conductorMass, lossEnergyCost, Money } from '../../economics';
import type { SizingContext } from '../context';

export interface CostsResult {
  /** Conductors counted for losses and mass. */
  loadedConductors: number;
  conductorsInstalled: number;
  massKg: number;
  lossWPerM: number | null;
  materialCost: string | null;
  lossCostPresentValue: string | null;
  lifeCycleCost: string | null;
}

function moneyString(d: Decimal | null): string | null {
  return d === null ? null : d.toFixed(2);
}

export function costsCheck(ctx: SizingContext, lossPerConductorWPerM: number | null): CostsResult {
  const { cand, cond } = ctx;
  const phaseConductors = cond.phases === 3 ? 3 : 2;
  const multicore = cand.kind === 'cable' && cand.cores > 1;
  const loadedConductors = multicore ? cand.loadedCores * cand.parallel : phaseConductors * cand.conductorsPerPhase;
  const conductorsInstalled = multicore ? cand.cores * cand.parallel : phaseConductors * cand.conductorsPerPhase;
  const density = cand.costs?.densityKgPerM3 ?? cand.constants.densityKgPerM3;
  const massKg = conductorMass({ sectionMm2: cand.sectionPerConductorMm2, lengthM: cond.lengthM, densityKgPerM3: density, conductors: conductorsInstalled });
  let materialCost: Decimal | null = null;
  const costs = cand.costs;
  if (costs?.pricePerM !== undefined) {
    const runs = multicore ? cand.parallel : conductorsInstalled;
    materialCost = new Money(costs.pricePerM as never).mul(cond.lengthM).mul(runs);
  } else if (costs?.conductorPricePerKg !== undefined) {
    materialCost = new Money(massKg).mul(new Money(costs.conductorPricePerKg as never));
  }
  const lossWPerM = lossPerConductorWPerM === null ? null : lossPerConductorWPerM * loadedConductors;
  let lossCost: Decimal | null = null;
  if (cond.economics && lossWPerM !== null) {
    lossCost = lossEnergyCost({ ...cond.economics, peakLossW: lossWPerM * cond.lengthM }).presentValue;
  }
  const lifeCycle = materialCost !== null && lossCost !== null ? materialCost.add(lossCost) : null;
  return {
    loadedConductors,
    conductorsInstalled,
    massKg,
    lossWPerM,
    materialCost: moneyString(materialCost),
    lossCostPresentValue: moneyString(lossCost),
    lifeCycleCost: moneyString(lifeCycle),
  };
}
