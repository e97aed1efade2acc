import { describe, expect, it } from 'vitest';
import { ElectricalInputError } from '@/lib/electrical/errors';
import { barCohenRohsenowNusselt, channelConvection, elenbaasNusselt } from '@/lib/electrical/busbar/channelConvection';
import { prepareBusbarSystem, type BusbarBar } from '@/lib/electrical/busbar/geometry';
import { preparePackHeat, solvePackHeat } from '@/lib/electrical/busbar/packHeat';
import { packRatingBreakdown, rateBusbarSystem, rateIsolatedBar } from '@/lib/electrical/busbar/rating';
import { parallelStripsViewFactor } from '@/lib/electrical/busbar/viewFactors';

const SIGMA = 5.670374419e-8; // CODATA 2018
const COPPER = { rho20OhmM: 1.7241e-8, alpha20PerK: 3.93e-3 }; // IEC 60287-1-1 Table 1
const PAINTED = { ambientC: 35, emissivity: 0.9, limitC: 65 };

const bar = (index: number, groupIndex: number, cxM: number, cyM: number, sizeXM: number, sizeYM: number): BusbarBar => ({
  index,
  group: 'L1',
  groupIndex,
  positionInPack: 0,
  cxM,
  cyM,
  sizeXM,
  sizeYM,
  widthM: Math.max(sizeXM, sizeYM),
  thicknessM: Math.min(sizeXM, sizeYM),
});

describe('natural convection in vertical channels', () => {
  it('Bar-Cohen & Rohsenow and Elenbaas at Ra_S·S/L = 200, worked by hand (Incropera §9.7, from memory)', () => {
    // BCR: [576/200² + 2.873/√200]^−½ = [0.0144 + 0.203152]^−½ = 2.14397.
    // Elenbaas: (200/24)·[1 − e^(−35/200)]^¾ = 8.33333·0.160543^¾ = 2.11355.
    expect(barCohenRohsenowNusselt(200)).toBeCloseTo(2.14397, 4);
    expect(elenbaasNusselt(200)).toBeCloseTo(2.11355, 4);
  });

  it('both tend to the exact fully developed limit Ra_S(S/L)/24 for narrow channels, BCR to 0.59·Ra^¼ for wide ones', () => {
    expect(barCohenRohsenowNusselt(1e-3) / (1e-3 / 24)).toBeCloseTo(1, 5);
    expect(elenbaasNusselt(1e-3) / (1e-3 / 24)).toBeCloseTo(1, 5);
    expect(barCohenRohsenowNusselt(1e6) / (0.59 * 1e6 ** 0.25)).toBeCloseTo(1, 3);
  });

  it('in a narrow gap (3 mm between 100 mm faces) the channel governs and cools each face far less than an open plate', () => {
    const s = prepareBusbarSystem({ barsPerPhase: 2, barWidthM: 0.1, barThicknessM: 0.01, gapM: 0.003, phaseSpacingM: 0.2, arrangement: 'edge', supportSpacingM: 1 });
    const r = solvePackHeat(preparePackHeat(s, { ambientC: 35, emissivity: 0.9 }), () => new Float64Array(6).fill(25));
    expect(r.channelModifiedRayleigh).not.toBeNull();
    // Outer bar of L1: one open face, one gap face, at one temperature.
    expect(r.bars[0].convectionGapFacesWPerM).toBeLessThan(0.5 * r.bars[0].convectionOpenFacesWPerM);
  });

  it('flags a channel outside the measured range', () => {
    expect(channelConvection({ spacingM: 0.01, heightM: 0.1, excessK: 30, ambientC: 35 }).inRange).toBe(true);
    expect(channelConvection({ spacingM: 0.0005, heightM: 0.1, excessK: 30, ambientC: 35 }).inRange).toBe(false);
  });
});

describe('view factors between long strips (crossed strings)', () => {
  it('unequal centred strips: Incropera Table 13.1 / Howell, F = [√((W_i+W_j)²+4) − √((W_j−W_i)²+4)]/(2W_i)', () => {
    // w_i = 0.1, w_j = 0.04, L = 0.03 (W = w/L): F_ij = 0.337313 (worked by hand).
    expect(parallelStripsViewFactor(0.03, { lo: -0.05, hi: 0.05 }, { lo: -0.02, hi: 0.02 })).toBeCloseTo(0.337313, 6);
    // Reciprocity A_i F_ij = A_j F_ji.
    const fji = parallelStripsViewFactor(0.03, { lo: -0.02, hi: 0.02 }, { lo: -0.05, hi: 0.05 });
    expect(0.04 * fji).toBeCloseTo(0.1 * 0.337313, 6);
  });
});

