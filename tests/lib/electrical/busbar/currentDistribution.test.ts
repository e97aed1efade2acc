import { describe, expect, it } from 'vitest';
import { ElectricalInputError } from '@/lib/electrical/errors';
import {
  computeCurrentDistribution,
  prepareCurrentDistribution,
  solveCurrentDistribution,
  type CurrentDistributionInput,
} from '@/lib/electrical/busbar/currentDistribution';
import { meshRectangle, solveFilaments, type Filament } from '@/lib/electrical/busbar/filaments';
import { prepareBusbarSystem, type BusbarSystemInput } from '@/lib/electrical/busbar/geometry';

const COPPER = { rho20OhmM: 1.7241e-8, alpha20PerK: 3.93e-3 }; // IEC 60287-1-1 Table 1

function system(overrides: Partial<BusbarSystemInput> = {}) {
  return prepareBusbarSystem({
    barsPerPhase: 3,
    barWidthM: 0.1,
    barThicknessM: 0.01,
    gapM: 0.01,
    phaseSpacingM: 0.2,
    arrangement: 'edge',
    supportSpacingM: 1,
    ...overrides,
  });
}

function run(overrides: Partial<CurrentDistributionInput> = {}, geometry: Partial<BusbarSystemInput> = {}) {
  return computeCurrentDistribution({
    system: system(geometry),
    conductor: COPPER,
    barTemperaturesC: 65,
    excitation: { kind: 'three-phase', frequencyHz: 50, phaseCurrentA: 3000 },
    ...overrides,
  });
}

/** One pack alone (its return far away), all bars on edge, 100 × 10 mm copper, 10 mm gaps. */
function isolatedPack(bars: number, frequencyHz: number) {
  const filaments: Filament[] = [];
  for (let k = 0; k < bars; k++) {
    const cx = (k - (bars - 1) / 2) * 0.02;
    const cells = meshRectangle({ cxM: cx, cyM: 0.025, sizeXM: 0.01, sizeYM: 0.05 }, { cellsX: 4, cellsY: 10, gradingX: 'both', gradingY: 'high', beta: 0.8 });
    for (const c of cells) filaments.push({ ...c, resistivityOhmM: COPPER.rho20OhmM, group: 0, tag: k });
  }
  // Only the mirror about y = 0 is used: the left–right symmetry of the sharing must come out of the solve.
  const s = solveFilaments({ filaments, groupCurrents: [{ re: 2000, im: 0 }], frequencyHz, mirror: { y: true } });
  const re = new Array<number>(bars).fill(0);
  const im = new Array<number>(bars).fill(0);
  filaments.forEach((f, i) => {
    re[f.tag] += 2 * s.currentRe[i];
    im[f.tag] += 2 * s.currentIm[i];
  });
  return re.map((r, k) => Math.hypot(r, im[k]));
}

