import { describe, expect, it } from 'vitest';
import type { BusbarRectangle } from '@/lib/electrical/busbar/geometry';
import {
  logMeanDistance,
  logMeanDistanceExact,
  logMeanDistanceGradientX,
  logMeanDistanceMultipole,
  MULTIPOLE_DISTANCE_RATIO,
  rectangularForceFactor,
} from '@/lib/electrical/busbar/rectangleInductance';

const rect = (cxM: number, cyM: number, sizeXM: number, sizeYM: number): BusbarRectangle => ({ cxM, cyM, sizeXM, sizeYM });

/**
 * Maxwell's exact geometric mean distance R of a rectangle a × b from itself (Maxwell, *Treatise*,
 * 1873; as quoted by Grover, *Inductance Calculations*, 1946 — from memory):
 * ln R = ln√(a²+b²) − (a²/6b²)·ln√(1+b²/a²) − (b²/6a²)·ln√(1+a²/b²) + (2a/3b)·atan(b/a) + (2b/3a)·atan(a/b) − 25/12.
 */
function maxwellSelfLogGmd(a: number, b: number): number {
  return (
    Math.log(Math.hypot(a, b)) -
    ((a * a) / (6 * b * b)) * Math.log(Math.sqrt(1 + (b * b) / (a * a))) -
    ((b * b) / (6 * a * a)) * Math.log(Math.sqrt(1 + (a * a) / (b * b))) +
    ((2 * a) / (3 * b)) * Math.atan(b / a) +
    ((2 * b) / (3 * a)) * Math.atan(a / b) -
    25 / 12
  );
}

// Gauss–Legendre nodes and weights on [−1, 1], 12 points (Abramowitz & Stegun Table 25.4 values,
// recomputed here by Newton's method on P₁₂ so that no table is typed in).
function gaussLegendre(n: number): { x: number[]; w: number[] } {
  const x: number[] = [];
  const w: number[] = [];
  for (let i = 1; i <= n; i++) {
    let z = Math.cos((Math.PI * (i - 0.25)) / (n + 0.5));
    let dp = 0;
    for (let iter = 0; iter < 100; iter++) {
      let p0 = 1;
      let p1 = z;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      dp = (n * (z * p1 - p0)) / (z * z - 1);
      const dz = p1 / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-16) break;
    }
    x.push(z);
    w.push(2 / ((1 - z * z) * dp * dp));
  }
  return { x, w };
}

/**
 * ⟨f(p − q)⟩ over p ∈ a, q ∈ b by composite Gauss–Legendre quadrature: each side cut into panels
 * about as long as the gap between the rectangles, 8 points per panel (the definition, integrated
 * numerically; the integrand varies on the scale of the gap).
 */
function quadratureMean(a: BusbarRectangle, b: BusbarRectangle, f: (dx: number, dy: number) => number, panelM: number): number {
  const { x, w } = gaussLegendre(8);
  const rule = (centre: number, size: number) => {
    const panels = Math.max(1, Math.ceil(size / panelM));
    const nodes: number[] = [];
    const weights: number[] = [];
    for (let p = 0; p < panels; p++) {
      const lo = centre - size / 2 + (p * size) / panels;
      const h = size / panels;
      x.forEach((xi, i) => {
        nodes.push(lo + ((xi + 1) * h) / 2);
        weights.push((w[i] * h) / 2 / size);
      });
    }
    return { nodes, weights };
  };
  const ax = rule(a.cxM, a.sizeXM);
  const ay = rule(a.cyM, a.sizeYM);
  const bx = rule(b.cxM, b.sizeXM);
  const by = rule(b.cyM, b.sizeYM);
  let sum = 0;
  ax.nodes.forEach((x1, i) =>
    ay.nodes.forEach((y1, j) =>
      bx.nodes.forEach((x2, k) =>
        by.nodes.forEach((y2, l) => {
          sum += ax.weights[i] * ay.weights[j] * bx.weights[k] * by.weights[l] * f(x1 - x2, y1 - y2);
        }),
      ),
    ),
  );
  return sum;
}

