/**
 * The standard catalogue that the seed copies into every team (lib/catalogue/standardData.ts, plain
 * data) against the tables of references.md: IEC 60228 Table 2 class 2 maximum resistances at
 * 20 °C (from memory) and the IEC 60287-1-1 Table 1 material constants.
 */
import type { ProductLibrary } from '../library';
import type { Quantity, VerificationCase } from '../types';

/** references.md, "IEC 60228 (conductor resistance)": section mm² → Ω/km (from memory). */
const COPPER_CLASS_2: ReadonlyArray<readonly [number, number]> = [
  [1.5, 12.1], [2.5, 7.41], [4, 4.61], [6, 3.08], [10, 1.83], [16, 1.15], [25, 0.727], [35, 0.524],
  [50, 0.387], [70, 0.268], [95, 0.193], [120, 0.153], [150, 0.124], [185, 0.0991], [240, 0.0754], [300, 0.0601],
];
const ALUMINIUM_CLASS_2: ReadonlyArray<readonly [number, number]> = [[50, 0.641], [95, 0.32], [150, 0.206], [240, 0.125]];

function seededR20(lib: ProductLibrary, material: 'copper' | 'aluminium', sectionMm2: number): number {
  const row = lib.catalogueConductors.find(
    (c) => c.materialKey === material && c.shape === 'round' && c.sizeSystem === 'metric' && Number(c.sectionMm2) === sectionMm2,
  );
  // A size missing from the seed is a failure of this check, not a skipped row.
  return row ? Number(row.r20OhmPerKm) : Number.NaN;
}

function tableCase(id: string, title: string, material: 'copper' | 'aluminium', table: ReadonlyArray<readonly [number, number]>): VerificationCase {
  const quantities: Quantity[] = table.map(([section, ohmPerKm]) => ({
    key: `s${section}`,
    label: `R₂₀, ${section} mm²`,
    unit: 'Ω/km',
    reference: ohmPerKm,
    tolerance: { kind: 'relative', value: 1e-12 },
  }));
  return {
    id,
    title,
    area: 'catalogue',
    source: { kind: 'from memory', fromMemory: true, citation: `IEC 60228 Table 2, class 2 plain ${material === 'copper' ? 'copper' : 'aluminium'}, maximum Ω/km at 20 °C (from memory)` },
    inputs: [
      { name: 'catalogue', value: 'standard catalogue seeded into every team (lib/catalogue/standardData.ts)' },
      { name: 'sizes checked', value: table.map(([s]) => s).join(', '), unit: 'mm²' },
    ],
    notes: 'The seeded value must equal the table exactly: it is the default R₂₀ the sizing uses when no datasheet value is entered.',
    quantities,
    compute(lib) {
      return { values: Object.fromEntries(table.map(([section]) => [`s${section}`, seededR20(lib, material, section)])) };
    },
  };
}

const materials: VerificationCase = {
  id: 'catalogue-material-constants',
  title: 'Seeded catalogue materials: ρ₂₀ and α₂₀ of copper and aluminium',
  area: 'catalogue',
  source: { kind: 'standard', citation: 'IEC 60287-1-1 Table 1: Cu 1.7241e-8 Ω·m, 3.93e-3 /K; Al 2.8264e-8 Ω·m, 4.03e-3 /K' },
  inputs: [{ name: 'catalogue', value: 'standard catalogue seeded into every team (lib/catalogue/standardData.ts)' }],
  quantities: [
    { key: 'cuRho', label: 'copper ρ₂₀', unit: 'Ω·m', reference: 1.7241e-8, tolerance: { kind: 'relative', value: 1e-12 } },
    { key: 'cuAlpha', label: 'copper α₂₀', unit: '1/K', reference: 3.93e-3, tolerance: { kind: 'relative', value: 1e-12 } },
    { key: 'alRho', label: 'aluminium ρ₂₀', unit: 'Ω·m', reference: 2.8264e-8, tolerance: { kind: 'relative', value: 1e-12 } },
    { key: 'alAlpha', label: 'aluminium α₂₀', unit: '1/K', reference: 4.03e-3, tolerance: { kind: 'relative', value: 1e-12 } },
  ],
  compute(lib) {
    const find = (key: string) => lib.catalogueMaterials.find((m) => m.key === key);
    const cu = find('copper');
    const al = find('aluminium');
    return {
      values: {
        cuRho: cu ? Number(cu.rho20OhmM) : Number.NaN,
        cuAlpha: cu ? Number(cu.alpha20PerK) : Number.NaN,
        alRho: al ? Number(al.rho20OhmM) : Number.NaN,
        alAlpha: al ? Number(al.alpha20PerK) : Number.NaN,
      },
    };
  },
};

export const catalogueCases: VerificationCase[] = [
  tableCase('catalogue-iec60228-copper', 'Seeded catalogue: IEC 60228 resistances of copper class 2 conductors', 'copper', COPPER_CLASS_2),
  tableCase('catalogue-iec60228-aluminium', 'Seeded catalogue: IEC 60228 resistances of aluminium class 2 conductors', 'aluminium', ALUMINIUM_CLASS_2),
  materials,
];
