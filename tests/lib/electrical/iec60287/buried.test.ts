import { describe, expect, it } from 'vitest';
import { lusolve } from 'mathjs';
import { ElectricalInputError } from '@/lib/electrical';
import {
  backfillCorrection,
  buriedCableExternalResistance,
  ductAirSpaceResistance,
  ductBankEquivalentRadius,
  ductBankGeometricFactor,
  ductExternalResistance,
  ductWallResistance,
  equallyLoadedGroupExternalResistance,
  flatSpacedCentreExternalResistance,
  flatTouchingExternalResistance,
  mutualHeatingRise,
  trefoilTouchingExternalResistance,
  twoFlatTouchingExternalResistance,
} from '@/lib/electrical/iec60287';

const rho = 1.0;
const De = 0.025;

/** Centres of a touching trefoil about (0, −L), apex up. */
const trefoilAt = (L: number, s = De) => [
  { xM: -s / 2, yM: -L - s / (2 * Math.sqrt(3)), externalDiameterM: De },
  { xM: s / 2, yM: -L - s / (2 * Math.sqrt(3)), externalDiameterM: De },
  { xM: 0, yM: -L + s / Math.sqrt(3), externalDiameterM: De },
];
const flatAt = (L: number, s: number, n = 3) =>
  (n === 3 ? [-s, 0, s] : [-s / 2, s / 2]).map((x) => ({ xM: x, yM: -L, externalDiameterM: De }));

/**
 * Logarithmic capacity (equivalent radius) of a union of equal circles, by the method of
 * fundamental solutions: unit total charge on sources inside each circle, equal potential V on
 * collocation points on every circle; capacity = e^V. Solved with mathjs `lusolve` (an outside,
 * general-purpose solver). Checked below on one circle (capacity = its radius, exactly).
 */
function capacityOfCircles(centres: Array<[number, number]>, radius = 1, perCircle = 48): number {
  const cols: Array<[number, number]> = [];
  const srcs: Array<[number, number]> = [];
  for (const [cx, cy] of centres) {
    for (let i = 0; i < perCircle; i++) {
      const t = ((i + 0.5) * 2 * Math.PI) / perCircle;
      cols.push([cx + radius * Math.cos(t), cy + radius * Math.sin(t)]);
      srcs.push([cx + 0.8 * radius * Math.cos(t), cy + 0.8 * radius * Math.sin(t)]);
    }
  }
  const n = srcs.length;
  const A: number[][] = [];
  for (let i = 0; i < n; i++) {
    const row = srcs.map(([sx, sy]) => Math.log(Math.hypot(cols[i][0] - sx, cols[i][1] - sy)));
    row.push(-1);
    A.push(row);
  }
  A.push([...new Array(n).fill(1), 0]);
  const b = [...new Array(n).fill(0), 1];
  const x = lusolve(A, b) as number[][];
  return Math.exp(x[n][0]);
}

/**
 * Logarithmic capacity of a rectangle by a panel (boundary-element) method: piecewise constant
 * charge on N panels, collocation at panel midpoints, 8-point Gauss off the diagonal and the exact
 * self-integral on it; solved with mathjs `lusolve`.
 */
function capacityOfRectangle(a: number, b: number, panels = 160): number {
  const per = 2 * (a + b);
  const pt = (t: number): [number, number] => {
    t = ((t % per) + per) % per;
    if (t < a) return [t - a / 2, -b / 2];
    t -= a;
    if (t < b) return [a / 2, t - b / 2];
    t -= b;
    if (t < a) return [a / 2 - t, b / 2];
    t -= a;
    return [-a / 2, b / 2 - t];
  };
  // Panel ends at equal arc length, corners included because a/(per/N) is whole for the cases used.
  const ends = Array.from({ length: panels + 1 }, (_, i) => pt((i * per) / panels));
  ends[panels] = ends[0];
  const gx = [-0.9602898564975363, -0.7966664774136267, -0.5255324099163290, -0.1834346424956498, 0.1834346424956498, 0.5255324099163290, 0.7966664774136267, 0.9602898564975363];
  const gw = [0.1012285362903763, 0.2223810344533745, 0.3137066458778873, 0.3626837833783620, 0.3626837833783620, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763];
  const mids = ends.slice(0, panels).map((p, j) => [(p[0] + ends[j + 1][0]) / 2, (p[1] + ends[j + 1][1]) / 2]);
  const lens = ends.slice(0, panels).map((p, j) => Math.hypot(ends[j + 1][0] - p[0], ends[j + 1][1] - p[1]));
  const A: number[][] = [];
  for (let i = 0; i < panels; i++) {
    const row: number[] = [];
    for (let j = 0; j < panels; j++) {
      if (i === j) {
        const h = lens[j] / 2;
        row.push(2 * h * (Math.log(h) - 1));
        continue;
      }
      let s = 0;
      for (let g = 0; g < 8; g++) {
        const f = (gx[g] + 1) / 2;
        const qx = ends[j][0] + (ends[j + 1][0] - ends[j][0]) * f;
        const qy = ends[j][1] + (ends[j + 1][1] - ends[j][1]) * f;
        s += gw[g] * Math.log(Math.hypot(mids[i][0] - qx, mids[i][1] - qy));
      }
      row.push((s * lens[j]) / 2);
    }
    row.push(-1);
    A.push(row);
  }
  A.push([...lens, 0]);
  const x = lusolve(A, [...new Array(panels).fill(0), 1]) as number[][];
  return Math.exp(x[panels][0]);
}

