// Catalogue rows → the sizing library's Candidate: units (Ω/km → Ω/m, mm → m), sources carried,
// "from memory" noticed, and the library accepts the result.
import { describe, expect, it } from 'vitest';
import { barToCandidate, cableBuildToCandidate, ROW_SCHEMAS } from '@/lib/catalogue';
import { evaluateCandidate, type Conditions } from '@/lib/electrical';
import { STANDARD_BUILDS, STANDARD_CONDUCTORS, STANDARD_COVERINGS, STANDARD_MATERIALS } from '@/lib/catalogue/standardData';

const withId = <T extends object>(row: T, id: string) => ({ ...row, id });
const material = (key: string) => withId(ROW_SCHEMAS.materials.parse(STANDARD_MATERIALS.find((m) => m.key === key)), `m-${key}`);
const conductor = (key: string) => withId(ROW_SCHEMAS.conductors.parse(STANDARD_CONDUCTORS.find((c) => c.key === key)), `c-${key}`);
const covering = (key: string) => withId(ROW_SCHEMAS.coverings.parse(STANDARD_COVERINGS.find((c) => c.key === key)), `v-${key}`);

describe('cable build → CableCandidate', () => {
  const build = withId(ROW_SCHEMAS.builds.parse(STANDARD_BUILDS.find((b) => b.key === 'demo-cu-240-xlpe-pvc')), 'b-240');
  const candidate = cableBuildToCandidate({
    build,
    conductor: conductor('cu-240'),
    material: material('copper'),
    layers: [
      { covering: covering('xlpe-insulation'), thicknessMm: build.layer1ThicknessMm!, source: build.layer1Source },
      { covering: covering('pvc-sheath'), thicknessMm: build.layer2ThicknessMm!, source: build.layer2Source },
    ],
  });

  it('converts to SI: IEC 60228 240 mm² copper 0.0754 Ω/km = 7.54e-5 Ω/m; IEC 60287-1-1 α20 = 3.93e-3', () => {
    expect(candidate.r20OhmPerM).toBeCloseTo(7.54e-5, 15);
    expect(candidate.alpha20PerK).toBe(0.00393);
    expect(candidate.sectionMm2).toBe(240);
    expect(candidate.conductorDiameterM).toBeCloseTo(0.0184, 12);
    expect(candidate.layers.map((l) => [l.name, l.role, l.thicknessM, l.thermalResistivityKmPerW])).toEqual([
      ['XLPE insulation', 'insulation', 0.0017, 3.5],
      ['PVC sheath', 'sheath', 0.0018, 5],
    ]);
    expect(candidate.layers[0].continuousLimitC).toBe(90);
    expect(candidate.emissivity).toBe(0.9);
  });
  it('carries every source and notices "from memory"', () => {
    expect(candidate.sourceNotes).toContain('240 mm² R₂₀: IEC 60228 Table 2, class 2, maximum at 20 °C (from memory)');
    expect(candidate.dataFromMemory).toBe(true);
    expect(candidate.costs?.conductorPricePerKg).toBe('9.50');
  });
  it('is accepted by the sizing library', () => {
    const conditions: Conditions = {
      designCurrentA: 400,
      frequencyHz: 50,
      phases: 3,
      nominalVoltageV: 230,
      lengthM: 50,
      powerFactor: 0.9,
      ambientC: 30,
      installation: { kind: 'cable-in-air', formation: 'trefoil' },
    };
    const evaluation = evaluateCandidate(candidate, conditions);
    expect(evaluation.ok, JSON.stringify(evaluation)).toBe(true);
    if (evaluation.ok) expect(evaluation.flags.map((f) => f.code)).toContain('DATA_FROM_MEMORY');
  });
});

describe('bar → BarCandidate', () => {
  it('100 × 10 mm copper with epoxy coating: R20 = ρ20/(w·t) = 1.7241e-5 Ω/m (IEC 60287-1-1 ρ20)', () => {
    const candidate = barToCandidate(
      { conductor: conductor('cu-bar-100x10'), material: material('copper'), coating: { covering: covering('epoxy-powder-coating'), thicknessMm: '0.3', source: 'Coating datasheet' } },
      { barsPerPhase: 2 },
    );
    expect(candidate.r20OhmPerM).toBeCloseTo(1.7241e-5, 15);
    expect(candidate.widthM).toBe(0.1);
    expect(candidate.thicknessM).toBe(0.01);
    expect(candidate.barsPerPhase).toBe(2);
    expect(candidate.coating).toMatchObject({ thicknessM: 0.0003, thermalResistivityKmPerW: 5, emissivity: 0.9, continuousLimitC: 130 });
  });
  it('refuses a round conductor', () => {
    expect(() => barToCandidate({ conductor: conductor('cu-240'), material: material('copper') })).toThrow(/not a rectangular bar/);
  });
});
