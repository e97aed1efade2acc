import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { conductorMass, ElectricalInputError, lossEnergyCost, materialCost, Money } from '@/lib/electrical';

describe('loss energy cost — the form of IEC 60287-3-2 (from memory), worked by hand', () => {
  it('1 kW peak loss, μ = 0.5, 0.10 per kWh, no growth, 5 % discount, 2 years', () => {
    // Energy = 1000 W·0.5·8760 h = 4 380 kWh → 438.00 per year, paid at each year end.
    // PV = 438/1.05 + 438/1.05² = 417.142857 + 397.278912 = 814.421769.
    const r = lossEnergyCost({ peakLossW: 1000, lossLoadFactor: 0.5, energyPricePerKWh: '0.10', discountRatePercent: 5, years: 2 });
    expect(r.firstYearEnergyKWh).toBeCloseTo(4380, 9);
    expect(r.firstYearCost.toFixed(2)).toBe('438.00');
    expect(r.presentValue.toFixed(6)).toBe('814.421769');
  });

  it('Q equals the year-by-year sum of growth and discount (property, 100 runs)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 40 }),
        fc.double({ min: -5, max: 10, noNaN: true }),
        fc.double({ min: -5, max: 10, noNaN: true }),
        fc.double({ min: 0, max: 15, noNaN: true }),
        (years, a, b, i) => {
          const res = lossEnergyCost({
            peakLossW: 2500,
            lossLoadFactor: 0.3,
            energyPricePerKWh: '0.2',
            loadGrowthPercent: a,
            energyPriceGrowthPercent: b,
            discountRatePercent: i,
            years,
          });
          // Direct sum: year n costs C1·((1+a)²(1+b))^(n−1), discounted by (1+i)^n.
          let sum = new Money(0);
          const growth = new Money(1 + a / 100).pow(2).mul(1 + b / 100);
          for (let n = 1; n <= years; n++) {
            sum = sum.add(res.firstYearCost.mul(growth.pow(n - 1)).div(new Money(1 + i / 100).pow(n)));
          }
          expect(res.presentValue.sub(sum).abs().lte(sum.abs().mul('1e-12').add('1e-12'))).toBe(true);
        },
      ),
      { numRuns: 100 },
    );
  });

  it('adds the demand charge per kW-year and refuses bad money', () => {
    // 1 kW × 50 per kW-year = 50 on top of 438.
    const r = lossEnergyCost({
      peakLossW: 1000,
      lossLoadFactor: 0.5,
      energyPricePerKWh: '0.10',
      demandChargePerKWYear: '50',
      discountRatePercent: 0,
      years: 1,
    });
    expect(r.presentValue.toFixed(2)).toBe('488.00');
    expect(() =>
      lossEnergyCost({ peakLossW: 1, lossLoadFactor: 0.5, energyPricePerKWh: 'ten', discountRatePercent: 5, years: 1 }),
    ).toThrow(ElectricalInputError);
  });
});

describe('mass and material cost (common practice: density × volume × price)', () => {
  it('copper 100 × 10 mm bar, 10 m, 3 phases × 2 bars at density 8890 kg/m³', () => {
    // 1000 mm² = 1e-3 m²; 1e-3·10·8890 = 88.9 kg per bar; × 6 = 533.4 kg.
    const m = conductorMass({ sectionMm2: 1000, lengthM: 10, densityKgPerM3: 8890, conductors: 6 });
    expect(m).toBeCloseTo(533.4, 9);
    // 533.4 kg × 9.35 per kg = 4987.29 — decimal, no binary rounding in the money.
    expect(materialCost({ massKg: 533.4, pricePerKg: '9.35' }).toFixed(2)).toBe('4987.29');
  });
});
