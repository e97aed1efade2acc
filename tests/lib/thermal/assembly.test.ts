/**
 * The one assembly (lib/thermal/assembly.ts) on two-cell meshes worked by hand, in the spirit of a
 * doctest: the matrix A and the vector b of a_P θ_P = a_W θ_W + a_E θ_E + b (Patankar 1980, ch. 4;
 * physics.md §1), unknowns θ = T − T_ref with T_ref the outer air. The hand values use only the
 * formulas of physics.md §1: half-cells in series, δ/(2k) in a slab and ln(r_f/r_P)/(2πk) per metre
 * in a cylinder (Incropera §3.3.1), the boundary half-cell in series with h·A, S_p and S_u over ΔV,
 * ρcΔV/Δt. The solution of the assembled system is checked against a dense LU solve by mathjs.
 */
import { lusolve } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { assemble, createContext } from '@/lib/thermal/assembly';
import { boundaryTerms } from '@/lib/thermal/boundary';
import { jouleCoefficients, jouleLine } from '@/lib/thermal/source';
import { thomas } from '@/lib/thermal/tridiagonal';
import type { ThermalProblem } from '@/lib/thermal';
import { requireHeatCapacities, validateProblem } from '@/lib/thermal/validate';

/** Dense A (rows) and b of the context's tridiagonal system. */
function system(ctx: ReturnType<typeof createContext>): { A: number[][]; b: number[] } {
  const n = ctx.mesh.cellCount;
  const A = Array.from({ length: n }, (_, i) => {
    const row = new Array<number>(n).fill(0);
    row[i] = ctx.work.diagonal[i];
    if (i > 0) row[i - 1] = ctx.work.lower[i];
    if (i < n - 1) row[i + 1] = ctx.work.upper[i];
    return row;
  });
  return { A, b: Array.from(ctx.work.rhs) };
}

function expectClose(actual: number[][] | number[], expected: number[][] | number[], relative = 1e-12): void {
  const a = actual.flat() as number[];
  const e = expected.flat() as number[];
  expect(a.length).toBe(e.length);
  a.forEach((v, i) => expect(Math.abs(v - e[i])).toBeLessThanOrEqual(relative * Math.max(Math.abs(e[i]), 1e-300)));
}

/** Solve the assembled system with the library's Thomas sweep and with mathjs's dense LU. */
function solutions(ctx: ReturnType<typeof createContext>): { thomas: number[]; dense: number[] } {
  const n = ctx.mesh.cellCount;
  const w = ctx.work;
  thomas(n, w.lower, w.diagonal, w.upper, w.rhs, w.solution, w.scratch);
  const { A, b } = system(ctx);
  const dense = (lusolve(A, b) as number[][]).map((r) => r[0]);
  return { thomas: Array.from(w.solution), dense };
}

describe('slab, two cells, uniform source, temperature inside, surface outside', () => {
  // 20 mm of k = 2 W/(m·K) in two 10 mm cells, q = 1e5 W/m³ in both, 40 °C on the inner face,
  // air at 20 °C with h = 10 W/(m²·K) outside. Per m² of face; T_ref = 20 °C.
  //   half-cell 5 mm: δ/(2k) = 0.0025 K·m²/W
  //   interior face:  G = 1/(0.0025 + 0.0025)            = 200 W/(m²·K)
  //   inner face:     G_B = 1/0.0025 = 400, θ_B = 40 − 20 → a_P += 400, b += 400·20 = 8 000
  //   outer face:     1/(1/400 + 1/10) = 4 000/410        = 9.756 097 56 W/(m²·K), b += 0 (linear, no sun)
  //   source:         S_u ΔV = 1e5 · 0.01                 = 1 000 W/m² per cell
  //
  //   A = | 600          −200         |    b = | 9 000 |
  //       | −200   200 + 9.756 097 56 |        | 1 000 |
  const problem: ThermalProblem = {
    geometry: { kind: 'slab', layers: [{ thickness: 0.02, conductivity: 2, generating: true, cells: 2, density: 2000, heatCapacity: 1000 }] },
    source: { kind: 'uniform', q: 1e5 },
    inner: { kind: 'temperature', value: 40 },
    outer: { kind: 'surface', ambient: 20, h: 10 },
  };

  it('steady: A and b as worked by hand', () => {
    const ctx = createContext(validateProblem(problem, true));
    expect(ctx.reference).toBe(20);
    const rises = new Float64Array(2);
    assemble(ctx, { mode: 'lagged', joule: undefined, rises, previousRises: undefined, inner: boundaryTerms(ctx.inner, NaN, 20), outer: boundaryTerms(ctx.outer, 5, 20) });
    const { A, b } = system(ctx);
    expectClose(A, [
      [600, -200],
      [-200, 200 + 4000 / 410],
    ]);
    expectClose(b, [9000, 1000]);
    // θ = A⁻¹b by Cramer's rule: det = 600·209.756 097 56 − 200² = 85 853.658 5;
    // θ₁ = (9 000·209.756 097 56 + 200·1 000)/det = 24.318 182 K, θ₂ = (600·1 000 + 200·9 000)/det = 27.954 545 K.
    const s = solutions(ctx);
    expectClose(s.thomas, s.dense, 1e-12);
    expectClose(s.thomas, [24.318181818, 27.954545455], 1e-9);
  });

  it('one implicit-Euler step of 10 s: a_P += ρcΔV/Δt = 2 000·1 000·0.01/10 = 2 000 W/(m²·K), b += 2 000·θ_old', () => {
    const normalized = validateProblem(problem, false);
    requireHeatCapacities(normalized);
    const ctx = createContext(normalized, 10);
    const previousRises = Float64Array.from([5, 3]);
    assemble(ctx, { mode: 'lagged', joule: undefined, rises: previousRises, previousRises, inner: boundaryTerms(ctx.inner, NaN, 20), outer: boundaryTerms(ctx.outer, 3, 20) });
    const { A, b } = system(ctx);
    expectClose(A, [
      [2600, -200],
      [-200, 2200 + 4000 / 410],
    ]);
    expectClose(b, [9000 + 2000 * 5, 1000 + 2000 * 3]);
  });
});

