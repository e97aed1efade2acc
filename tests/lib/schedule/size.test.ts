// sizeCircuit: the smallest passing size of the family, as lib/electrical's compareCandidates
// picks it, and a voltage-drop limit checked against the IEC 60364-5-52 Annex G formula by hand.
import { describe, expect, it } from 'vitest';
import { compareCandidates } from '@/lib/electrical';
import { expandFamily, rowConditions, sizeCircuit } from '@/lib/schedule';
import { row, SMALL_FAMILY } from './fixtures';

function smallestByCompare(r: ReturnType<typeof row>) {
  const c = compareCandidates(expandFamily(SMALL_FAMILY, r.maxParallel), rowConditions(r));
  const e = c.smallestPassingIndex === null ? null : c.evaluations[c.smallestPassingIndex];
  return e && e.ok ? e : null;
}

describe('sizeCircuit', () => {
  it.each([
    ['40 A in air', row({ designCurrentA: 40 })],
    ['150 A in air, 35 °C, fault 5 kA 0.2 s', row({ designCurrentA: 150, ambientC: 35, faultCurrentKA: 5, clearingTimeS: 0.2 })],
    ['90 A buried at 0.7 m', row({ designCurrentA: 90, installation: 'buried', depthM: 0.7, ambientC: 20 })],
    ['300 A with up to 3 parallel runs', row({ designCurrentA: 300, maxParallel: 3 })],
  ])('picks what compareCandidates picks: %s', (_label, r) => {
    const sizing = sizeCircuit(r, SMALL_FAMILY);
    const expected = smallestByCompare(r);
    expect(expected).not.toBeNull();
    expect(sizing.status).toBe('sized');
    if (sizing.status !== 'sized') return;
    expect(sizing.chosen.candidateId).toBe(expected!.id);
    expect(sizing.chosen.hotSpotC).toBe(expected!.hotSpotC);
    expect(sizing.chosen.ampacityA).toBe(expected!.ampacityA);
    expect(sizing.chosen.voltageDropPercent).toBe(expected!.voltageDrop.percent);
    expect(sizing.chosen.lossW).toBeCloseTo(expected!.lossWPerM! * r.lengthM, 9);
    // Fewer evaluations than the whole family when a small size passes.
    expect(sizing.evaluated).toBeLessThanOrEqual(expandFamily(SMALL_FAMILY, r.maxParallel).length);
  });

  it('lets the voltage drop choose the size when it governs (IEC 60364-5-52 Annex G by hand)', () => {
    // 20 A, 400 m, three-phase, cos φ 0.9, λ 0.08 mΩ/m, limit 4 % of 230 V = 9.2 V.
    // Annex G: u = b (ρ₁ L/S cos φ + λ L sin φ) I_B with b = 1 and ρ₁ = 0.0225 Ω·mm²/m for copper (from memory):
    // 16 mm² → 10.4 V (4.5 %), over; 25 mm² → 6.8 V (2.9 %), within. Heat is no constraint at 20 A.
    const r = row({ designCurrentA: 20, lengthM: 400, maxVoltageDropPercent: 4 });
    const annexG = (sectionMm2: number) => (0.0225 * 400 / sectionMm2 * 0.9 + 0.08e-3 * 400 * Math.sqrt(1 - 0.81)) * 20;
    expect(annexG(16)).toBeGreaterThan(0.04 * 230);
    expect(annexG(25)).toBeLessThan(0.04 * 230);
    const sizing = sizeCircuit(r, SMALL_FAMILY);
    expect(sizing.status).toBe('sized');
    if (sizing.status === 'sized') {
      expect(sizing.chosen.sectionPerPhaseMm2).toBe(25);
      expect(sizing.chosen.voltageDropV).toBeCloseTo(annexG(25), 1);
    }
  });

  it('says why no size passes, naming the largest size tried', () => {
    const r = row({ designCurrentA: 2000 });
    const sizing = sizeCircuit(r, SMALL_FAMILY);
    expect(smallestByCompare(r)).toBeNull();
    expect(sizing.status).toBe('none_passes');
    if (sizing.status === 'none_passes') {
      expect(sizing.reason).toContain('95 mm² copper XLPE/PVC single-core');
      expect(sizing.largest?.flags.some((f) => f.severity === 'blocker')).toBe(true);
    }
    expect(sizeCircuit(r, [])).toMatchObject({ status: 'none_passes', reason: 'The family has no sizes in the catalogue.' });
  });

  it('prefers fewer runs: every single size first, then pairs, and cables under 50 mm² are never paralleled (common practice default)', () => {
    const sizes = expandFamily(SMALL_FAMILY, 2).map((c) => c.label);
    expect(sizes.slice(0, 6)).toEqual(SMALL_FAMILY.map((c) => c.label));
    expect(sizes.slice(6)).toEqual(['2 × 50 mm² copper XLPE/PVC single-core', '2 × 70 mm² copper XLPE/PVC single-core', '2 × 95 mm² copper XLPE/PVC single-core']);
    // A team that allows smaller parallel cables gets them, still after every single size.
    const team = expandFamily(SMALL_FAMILY, 2, { minParallelSectionMm2: 16 }).map((c) => c.label);
    expect(team[6]).toBe('2 × 16 mm² copper XLPE/PVC single-core');
  });

  it('a buried 150 A feeder allowed four runs gets one cable, not four small ones (issue 22: it once chose 4 × 16 mm²)', () => {
    const r = row({ designCurrentA: 150, installation: 'buried', depthM: 0.7, ambientC: 20, maxParallel: 4 });
    const sizing = sizeCircuit(r, SMALL_FAMILY);
    expect(sizing.status).toBe('sized');
    if (sizing.status !== 'sized') return;
    expect(sizing.chosen.runsPerPhase).toBe(1);
    expect(sizing.assumptions.join(' ')).toMatch(/under 50 mm² are not run in parallel \(the default, common practice/);
    // compareCandidates prefers the same size among the same list.
    expect(smallestByCompare(r)?.id).toBe(sizing.chosen.candidateId);
  });
});