describe('radiation network of the bars', () => {
  it('one bar alone: εσ(T⁴ − T∞⁴) over its whole perimeter (a convex body in large surroundings, Incropera eq. 1.7)', () => {
    const heat = preparePackHeat({ arrangement: 'edge', bars: [bar(0, 0, 0, 0, 0.01, 0.1)] }, { ambientC: 35, emissivity: 0.9 });
    const t = 65 + 273.15;
    const ta = 35 + 273.15;
    const q = heat.radiationExchange[0] * SIGMA * t ** 4 + heat.radiationRoom[0] * SIGMA * ta ** 4;
    expect(q).toBeCloseTo(0.9 * SIGMA * (t ** 4 - ta ** 4) * 0.22, 9);
  });

  it('two bars across a very narrow gap exchange as infinite parallel plates, σ(T₁⁴ − T₂⁴)/(1/ε₁ + 1/ε₂ − 1) (Incropera eq. 13.24)', () => {
    // Gap 0.1 mm between faces 100 mm tall: the leak through the gap's ends is √(1 + 10⁻⁶) − 10⁻³ ≈ 0.1 %.
    const heat = preparePackHeat(
      { arrangement: 'edge', bars: [bar(0, 0, 0, 0, 0.01, 0.1), bar(1, 0, 0.0101, 0, 0.01, 0.1)] },
      { ambientC: 35, emissivity: 0.8 },
    );
    const coupling = -heat.radiationExchange[0 * 2 + 1]; // m²/m seen by σT₁⁴ of the other bar
    expect(coupling / (0.1 / (1 / 0.8 + 1 / 0.8 - 1))).toBeCloseTo(1, 2);
  });
});

describe('one bar alone: the heat balance by hand', () => {
  it('100 × 10 mm painted copper on edge, 35 °C air, 65 °C, DC: I = √(q′/R′) with Churchill–Chu and grey radiation', () => {
    // Air at the film temperature 50 °C = 323.15 K, interpolated in Incropera Table A.4 (from memory):
    // 300 K: k = 0.0263, ν = 15.89e-6, Pr = 0.707; 350 K: k = 0.0300, ν = 20.92e-6, Pr = 0.700.
    const w = (323.15 - 300) / 50;
    const k = 0.0263 + w * (0.03 - 0.0263);
    const nu = 15.89e-6 + w * (20.92e-6 - 15.89e-6);
    const pr = 0.707 + w * (0.7 - 0.707);
    const rayleigh = (9.80665 * (1 / 323.15) * 30 * 0.1 ** 3) / (nu * (nu / pr));
    // Churchill & Chu (1975) vertical plate, Incropera eq. 9.26; L = the bar width.
    const nusselt = (0.825 + (0.387 * rayleigh ** (1 / 6)) / (1 + (0.492 / pr) ** (9 / 16)) ** (8 / 27)) ** 2;
    const hc = (nusselt * k) / 0.1;
    const ts = 338.15;
    const ta = 308.15;
    const hr = 0.9 * SIGMA * (ts + ta) * (ts * ts + ta * ta);
    // Perimeter 2(w + t) = 0.22 m²/m, the edges at the plate's coefficient.
    const heatPerMetre = (hc + hr) * 0.22 * 30;
    const resistance = (COPPER.rho20OhmM / 1e-3) * (1 + COPPER.alpha20PerK * 45); // IEC 60287-1-1 eq. (2)
    const byHand = Math.sqrt(heatPerMetre / resistance);
    const rated = rateIsolatedBar({ widthM: 0.1, thicknessM: 0.01, arrangement: 'edge', conductor: COPPER, conditions: PAINTED, excitation: { kind: 'dc' } });
    expect(rated.ampacityA / byHand).toBeCloseTo(1, 3);
    expect(rated.temperatureC).toBeCloseTo(65, 6);
    expect(rated.heat.energyResidual).toBeLessThan(1e-9);
  });
});

