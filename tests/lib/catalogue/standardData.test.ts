// The standard catalogue against the published tables it cites (../shared/design/references.md)
// and the closed forms it is computed from. No database: the rows as the seed writes them.
import Decimal from 'decimal.js';
import { describe, expect, it } from 'vitest';
import { ROW_SCHEMAS } from '@/lib/catalogue';
import { ohmPerKmToOhmPerKft } from '@/lib/units';
import {
  approximateClass2DiameterMm,
  barR20OhmPerKm,
  STANDARD_BUILDS,
  STANDARD_CONDUCTORS,
  STANDARD_COVERINGS,
  STANDARD_MATERIALS,
} from '@/lib/catalogue/standardData';

const conductor = (key: string) => {
  const row = STANDARD_CONDUCTORS.find((c) => c.key === key);
  if (!row) throw new Error(`no standard conductor ${key}`);
  return row;
};
const equalDecimal = (actual: string | null, expected: string) => expect(new Decimal(actual ?? 'NaN').eq(expected), `${actual} = ${expected}`).toBe(true);

describe('IEC 60228 Table 2, class 2, max R20 (references.md, from memory)', () => {
  // Copied from references.md, "IEC 60228 (conductor resistance)".
  const copper: Array<[string, string]> = [
    ['1.5', '12.1'], ['2.5', '7.41'], ['4', '4.61'], ['6', '3.08'], ['10', '1.83'], ['16', '1.15'], ['25', '0.727'],
    ['35', '0.524'], ['50', '0.387'], ['70', '0.268'], ['95', '0.193'], ['120', '0.153'], ['150', '0.124'],
    ['185', '0.0991'], ['240', '0.0754'], ['300', '0.0601'],
  ];
  const aluminium: Array<[string, string]> = [['50', '0.641'], ['95', '0.320'], ['150', '0.206'], ['240', '0.125']];

  it.each(copper)('copper %s mm² → %s Ω/km', (section, r20) => {
    equalDecimal(conductor(`cu-${section}`).r20OhmPerKm, r20);
    expect(conductor(`cu-${section}`).resistanceSource).toMatch(/IEC 60228 Table 2.*from memory/);
  });
  it.each(aluminium)('aluminium %s mm² → %s Ω/km', (section, r20) => {
    equalDecimal(conductor(`al-${section}`).r20OhmPerKm, r20);
  });
  it('covers copper 1.5–630 mm² and aluminium 16–630 mm²', () => {
    const metric = (prefix: string) => STANDARD_CONDUCTORS.filter((c) => c.sizeSystem === 'metric' && c.key.startsWith(prefix)).map((c) => Number(c.sectionMm2));
    expect(Math.min(...metric('cu-'))).toBe(1.5);
    expect(Math.max(...metric('cu-'))).toBe(630);
    expect(Math.min(...metric('al-'))).toBe(16);
    expect(Math.max(...metric('al-'))).toBe(630);
  });
  it('R20 falls as the section grows (a typo in a recalled value would break the order)', () => {
    for (const prefix of ['cu-', 'al-']) {
      const rows = STANDARD_CONDUCTORS.filter((c) => c.sizeSystem === 'metric' && c.key.startsWith(prefix)).sort((a, b) => Number(a.sectionMm2) - Number(b.sectionMm2));
      for (let i = 1; i < rows.length; i++) expect(Number(rows[i].r20OhmPerKm)).toBeLessThan(Number(rows[i - 1].r20OhmPerKm));
      // ρ20/A is the floor of any stranded conductor's resistance (IEC 60287-1-1 Table 1 ρ20): every maximum lies above it.
      const rho = prefix === 'cu-' ? 0.017241 : 0.028264;
      for (const row of rows) expect(Number(row.r20OhmPerKm)).toBeGreaterThan((rho * 1000) / Number(row.sectionMm2));
    }
  });
});

describe('conductor metals: IEC 60287-1-1 Table 1 and IEC 60949 (references.md)', () => {
  const metal = (key: string) => STANDARD_MATERIALS.find((m) => m.key === key)!;
  it('copper ρ20 = 1.7241e-8 Ω·m, α20 = 3.93e-3; K = 226, β = 234.5', () => {
    equalDecimal(metal('copper').rho20OhmM, '1.7241e-8');
    equalDecimal(metal('copper').alpha20PerK, '3.93e-3');
    equalDecimal(metal('copper').adiabaticK, '226');
    equalDecimal(metal('copper').betaK, '234.5');
  });
  it('aluminium ρ20 = 2.8264e-8 Ω·m, α20 = 4.03e-3; K = 148, β = 228', () => {
    equalDecimal(metal('aluminium').rho20OhmM, '2.8264e-8');
    equalDecimal(metal('aluminium').alpha20PerK, '4.03e-3');
    equalDecimal(metal('aluminium').adiabaticK, '148');
    equalDecimal(metal('aluminium').betaK, '228');
  });
  it('labels the demo metal price as invented', () => {
    for (const m of STANDARD_MATERIALS) expect(m.priceNote).toMatch(/invented demo price/i);
  });
});