describe('solid cylinder, two cells, Joule source (tangent), surface outside', () => {
  // Copper rod r = 10 mm, k = 1 W/(m·K) (a low k keeps the conduction terms readable), two cells
  // [0, 5] and [5, 10] mm with nodes at the RMS radius (mesh.ts): r₁ = 5/√3 = 2.886 751 mm,
  // r₂ = √((25 + 50 + 100)/3) = 7.637 626 mm, so r₂/r₁ = √7 and r_o/r₂ = √(12/7).
  // 300 A, ρ₂₀ = 1.7241e-8 Ω·m, α₂₀ = 3.93e-3 /K, F_ac = 1; air 30 °C, h = 20 W/(m²·K). Per metre.
  //   interior face:  G = 2πk/ln(r₂/r₁) = 4π/ln 7                       = 6.457 837 03 W/(m·K)
  //   outer half-cell: G_B = 2πk/ln(r_o/r₂) = 4π/ln(12/7)              = 23.314 382 6 W/(m·K)
  //   surface: h·2πr_o = 1.256 637 06; in series: G_B·hA/(G_B + hA)     = 1.192 368 80 W/(m·K)
  //   axis: zero area (symmetry), nothing.
  //   ΔV₁ = π·5² mm² = 7.853 982e-5 m², ΔV₂ = π(10² − 5²) mm² = 2.356 194e-4 m²
  //   J = 300/(π·1e-4) A/m²; q₂₀ = J²ρ₂₀ = 15 721.906 7 W/m³; S_p = q₂₀α₂₀ = 61.787 093 5 W/(m³·K)
  //   S_u = q(30 °C) = q₂₀(1 + 10α₂₀) = 16 339.777 7 W/m³
  //
  //   A = | 6.457 837 03 − 61.787 093 5·ΔV₁   −6.457 837 03                           |  = | 6.452 984 28   −6.457 837 03 |
  //       | −6.457 837 03                     6.457 837 03 + 1.192 368 80 − 61.787·ΔV₂ |    | −6.457 837 03  7.635 647 59 |
  //   b = | 16 339.777 7·ΔV₁ |  = | 1.283 323 14 |
  //       | 16 339.777 7·ΔV₂ |    | 3.849 969 41 |
  const problem: ThermalProblem = {
    geometry: { kind: 'cylinder', layers: [{ thickness: 0.01, conductivity: 1, generating: true, cells: 2 }] },
    source: { kind: 'joule', current: 300, area: Math.PI * 1e-4, rho20: 1.7241e-8, alpha20: 3.93e-3 },
    inner: { kind: 'symmetry' },
    outer: { kind: 'surface', ambient: 30, h: 20 },
  };

  it('A and b as worked by hand', () => {
    const normalized = validateProblem(problem, true);
    const ctx = createContext(normalized);
    const line = jouleLine(jouleCoefficients(normalized.source as Extract<typeof normalized.source, { kind: 'joule' }>), ctx.reference);
    const rises = new Float64Array(2);
    assemble(ctx, { mode: 'tangent', joule: line, rises, previousRises: undefined, inner: boundaryTerms(ctx.inner, NaN, 30), outer: boundaryTerms(ctx.outer, 10, 30) });
    const { A, b } = system(ctx);
    expectClose(
      A,
      [
        [6.452984281346975, -6.457837028323124],
        [-6.457837028323124, 7.63564758773402],
      ],
      1e-11,
    );
    expectClose(b, [1.2833231379928056, 3.8499694139784175], 1e-11);
    const s = solutions(ctx);
    expectClose(s.thomas, s.dense, 1e-12);
  });

  it('lagged at θ* = (40, 35) K: S_p = 0 and S_u = q(T*) per cell', () => {
    const normalized = validateProblem(problem, true);
    const ctx = createContext(normalized);
    const line = jouleLine(jouleCoefficients(normalized.source as Extract<typeof normalized.source, { kind: 'joule' }>), ctx.reference);
    const rises = Float64Array.from([40, 35]);
    assemble(ctx, { mode: 'lagged', joule: line, rises, previousRises: undefined, inner: boundaryTerms(ctx.inner, NaN, 30), outer: boundaryTerms(ctx.outer, 10, 30) });
    const { A, b } = system(ctx);
    const G = (4 * Math.PI) / Math.log(7);
    expectClose(
      A,
      [
        [G, -G],
        [-G, G + 1.1923688003393436],
      ],
      1e-11,
    );
    // q(70 °C) = q₂₀(1 + 50α₂₀), q(65 °C) = q₂₀(1 + 45α₂₀).
    const q20 = 15721.906744597907;
    expectClose(b, [q20 * (1 + 50 * 3.93e-3) * 7.853981633974483e-5, q20 * (1 + 45 * 3.93e-3) * 2.356194490192345e-4], 1e-11);
  });
});