describe('geometric mean distance of rectangles (the kernel of the partial inductances)', () => {
  it.each([
    [1, 1],
    [2, 1],
    [10, 1],
    [100, 1],
  ])('a rectangle %i × %i from itself: Maxwell’s exact self-GMD (Grover 1946, from memory)', (a, b) => {
    const r = rect(0.3, -0.2, a * 0.01, b * 0.01);
    expect(logMeanDistanceExact(r, r)).toBeCloseTo(maxwellSelfLogGmd(a * 0.01, b * 0.01), 11);
  });

  it('square: R = 0.44705·a; thin strip: R = e^(−3/2)·a = 0.22313·a (Grover 1946 tables, from memory)', () => {
    expect(Math.exp(logMeanDistanceExact(rect(0, 0, 0.02, 0.02), rect(0, 0, 0.02, 0.02))) / 0.02).toBeCloseTo(0.44705, 5);
    // 1000 : 1 (the 16-term sum loses digits as (a/b)²·ε for more extreme strips; filaments stay far from that).
    const strip = rect(0, 0, 0.1, 1e-4);
    expect(Math.exp(logMeanDistanceExact(strip, strip)) / 0.1).toBeCloseTo(Math.exp(maxwellSelfLogGmd(0.1, 1e-4)) / 0.1, 8);
    expect(Math.abs(Math.exp(logMeanDistanceExact(strip, strip)) / 0.1 / 0.22313 - 1)).toBeLessThan(2e-3);
  });

  it.each([
    ['two bars of a pack, gap = thickness', rect(0, 0, 0.01, 0.1), rect(0.02, 0, 0.01, 0.1)],
    ['diagonal neighbours of different size', rect(0, 0, 0.01, 0.02), rect(0.017, 0.025, 0.004, 0.003)],
    ['one above the other (flat pack)', rect(0, 0, 0.1, 0.01), rect(0.004, 0.02, 0.1, 0.01)],
  ])('%s: the closed form equals the defining integral by Gauss–Legendre quadrature', (_, a, b) => {
    const reference = quadratureMean(a, b, (dx, dy) => 0.5 * Math.log(dx * dx + dy * dy), 0.005);
    expect(logMeanDistanceExact(a, b)).toBeCloseTo(reference, 9);
  });

  it('far apart it tends to ln D, the two-filament mutual inductance (μ₀/2π)·ln(D_ref/D)', () => {
    const a = rect(0, 0, 0.01, 0.1);
    for (const d of [1, 10, 100]) {
      const b = rect(d, 0.3 * d, 0.01, 0.1);
      const D = Math.hypot(d, 0.3 * d);
      // The first correction is −Re(⟨w²⟩/2z²) ~ (size/D)²: 1e-3 at 1 m, 1e-7 at 100 m.
      expect(Math.abs(logMeanDistance(a, b) - Math.log(D))).toBeLessThan(2e-3 / (d * d));
    }
    // The exact 16-term sum agrees where it is still accurate (it loses digits as (D/size)⁴·ε far away,
    // which is why logMeanDistance switches to the multipole form there).
    const near = rect(1, 0.3, 0.01, 0.1);
    expect(Math.abs(logMeanDistanceExact(a, near) - logMeanDistance(a, near))).toBeLessThan(1e-9);
  });

  it('the multipole shortcut agrees with the exact sum where it takes over (4 × the largest side)', () => {
    const a = rect(0, 0, 0.004, 0.01);
    const side = 0.01;
    for (const angle of [0, 0.4, 1.1, Math.PI / 2]) {
      const d = MULTIPOLE_DISTANCE_RATIO * side * 1.0001;
      const b = rect(d * Math.cos(angle), d * Math.sin(angle), 0.006, 0.002);
      expect(Math.abs(logMeanDistanceMultipole(a, b) - logMeanDistanceExact(a, b))).toBeLessThan(1e-7);
    }
  });
});

describe('force between rectangular conductors (Dwight’s factor k, IEC 60865-1 Figure 1)', () => {
  it('the gradient equals the defining integral ⟨(x₁ − x₂)/r²⟩ by quadrature', () => {
    const a = rect(0.02, 0, 0.01, 0.1);
    const b = rect(0, 0, 0.01, 0.1);
    const reference = quadratureMean(a, b, (dx, dy) => dx / (dx * dx + dy * dy), 0.005);
    expect(logMeanDistanceGradientX(a, b)).toBeCloseTo(reference, 6);
  });

  it('thin strips: k = (2s/b)·atan(b/s) − (s/b)²·ln(1 + b²/s²), derived in the comment', () => {
    // Two zero-thickness strips of width b, facing at distance s: ∂⟨ln r⟩/∂s
    // = (1/b²)∫∫ s/(s² + (y₁ − y₂)²) = (1/b²)∫_{−b}^{b} (b − |η|)·s/(s² + η²) dη
    // = (2/b²)[b·atan(b/s) − (s/2)·ln(1 + b²/s²)], and k = s·∂⟨ln r⟩/∂s.
    for (const [s, b] of [
      [0.02, 0.1],
      [0.05, 0.1],
      [0.2, 0.06],
    ]) {
      const dwight = ((2 * s) / b) * Math.atan(b / s) - ((s * s) / (b * b)) * Math.log(1 + (b * b) / (s * s));
      const k = rectangularForceFactor({ centreDistanceM: s, dimensionAlongForceM: 1e-5, dimensionAcrossForceM: b });
      expect(k).toBeCloseTo(dwight, 5);
    }
  });

  it('tends to 1 far apart (filaments) and is below 1 for bars whose long side is across the force', () => {
    expect(rectangularForceFactor({ centreDistanceM: 5, dimensionAlongForceM: 0.01, dimensionAcrossForceM: 0.1 })).toBeCloseTo(1, 3);
    const k = rectangularForceFactor({ centreDistanceM: 0.02, dimensionAlongForceM: 0.01, dimensionAcrossForceM: 0.1 });
    expect(k).toBeGreaterThan(0.2);
    expect(k).toBeLessThan(0.6);
  });
});
