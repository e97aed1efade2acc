import { describe, expect, it } from 'vitest';
import { ElectricalInputError } from '@/lib/electrical';
import { arrangementSchema, layoutArrangement, parseArrangement, type Arrangement } from '@/lib/electrical/iec60287';

const De = 0.025;
const trefoil = (extra: Partial<Arrangement['circuits'][number]> = {}): Arrangement['circuits'][number] => ({
  externalDiameterM: De,
  formation: 'trefoil',
  spacing: 'touching',
  ...extra,
});

function refusedField(input: unknown): string {
  try {
    layoutArrangement(input);
  } catch (e) {
    expect(e).toBeInstanceOf(ElectricalInputError);
    return (e as ElectricalInputError).field;
  }
  throw new Error('the arrangement was accepted');
}

describe('arrangement layout — cable centres by geometry worked by hand', () => {
  it('touching trefoil: an equilateral triangle of side D_e about its centre at the given depth', () => {
    // Side s = D_e = 25 mm; centroid at depth 0.8 m. Base cables at x = ±s/2 = ±12.5 mm,
    // y = −0.8 − s/(2√3) = −0.8072169 m; apex at y = −0.8 + s/√3 = −0.7855662 m.
    const layout = layoutArrangement({ circuits: [trefoil()], placement: { kind: 'buried', depthM: 0.8 } });
    expect(layout.cables).toHaveLength(3);
    const [a, b, c] = layout.cables;
    expect(a.xM).toBeCloseTo(-0.0125, 12);
    expect(b.xM).toBeCloseTo(0.0125, 12);
    expect(a.yM).toBeCloseTo(-0.8072168784, 9);
    expect(c.xM).toBeCloseTo(0, 12);
    expect(c.yM).toBeCloseTo(-0.7855662433, 9);
    // Each pair touches: centre distance D_e.
    expect(Math.hypot(a.xM - c.xM, a.yM - c.yM)).toBeCloseTo(De, 12);
    expect(layout.circuitCentres[0].yM).toBeCloseTo(-0.8, 12);
    expect(layout.cables.every((k) => k.position === 'trefoil')).toBe(true);
  });

  it('flat rows: horizontal left to right, vertical top to bottom; roles outer/centre; two circuits side by side', () => {
    const layout = layoutArrangement({
      circuits: [
        { externalDiameterM: De, formation: 'flat-horizontal', spacing: 'spaced', axisSpacingM: 0.05 },
        { externalDiameterM: De, formation: 'flat-vertical', spacing: 'touching' },
      ],
      circuitSpacing: { direction: 'horizontal', axisSpacingM: 0.4 },
      placement: { kind: 'buried', depthM: 1.0 },
    });
    const xs = layout.cables.map((k) => [k.xM, k.yM, k.position]);
    expect(xs[0]).toEqual([-0.05, -1.0, 'flat-outer']);
    expect(xs[1]).toEqual([0, -1.0, 'flat-centre']);
    expect(xs[2]).toEqual([0.05, -1.0, 'flat-outer']);
    // Vertical row of circuit 2 about its centre (0.4, −1.0): y = −1.0 + 0.025, −1.0, −1.0 − 0.025.
    expect(xs[3][0]).toBeCloseTo(0.4, 12);
    expect(xs[3][1]).toBeCloseTo(-0.975, 12);
    expect(xs[5][1]).toBeCloseTo(-1.025, 12);
    expect(layout.circuitAxisSpacingM).toEqual([0.05, De]);
  });

  it('in ducts, touching means the ducts touch (axis spacing = duct outer diameter)', () => {
    const layout = layoutArrangement({
      circuits: [{ externalDiameterM: De, formation: 'flat-horizontal', spacing: 'touching' }],
      placement: { kind: 'ducts', depthM: 0.8, duct: { material: 'pvc', innerDiameterM: 0.1, outerDiameterM: 0.11 } },
    });
    expect(layout.circuitAxisSpacingM[0]).toBe(0.11);
    expect(layout.cables[2].xM).toBeCloseTo(0.11, 12);
    expect(layout.cables[0].envelopeDiameterM).toBe(0.11);
  });
});