describe('coverings: IEC 60287-2-1 Table 1 resistivities and the trade limits (references.md)', () => {
  const covering = (key: string) => STANDARD_COVERINGS.find((c) => c.key === key)!;
  it('PVC 5.0, XLPE 3.5, EPR 3.5, PE 3.5 K·m/W; PVC sheath 5.0 (from memory)', () => {
    equalDecimal(covering('pvc-insulation').thermalResistivityKmPerW, '5.0');
    equalDecimal(covering('xlpe-insulation').thermalResistivityKmPerW, '3.5');
    equalDecimal(covering('epr-insulation').thermalResistivityKmPerW, '3.5');
    equalDecimal(covering('pe-insulation').thermalResistivityKmPerW, '3.5');
    equalDecimal(covering('pvc-sheath').thermalResistivityKmPerW, '5.0');
  });
  it('PVC 70/160 °C, XLPE and EPR 90/250 °C (common practice)', () => {
    equalDecimal(covering('pvc-insulation').continuousLimitC, '70');
    equalDecimal(covering('pvc-insulation').shortCircuitLimitC, '160');
    for (const key of ['xlpe-insulation', 'epr-insulation']) {
      equalDecimal(covering(key).continuousLimitC, '90');
      equalDecimal(covering(key).shortCircuitLimitC, '250');
    }
  });
});

describe('computed conductors', () => {
  it('bar R20 = ρ20/(w·t): copper 100 × 10 mm is 0.017241 Ω/km (IEC 60287-1-1 ρ20, exact arithmetic)', () => {
    equalDecimal(conductor('cu-bar-100x10').r20OhmPerKm, '0.017241');
    equalDecimal(barR20OhmPerKm('aluminium', 50, 10), '0.056528');
    expect(conductor('cu-bar-100x10').resistanceSource).toMatch(/corner radius ignored/);
  });
  // NEC Chapter 9 Table 8, stranded uncoated copper and aluminium, DC resistance at 75 °C, Ω/kft (from memory).
  // 2 %: the table rounds to three figures and its stranding increment varies a little with size.
  const NEC_TABLE_8_75C: Array<[key: string, ohmPerKft: number, material: 'copper' | 'aluminium']> = [
    ['cu-awg-14', 3.14, 'copper'],
    ['cu-awg-10', 1.24, 'copper'],
    ['cu-awg-1-0', 0.122, 'copper'],
    ['cu-awg-4-0', 0.0608, 'copper'],
    ['cu-250kcmil', 0.0515, 'copper'],
    ['cu-500kcmil', 0.0258, 'copper'],
    ['cu-1000kcmil', 0.0129, 'copper'],
    ['al-awg-4-0', 0.1, 'aluminium'],
    ['al-500kcmil', 0.0424, 'aluminium'],
  ];
  it.each(NEC_TABLE_8_75C)('%s at 75 °C ≈ %s Ω/kft (NEC Chapter 9 Table 8, from memory) within 2 %', (key, expected, material) => {
    const alpha = material === 'copper' ? 0.00393 : 0.00403; // IEC 60287-1-1 Table 1
    const r75OhmPerKm = Number(conductor(key).r20OhmPerKm) * (1 + alpha * (75 - 20));
    expect(Math.abs(ohmPerKmToOhmPerKft(r75OhmPerKm) / expected - 1)).toBeLessThan(0.02);
  });
  it('approximate class 2 diameters: 7-wire geometry d = 3·wire for ≤ 6 mm², compacted ≥ 10 mm²', () => {
    // 7 wires of diameter δ: area 7πδ²/4 = A and d = 3δ → d = 3·√(4A/(7π)); for 2.5 mm²: 2.02 mm.
    expect(Number(approximateClass2DiameterMm('2.5'))).toBeCloseTo(3 * Math.sqrt((4 * 2.5) / (7 * Math.PI)), 1);
    // a compacted conductor is larger than a solid rod of its section, smaller than an uncompacted 7/9 fill
    for (const s of ['16', '95', '240', '630']) {
      const d = Number(approximateClass2DiameterMm(s));
      expect(d).toBeGreaterThan(Math.sqrt((4 * Number(s)) / Math.PI));
      expect(d).toBeLessThan(Math.sqrt((4 * Number(s)) / (Math.PI * 7 / 9)));
    }
  });
});

describe('every standard row passes the schema every import passes, and carries its sources', () => {
  it('validates', () => {
    for (const row of STANDARD_MATERIALS) ROW_SCHEMAS.materials.parse(row);
    for (const row of STANDARD_CONDUCTORS) ROW_SCHEMAS.conductors.parse(row);
    for (const row of STANDARD_COVERINGS) ROW_SCHEMAS.coverings.parse(row);
    for (const row of STANDARD_BUILDS) ROW_SCHEMAS.builds.parse(row);
  });
  it('names only invented demo makers for cable builds', () => {
    for (const build of STANDARD_BUILDS) expect(build.maker).toBe('Demo build');
  });
  it('builds reference conductors and coverings that exist', () => {
    const conductors = new Set(STANDARD_CONDUCTORS.map((c) => c.key));
    const coverings = new Set(STANDARD_COVERINGS.map((c) => c.key));
    for (const build of STANDARD_BUILDS) {
      expect(conductors.has(build.conductorKey), build.conductorKey).toBe(true);
      expect(coverings.has(build.layer1CoveringKey as string)).toBe(true);
      expect(coverings.has(build.layer2CoveringKey as string)).toBe(true);
    }
  });
  it('keys are unique per kind', () => {
    for (const rows of [STANDARD_MATERIALS, STANDARD_CONDUCTORS, STANDARD_COVERINGS, STANDARD_BUILDS]) {
      const keys = rows.map((r) => r.key);
      expect(new Set(keys).size).toBe(keys.length);
    }
  });
});