describe('single buried cable — IEC 60287-2-1 §4.2.2: T₄ = ρ/(2π)·ln(u + √(u² − 1)), u = 2L/D_e', () => {
  it('L = 0.8 m, D_e = 25 mm, ρ = 1: u = 64, T₄ = ln(64 + √4095)/(2π) = 4.851969/6.283185 = 0.772215', () => {
    expect(buriedCableExternalResistance({ soilResistivityKmPerW: rho, depthM: 0.8, externalDiameterM: De })).toBeCloseTo(0.772215, 6);
  });
  it('approaches ρ/(2π)·ln(2u) for u > 10 (the clause\'s approximation): arccosh u = ln 2u − 1/(4u²) − 3/(32u⁴) − …', () => {
    for (const u of [10, 30, 100]) {
      const exact = buriedCableExternalResistance({ soilResistivityKmPerW: rho, depthM: (u * De) / 2, externalDiameterM: De });
      const gapInLn = Math.log(2 * u) - (exact * 2 * Math.PI) / rho;
      expect(gapInLn).toBeGreaterThan(1 / (4 * u * u));
      expect(gapInLn).toBeLessThan(1.005 / (4 * u * u));
      expect(gapInLn / Math.log(2 * u)).toBeLessThan(1e-3);
    }
  });
  it('refuses a cable not below ground (u ≤ 1), naming the field', () => {
    expect(() => buriedCableExternalResistance({ soilResistivityKmPerW: rho, depthM: 0.01, externalDiameterM: De })).toThrow(ElectricalInputError);
  });
});