describe('current sharing in a pack (filament method)', () => {
  it('isolated two- and three-bar packs: symmetric sharing; at 50 Hz the outer bars of three carry more than the middle one', () => {
    const two = isolatedPack(2, 50);
    expect(two[0] / two[1]).toBeCloseTo(1, 9);
    const three = isolatedPack(3, 50);
    expect(three[0] / three[2]).toBeCloseTo(1, 9);
    expect(three[0]).toBeGreaterThan(1.1 * three[1]);
  });

  it('isolated packs at DC: equal sharing (equal bars, equal resistance)', () => {
    for (const current of [...isolatedPack(2, 0), ...isolatedPack(3, 0)].map((c, i, all) => c / all[i < 2 ? 0 : 2])) {
      expect(current).toBeCloseTo(1, 12);
    }
  });

  it('three-phase system of three-bar packs: in every phase the outer bars carry more than the middle bar at 50 Hz', () => {
    const r = run();
    for (const g of ['L1', 'L2', 'L3']) {
      const [outerA, middle, outerB] = r.bars.filter((b) => b.group === g);
      expect(outerA.currentA).toBeGreaterThan(middle.currentA);
      expect(outerB.currentA).toBeGreaterThan(middle.currentA);
      expect(middle.acFactor!).toBeGreaterThan(1);
    }
    expect(r.groups.slice(0, 3).every((g) => g.acFactor! > 1.2)).toBe(true);
  });

  it('three-phase system at DC: equal sharing within each pack, R_ac/R_dc = 1', () => {
    const r = run({ excitation: { kind: 'dc', phaseCurrentA: 3000 } });
    for (const b of r.bars) {
      expect(b.currentA).toBeCloseTo(1000, 8);
      expect(b.acFactor!).toBeCloseTo(1, 12);
    }
  });

  it('DC with bars at different temperatures: shares follow 1/R(θ), R = R₂₀[1 + α₂₀(θ − 20)] (IEC 60287-1-1 eq. 2)', () => {
    const temperatures = [40, 60, 80, 40, 60, 80, 40, 60, 80];
    const r = run({ excitation: { kind: 'dc', phaseCurrentA: 3000 }, barTemperaturesC: temperatures });
    const conductance = temperatures.slice(0, 3).map((t) => 1 / (1 + COPPER.alpha20PerK * (t - 20)));
    const sum = conductance.reduce((a, b) => a + b, 0);
    r.bars.slice(0, 3).forEach((b, k) => expect(b.currentA).toBeCloseTo((3000 * conductance[k]) / sum, 8));
  });

  it('total loss equals Σ I_k²·R_ac,k over the bars, and the power fed in (energy balance)', () => {
    const r = run();
    const sum = r.bars.reduce((s, b) => s + (b.acFactor ?? 0) * b.currentA * b.currentA * b.rdcOhmPerM, 0);
    expect(sum / r.totalLossWPerM).toBeCloseTo(1, 12);
    expect(r.bars.reduce((s, b) => s + b.lossWPerM, 0) / r.totalLossWPerM).toBeCloseTo(1, 12);
    expect(r.powerBalanceResidual).toBeLessThan(1e-9);
    // Loss scales with I² (a linear circuit): twice the current, four times the loss.
    const doubled = run({ excitation: { kind: 'three-phase', frequencyHz: 50, phaseCurrentA: 6000 } });
    expect(doubled.totalLossWPerM / r.totalLossWPerM).toBeCloseTo(4, 9);
  });

  it('flat packs with an odd number of bars (the middle bar cut by the mirror) match the same system solved whole', () => {
    const r = run({}, { arrangement: 'flat' });
    // Whole-system reference: every bar meshed completely, no mirror.
    const s = system({ arrangement: 'flat' });
    const filaments: Filament[] = [];
    s.bars.forEach((bar, k) => {
      const cells = meshRectangle(bar, { cellsX: r.mesh.cellsAlongWidth, cellsY: r.mesh.cellsAcrossThickness, gradingX: 'both', gradingY: 'both', beta: r.mesh.beta });
      for (const c of cells) filaments.push({ ...c, resistivityOhmM: COPPER.rho20OhmM * (1 + COPPER.alpha20PerK * 45), group: bar.groupIndex, tag: k });
    });
    const phases = [0, -120, 120].map((d) => ({ re: 3000 * Math.cos((d * Math.PI) / 180), im: 3000 * Math.sin((d * Math.PI) / 180) }));
    const whole = solveFilaments({ filaments, groupCurrents: phases, frequencyHz: 50 });
    // Same cells: the half-bar grading towards its top face is the upper half of the whole bar's grading.
    expect(r.totalLossWPerM / whole.totalLossWPerM).toBeCloseTo(1, 9);
    // Bars above and below the middle one are mirror images: equal currents.
    const l1 = r.bars.filter((b) => b.group === 'L1');
    expect(l1[0].currentA).toBeCloseTo(l1[2].currentA, 8);
  });

  it('a neutral pack with no net current still carries equal and opposite eddy currents between its bars', () => {
    const r = run({}, { neutral: { role: 'neutral', bars: 2, thicknessM: 0.01, gapM: 0.01, spacingM: 0.2 } });
    const n = r.bars.filter((b) => b.group === 'N');
    expect(n).toHaveLength(2);
    expect(n[0].currentA).toBeGreaterThan(1);
    expect(n[0].currentA).toBeCloseTo(n[1].currentA, 6);
    expect(Math.abs(n[0].angleDeg - n[1].angleDeg)).toBeCloseTo(180, 6);
    expect(r.groups[3].acFactor).toBeNull();
  });

  it('reusing one factorisation at other bar temperatures gives the same currents as factoring afresh', () => {
    const temperatures = [50, 58, 71, 62, 66, 49, 70, 55, 60];
    const mesh = { cellsAcrossThickness: 4, cellsAlongWidth: 20 };
    const prepared = prepareCurrentDistribution({ system: system(), conductor: COPPER, frequencyHz: 50, barTemperaturesC: 65, mesh });
    const reused = solveCurrentDistribution(prepared, { barTemperaturesC: temperatures, phaseCurrentA: 3000 });
    const fresh = run({ barTemperaturesC: temperatures, mesh });
    reused.bars.forEach((b, k) => {
      expect(b.currentA / fresh.bars[k].currentA).toBeCloseTo(1, 10);
      expect(b.lossWPerM / fresh.bars[k].lossWPerM).toBeCloseTo(1, 10);
    });
    // Far from the prepared temperatures the reuse is refused rather than stretched.
    expect(() => solveCurrentDistribution(prepared, { barTemperaturesC: 400, phaseCurrentA: 3000 })).toThrow(/prepare again/);
  });

  it('refuses bad input naming the field', () => {
    const field = (fn: () => unknown) => {
      try {
        fn();
      } catch (e) {
        expect(e).toBeInstanceOf(ElectricalInputError);
        return (e as ElectricalInputError).field;
      }
      throw new Error('accepted');
    };
    expect(field(() => run({ barTemperaturesC: [65, 65] }))).toBe('barTemperaturesC');
    expect(field(() => run({ barTemperaturesC: Number.NaN }))).toBe('barTemperaturesC');
    expect(field(() => run({ conductor: { rho20OhmM: 0, alpha20PerK: 3.93e-3 } }))).toBe('conductor.rho20OhmM');
    expect(field(() => run({ excitation: { kind: 'three-phase', frequencyHz: 50, phaseCurrentA: -1 } }))).toBe('excitation.phaseCurrentA');
    expect(field(() => run({ mesh: { cellsAlongWidth: 7 } }))).toBe('mesh.cellsAlongWidth');
  });
});