describe('arrangement refusals name the field (issue 17: nothing half-saved)', () => {
  it('overlapping cables inside a circuit: spacing below D_e', () => {
    expect(refusedField({ circuits: [trefoil({ spacing: 'spaced', axisSpacingM: 0.02 })], placement: { kind: 'air' } })).toBe('circuits.0.axisSpacingM');
  });

  it('zero or missing spacing where spacing is required', () => {
    expect(refusedField({ circuits: [trefoil({ spacing: 'spaced', axisSpacingM: 0 })], placement: { kind: 'air' } })).toBe('circuits.0.axisSpacingM');
    expect(refusedField({ circuits: [trefoil({ spacing: 'spaced' })], placement: { kind: 'air' } })).toBe('circuits.0.axisSpacingM');
    expect(
      refusedField({ circuits: [trefoil(), trefoil()], circuitSpacing: { direction: 'horizontal', axisSpacingM: 0 }, placement: { kind: 'buried', depthM: 0.8 } }),
    ).toBe('circuitSpacing.axisSpacingM');
    expect(refusedField({ circuits: [trefoil(), trefoil()], placement: { kind: 'buried', depthM: 0.8 } })).toBe('circuitSpacing');
  });

  it('overlapping circuits: two trefoils 20 mm apart', () => {
    const field = refusedField({ circuits: [trefoil(), trefoil()], circuitSpacing: { direction: 'horizontal', axisSpacingM: 0.02 }, placement: { kind: 'buried', depthM: 0.8 } });
    expect(field).toBe('circuitSpacing.axisSpacingM');
  });

  it('two trefoils exactly touching side by side are accepted (circuit spacing 2·D_e puts base cables in contact)', () => {
    // Base cables at x = 0.0125 and 0.05 − 0.0125 = 0.0375: 25 mm apart, touching.
    const layout = layoutArrangement({ circuits: [trefoil(), trefoil()], circuitSpacing: { direction: 'horizontal', axisSpacingM: 2 * De }, placement: { kind: 'buried', depthM: 0.8 } });
    expect(layout.cables).toHaveLength(6);
  });

  it('a buried cable above ground: depth smaller than the group reaches', () => {
    // The apex of a trefoil at centre depth 0.01 m reaches 0.01 − 0.0144 − 0.0125 < 0 m depth.
    expect(refusedField({ circuits: [trefoil()], placement: { kind: 'buried', depthM: 0.01 } })).toBe('placement.depthM');
    // A vertical stack of circuits goes down, so only the first must clear the surface.
    expect(refusedField({ circuits: [{ externalDiameterM: De, formation: 'flat-vertical', spacing: 'touching' }], placement: { kind: 'buried', depthM: 0.03 } })).toBe('placement.depthM');
  });

  it('a cable that does not fit its duct, and a duct whose outer diameter is not above its inner one', () => {
    expect(
      refusedField({ circuits: [trefoil({ externalDiameterM: 0.12 })], placement: { kind: 'ducts', depthM: 0.8, duct: { material: 'pvc', innerDiameterM: 0.1, outerDiameterM: 0.11 } } }),
    ).toBe('placement.duct.innerDiameterM');
    expect(
      refusedField({ circuits: [trefoil()], placement: { kind: 'ducts', depthM: 0.8, duct: { material: 'pvc', innerDiameterM: 0.1, outerDiameterM: 0.09 } } }),
    ).toBe('placement.duct.outerDiameterM');
  });

  it('cables outside their backfill, and a backfill above ground', () => {
    expect(
      refusedField({
        circuits: [trefoil(), trefoil()],
        circuitSpacing: { direction: 'horizontal', axisSpacingM: 0.6 },
        placement: { kind: 'backfill', depthM: 0.8, bank: { widthM: 0.3, heightM: 0.3, centreDepthM: 0.8, resistivityKmPerW: 1 } },
      }),
    ).toBe('placement.bank');
    expect(
      refusedField({ circuits: [trefoil()], placement: { kind: 'backfill', depthM: 0.3, bank: { widthM: 0.5, heightM: 0.8, centreDepthM: 0.3, resistivityKmPerW: 1 } } }),
    ).toBe('placement.bank.centreDepthM');
  });

  it('field-level ranges and unknown keys, through the shared schema', () => {
    expect(refusedField({ circuits: [trefoil({ externalDiameterM: -0.01 })], placement: { kind: 'air' } })).toBe('circuits.0.externalDiameterM');
    expect(refusedField({ circuits: [], placement: { kind: 'air' } })).toBe('circuits');
    expect(refusedField({ circuits: [trefoil()], placement: { kind: 'underwater' } })).toBe('placement.kind');
    const parsed = arrangementSchema.safeParse({ circuits: [{ ...trefoil(), colour: 'red' }], placement: { kind: 'air' } });
    expect(parsed.success).toBe(false);
  });

  it('parseArrangement returns the same data it was given when valid', () => {
    const input: Arrangement = { circuits: [trefoil({ currentA: 300, label: 'F1' })], placement: { kind: 'air' } };
    expect(parseArrangement(input)).toEqual(input);
  });
});