describe('mutual heating by superposition with images — IEC 60287-2-1 §4.2.3, checked against each closed form', () => {
  it('flat spaced, centre cable: the superposition IS the closed form ρ/(2π)·ln{(u + √(u² − 1))·[1 + (2L/s₁)²]}', () => {
    // Each neighbour at s₁ has its image at √((2L)² + s₁²): ln(d′/d) = ½·ln(1 + (2L/s₁)²); two of them.
    // L = 0.8 m, s₁ = 0.1 m: 1 + 16² = 257, ln 257 = 5.549076; T₄ = (4.851969 + 5.549076)/(2π) = 1.655378.
    const sup = equallyLoadedGroupExternalResistance({ soilResistivityKmPerW: rho, cables: flatAt(0.8, 0.1), at: 1 });
    const closed = flatSpacedCentreExternalResistance({ soilResistivityKmPerW: rho, depthM: 0.8, externalDiameterM: De, axisSpacingM: 0.1 });
    expect(closed).toBeCloseTo(1.655378, 6);
    expect(sup).toBeCloseTo(closed, 12);
  });

  it('trefoil touching: line-source superposition exceeds (1.5/π)ρ[ln(2u) − 0.630] by (1.5/π)ρ(0.630 − ⅔ln 2) for large u', () => {
    // Superposition, deep: ρ/(2π)[ln(2u) + 2·ln(2L/D_e)] = (1.5/π)ρ[ln(2u) − ⅔·ln 2] = (1.5/π)ρ[ln(2u) − 0.462098].
    // The closed form treats the three surfaces as one isotherm (metallic screens) and so is lower
    // by (1.5/π)(0.630 − 0.462098) = 0.080164·ρ. At L = 0.8 m (u = 64): closed form 2.015871
    // (hand: 0.477465·(4.852030 − 0.630)); superposition of the hottest (lower) cable 2.098192.
    const closed = trefoilTouchingExternalResistance({ soilResistivityKmPerW: rho, depthM: 0.8, externalDiameterM: De });
    expect(closed).toBeCloseTo(2.015871, 5);
    const sup = Math.max(...[0, 1, 2].map((at) => equallyLoadedGroupExternalResistance({ soilResistivityKmPerW: rho, cables: trefoilAt(0.8), at })));
    expect(sup).toBeCloseTo(2.098192, 5);
    for (const L of [2, 5, 20]) {
      const c = trefoilTouchingExternalResistance({ soilResistivityKmPerW: rho, depthM: L, externalDiameterM: De });
      const s = equallyLoadedGroupExternalResistance({ soilResistivityKmPerW: rho, cables: trefoilAt(L), at: 2 });
      expect(s - c).toBeCloseTo(((1.5 / Math.PI) * (0.63 - (2 / 3) * Math.log(2))), 2);
    }
  });

  it("trefoil constant 0.630 and two-cable 0.451 are ln(D_eq/D_e) of touching circles' logarithmic capacity (numerical, mathjs)", () => {
    // Check of the numerical method itself: one circle's capacity is its radius.
    expect(capacityOfCircles([[0, 0]])).toBeCloseTo(1, 5);
    // Unit-radius circles: D_eq/D_e = capacity/radius.
    const h = Math.sqrt(3);
    // Numerically 0.62994 and 0.45158 (= ln(π/2)); the clause prints them to three decimals.
    expect(Math.abs(Math.log(capacityOfCircles([[-1, 0], [1, 0], [0, h]])) - 0.63)).toBeLessThan(1e-3);
    expect(Math.abs(Math.log(capacityOfCircles([[-1, 0], [1, 0]])) - 0.451)).toBeLessThan(1e-3);
    // Far from the surface the group's rise is 3W·ρ/(2π)·ln(4L/D_eq) = (1.5/π)ρW·[ln(2u) − ln(D_eq/D_e)].
  });

  it('flat touching (centre cable) 0.475ρ·ln(2u) − 0.346ρ: within 1.5 % of the isothermal row of three circles for 10 ≤ u ≤ 200', () => {
    const lnDeq = Math.log(capacityOfCircles([[-2, 0], [0, 0], [2, 0]]));
    expect(lnDeq).toBeCloseTo(0.7494, 3);
    for (const u of [10, 30, 64, 200]) {
      const closed = flatTouchingExternalResistance({ soilResistivityKmPerW: rho, depthM: (u * De) / 2, externalDiameterM: De });
      const isothermal = (1.5 / Math.PI) * rho * (Math.log(2 * u) - lnDeq);
      expect(Math.abs(closed / isothermal - 1)).toBeLessThan(0.015);
      // The line-source superposition of the centre cable is higher (conservative), never lower.
      const sup = equallyLoadedGroupExternalResistance({ soilResistivityKmPerW: rho, cables: flatAt((u * De) / 2, De), at: 1 });
      expect(sup).toBeGreaterThan(closed);
    }
  });

  it('two flat touching (ρ/π)[ln(2u) − 0.451] vs superposition: higher by (ρ/π)(0.451 − ½ln 2) deep down', () => {
    // Superposition: ρ/(2π)[ln(2u) + ln(2L/D_e)] = (ρ/π)[ln(2u) − ½ln 2] = (ρ/π)[ln(2u) − 0.346574].
    const L = 10;
    const c = twoFlatTouchingExternalResistance({ soilResistivityKmPerW: rho, depthM: L, externalDiameterM: De });
    const s = equallyLoadedGroupExternalResistance({ soilResistivityKmPerW: rho, cables: flatAt(L, De, 2), at: 0 });
    expect(s - c).toBeCloseTo((0.451 - 0.5 * Math.log(2)) / Math.PI, 4);
  });

  it('unequal losses: ΔT_p = Σ W_k·ρ/(2π)·ln(d′_pk/d_pk), two cables by hand', () => {
    // Cable 1 at (0, −1), cable 2 at (0.3, −1) carrying 20 W/m, ρ = 1.2:
    // d = 0.3, d′ = √(0.3² + 2²) = 2.022375; ln(6.741249) = 1.908245; ΔT = 20·1.2/(2π)·1.908245 = 7.288960 K.
    const dT = mutualHeatingRise({ soilResistivityKmPerW: 1.2, cables: [{ xM: 0, yM: -1, heatWPerM: 35 }, { xM: 0.3, yM: -1, heatWPerM: 20 }], at: 0 });
    expect(dT).toBeCloseTo(7.28896, 5);
  });
});