describe('heat balance of a three-phase system of packs', () => {
  const system = (n: number) =>
    prepareBusbarSystem({ barsPerPhase: n, barWidthM: 0.1, barThicknessM: 0.01, gapM: 0.01, phaseSpacingM: 0.2, arrangement: 'edge', supportSpacingM: 1 });

  it('DC, equal losses: energy balances, L1 and L3 mirror each other, inner bars run hotter, gap faces cool less than open faces', () => {
    const s = system(3);
    const heat = preparePackHeat(s, { ambientC: 35, emissivity: 0.9 });
    const r = solvePackHeat(heat, () => new Float64Array(9).fill(25));
    expect(r.converged).toBe(true);
    expect(r.energyResidual).toBeLessThan(1e-9);
    const t = r.bars.map((b) => b.temperatureC);
    for (let k = 0; k < 3; k++) expect(t[k]).toBeCloseTo(t[8 - k], 6);
    expect(t[4]).toBeGreaterThan(t[3]);
    expect(t[1]).toBeGreaterThan(t[0]);
    // The middle bar of L2 has only gap faces; an outer bar of L1 one gap face and one open face.
    expect(r.bars[4].convectionOpenFacesWPerM).toBe(0);
    expect(r.bars[4].convectionGapFacesWPerM).toBeGreaterThan(0);
    // Its gap faces see their neighbours (view factor 0.905 each): it radiates from its edges and
    // through the ends of the gaps only, and its gap faces convect no better than open faces.
    expect(r.bars[4].radiationWPerM).toBeLessThan(0.75 * r.bars[0].radiationWPerM);
    // A 10 mm gap between 100 mm faces is wide for the channel correlation (Ra_S·S/L ≈ 200): its
    // 0.59·Ra^¼ asymptote exceeds Churchill–Chu's plate, so the plate value governs and is flagged;
    // the 130 mm between phases all the more.
    expect(r.flags.some((f) => f.code === 'BUSBAR_CHANNEL_LIMITED_TO_PLATE')).toBe(true);
    expect(r.channelModifiedRayleigh).toBeNull();
    expect(r.flags.some((f) => f.code === 'BUSBAR_CHANNEL_OUT_OF_RANGE')).toBe(false);
  });

  it('a pack of n bars rates well below n × one bar; inner-face heat transfer and current sharing each explain part', () => {
    let previousHeatFactor = 1;
    for (const n of [2, 3, 4]) {
      const b = packRatingBreakdown({ system: system(n), conductor: COPPER, conditions: PAINTED, frequencyHz: 50 });
      expect(b.systemAcA).toBeLessThan(0.8 * b.naivePackA);
      expect(b.heatTransferFactor).toBeLessThan(previousHeatFactor);
      expect(b.heatTransferFactor).toBeLessThan(0.9);
      expect(b.currentSharingFactor).toBeLessThan(0.9);
      expect(b.heatTransferFactor * b.currentSharingFactor).toBeCloseTo(b.systemAcA / b.naivePackA, 12);
      // The hottest bar is at the limit, the others below it.
      expect(b.ac.heat.hottestC).toBeCloseTo(65, 5);
      expect(Math.min(...b.ac.heat.bars.map((x) => x.temperatureC))).toBeLessThan(64);
      previousHeatFactor = b.heatTransferFactor;
    }
  });

  it('the pack ampacity is stable under filament refinement (default mesh against a finer one: within 0.5 %)', () => {
    const base = rateBusbarSystem({ system: system(3), conductor: COPPER, conditions: PAINTED, excitation: { kind: 'three-phase', frequencyHz: 50 } });
    const fine = rateBusbarSystem({
      system: system(3),
      conductor: COPPER,
      conditions: PAINTED,
      excitation: { kind: 'three-phase', frequencyHz: 50 },
      mesh: { cellsAcrossThickness: 6, cellsAlongWidth: 32 },
    });
    expect(Math.abs(fine.ampacityA / base.ampacityA - 1)).toBeLessThan(0.005);
  });

  it('bars tied into one temperature per pack (perfect spacers) rate higher than bars on their own: the two bounds', () => {
    const own = rateBusbarSystem({ system: system(2), conductor: COPPER, conditions: PAINTED, excitation: { kind: 'three-phase', frequencyHz: 50 } });
    const tied = rateBusbarSystem({ system: system(2), conductor: COPPER, conditions: { ...PAINTED, thermalNodes: 'per-pack' }, excitation: { kind: 'three-phase', frequencyHz: 50 } });
    expect(tied.ampacityA).toBeGreaterThan(own.ampacityA);
    expect(tied.flags.some((f) => f.code === 'BUSBAR_PACK_ISOTHERMAL')).toBe(true);
  });

  it('refuses bad conditions naming the field', () => {
    const field = (fn: () => unknown) => {
      try {
        fn();
      } catch (e) {
        expect(e).toBeInstanceOf(ElectricalInputError);
        return (e as ElectricalInputError).field;
      }
      throw new Error('accepted');
    };
    expect(field(() => preparePackHeat(system(2), { ambientC: 35, emissivity: 1.2 }))).toBe('emissivity');
    expect(field(() => preparePackHeat(system(2), { ambientC: Number.NaN, emissivity: 0.9 }))).toBe('ambientC');
    expect(field(() => rateBusbarSystem({ system: system(2), conductor: COPPER, conditions: { ...PAINTED, limitC: 30 }, excitation: { kind: 'dc' } }))).toBe('conditions.limitC');
  });
});