describe('cables in ducts — IEC 60287-2-1 §4.2.7 (from memory)', () => {
  it("T₄′ = U/[1 + 0.1(V + Yθ_m)D_e], D_e in mm: PVC duct, D_e = 40 mm, θ_m = 50 °C", () => {
    // U, V, Y = 1.87, 0.312, 0.0037: 0.312 + 0.185 = 0.497; 1 + 0.1·0.497·40 = 2.988; T₄′ = 1.87/2.988 = 0.625837.
    const r = ductAirSpaceResistance({ material: 'pvc', cableDiameterM: 0.04, meanAirTemperatureC: 50 });
    expect(r.T4).toBeCloseTo(0.625837, 6);
    expect(r.inStatedRange).toBe(true);
    expect(ductAirSpaceResistance({ material: 'pvc', cableDiameterM: 0.02, meanAirTemperatureC: 50 }).inStatedRange).toBe(false);
  });
  it("T₄″ = ρ/(2π)·ln(D_o/D_d): PVC (ρ = 6.0) 110/100 mm: 6/(2π)·0.0953102 = 0.0910146", () => {
    expect(ductWallResistance({ material: 'pvc', innerDiameterM: 0.1, outerDiameterM: 0.11 })).toBeCloseTo(0.0910146, 6);
  });
  it('T₄‴ is the buried formula at the duct outer diameter: L = 0.8, D_o = 0.11, ρ = 1: ln(u + √(u² − 1))/(2π) at u = 14.5454', () => {
    // u = 1.6/0.11 = 14.545455; √(u² − 1) = 14.511037; ln(29.056492) = 3.369238; /2π = 0.536231.
    expect(ductExternalResistance({ soilResistivityKmPerW: 1, depthM: 0.8, ductOuterDiameterM: 0.11 })).toBeCloseTo(0.536231, 5);
  });
});

describe('backfill / duct bank — IEC 60287-2-1 §4.2.7.4 (from memory)', () => {
  it('the square of side 1 has capacity Γ(¼)²/(4π^{3/2}) = 0.590170 (Pólya–Szegő, from memory): checks the panel method', () => {
    expect(capacityOfRectangle(1, 1)).toBeCloseTo(0.59017, 3);
  });

  it('equivalent radius r_b against the rectangle\'s logarithmic capacity: 0.5 % at 3:1, 3 % at 2:1, 7 % at 1:1 (low)', () => {
    // r_b (this function, x = longer side): 1×1 → 0.549663; 2×1 → 0.850295; 3×1 → 1.141755 (hand,
    // e.g. 3×1: ½·3·(4/π − 3)·ln(1 + 1/9) = −0.272920; e^{−0.272920 + ln 1.5} = 1.141755).
    expect(ductBankEquivalentRadius({ widthM: 1, heightM: 1 })).toBeCloseTo(0.549663, 5);
    expect(ductBankEquivalentRadius({ widthM: 2, heightM: 1 })).toBeCloseTo(0.850295, 5);
    expect(ductBankEquivalentRadius({ widthM: 1, heightM: 3 })).toBeCloseTo(1.141755, 5);
    const dev = (w: number, h: number) => ductBankEquivalentRadius({ widthM: w, heightM: h }) / capacityOfRectangle(w, h, 40 * (w + h)) - 1;
    expect(Math.abs(dev(3, 1))).toBeLessThan(0.008);
    expect(Math.abs(dev(2, 1))).toBeLessThan(0.035);
    expect(dev(1, 1)).toBeLessThan(0);
    expect(dev(1, 1)).toBeGreaterThan(-0.075);
  });

  it('G_b and the correction N/(2π)·(ρ_e − ρ_c)·G_b, worked by hand; beyond side ratio 3 refused', () => {
    // Bank 0.6 × 0.4 m at 1.0 m: q = 1.5; ½·1.5·(1.273240 − 1.5)·ln(1 + 1/2.25) = −0.170070·0.367725 = −0.062539;
    // r_b = 0.3·e^{−0.062539} = 0.281813 m; u = 3.548454; G_b = ln(3.548454 + 3.404632) = 1.939186.
    const { Gb, equivalentRadiusM } = ductBankGeometricFactor({ widthM: 0.6, heightM: 0.4, centreDepthM: 1.0 });
    expect(equivalentRadiusM).toBeCloseTo(0.281813, 5);
    expect(Gb).toBeCloseTo(1.939186, 5);
    // Six cables, soil 2.5, concrete 1.0: 6/(2π)·1.5·1.939186 = 2.777679 K·m/W.
    expect(backfillCorrection({ loadedCables: 6, soilResistivityKmPerW: 2.5, backfillResistivityKmPerW: 1.0, Gb })).toBeCloseTo(2.777679, 5);
    expect(() => ductBankEquivalentRadius({ widthM: 1.0, heightM: 0.3 })).toThrow(/side ratio/);
  });
});
