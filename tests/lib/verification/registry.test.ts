/**
 * Runs THE SAME registry the /verification page runs (lib/verification), so the page and CI
 * cannot disagree. Each case carries its own source (textbook section, IEC clause, "from
 * memory" or "common practice" as in references.md) and tolerance; this file checks that every
 * case passes, that the registry covers the methods of issue 10, and that a deliberately broken
 * formula injected into a case's library makes exactly the matching case fail.
 */
import { describe, expect, it } from 'vitest';
import { lusolve } from 'mathjs';
import {
  casesForMethod,
  getCase,
  METHOD_AREAS,
  METHODS_BEHIND_RESULT,
  productLibrary,
  runCase,
  verificationCases,
  type ProductLibrary,
} from '@/lib/verification';
import { denseGaussianSolve, denseMatrix, randomTridiagonalSystem } from '@/lib/verification/cases/linearAlgebra';
import { KELVIN_OFFSET } from '@/lib/thermal';

describe('the verification registry', () => {
  it('holds at least 25 cases with unique ids, a source, inputs and stated tolerances', () => {
    expect(verificationCases.length).toBeGreaterThanOrEqual(25);
    const ids = verificationCases.map((c) => c.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const c of verificationCases) {
      expect(c.id).toMatch(/^[a-z0-9-]+$/);
      expect(c.source.citation.length).toBeGreaterThan(10);
      expect(c.inputs.length).toBeGreaterThan(0);
      expect(c.quantities.length).toBeGreaterThan(0);
      for (const q of c.quantities) {
        expect(Number.isFinite(q.reference)).toBe(true);
        expect(q.tolerance.value).toBeGreaterThanOrEqual(0);
        expect(['absolute', 'relative']).toContain(q.tolerance.kind);
      }
      // "From memory" must stay visible wherever a recalled value is the check (references.md).
      if (c.source.fromMemory) expect(c.source.citation).toMatch(/from memory/);
    }
  });

  it('covers every method area named in issue 10', () => {
    const required = [
      'plane-wall-generation',
      'solid-cylinder-generation',
      'composite-cylinder',
      'joule-core-temperature',
      'joule-runaway-onset',
      'churchill-chu-horizontal-cylinder',
      'churchill-chu-vertical-plate',
      'radiation-coefficient',
      'resistance-cu-240-90c',
      'skin-effect-cu-240-90c-50hz',
      'ampacity-buried-dc',
      'k-factor-cu-pvc',
      'k-factor-cu-xlpe',
      'k-factor-al-pvc',
      'k-factor-al-xlpe',
      'voltage-drop-three-phase-cu',
      'tridiagonal-vs-dense-elimination',
      'catalogue-iec60228-copper',
      'catalogue-iec60228-aluminium',
    ];
    for (const id of required) expect(getCase(id), id).toBeDefined();
    for (const area of METHOD_AREAS) expect(casesForMethod(area).length, area).toBeGreaterThan(0);
  });

  it('field cases carry the profile beside the closed form and a convergence study', () => {
    const fieldCases = verificationCases.filter((c) => c.field);
    expect(fieldCases.map((c) => c.id)).toEqual(expect.arrayContaining(['plane-wall-generation', 'solid-cylinder-generation', 'composite-cylinder']));
    for (const c of fieldCases) {
      const r = runCase(c);
      expect(r.profile?.positions.length).toBe(r.profile?.solver.length);
      expect(r.profile?.closedFormAtNodes.length).toBe(r.profile?.positions.length);
      const study = r.convergence!;
      expect(study.cells.length).toBeGreaterThanOrEqual(4);
      // Each refinement by 2 cuts the error about 4× (second order, references.md: order ≥ 1.9).
      for (let i = 1; i < study.cells.length; i++) expect(study.maxErrors[i]).toBeLessThan(study.maxErrors[i - 1] / 3.5);
      expect(study.measuredOrder).toBeGreaterThanOrEqual(1.9);
    }
  });
});

describe.each(verificationCases.map((c) => [c.id, c] as const))('case %s', (_id, verificationCase) => {
  it(`passes: ${verificationCase.title} — ${verificationCase.source.citation}`, () => {
    const result = runCase(verificationCase);
    const failing = result.quantities.filter((q) => !q.pass).map((q) => `${q.label}: ${q.value} vs ${q.reference}`);
    expect(result.error, result.error).toBeUndefined();
    expect(failing).toEqual([]);
    expect(result.pass).toBe(true);
  });
});

// ── A broken formula makes the matching case fail ──────────────────────────────────────────────
function failsWith(id: string, broken: Partial<ProductLibrary>): boolean {
  const c = getCase(id);
  if (!c) throw new Error(`no case ${id}`);
  return !runCase(c, { ...productLibrary, ...broken }).pass;
}

describe('a deliberately broken formula fails its case (dependency injection)', () => {
  it('σ = 5.67e-8 (a rounded, pre-CODATA value) fails the radiation cases', () => {
    const wrongSigma = 5.67e-8;
    const radiationCoefficient: ProductLibrary['radiationCoefficient'] = ({ emissivity, surfaceC, surroundingsC }) => {
      const ts = surfaceC + KELVIN_OFFSET;
      const tsur = surroundingsC + KELVIN_OFFSET;
      return emissivity * wrongSigma * (ts + tsur) * (ts * ts + tsur * tsur);
    };
    const radiativeFlux: ProductLibrary['radiativeFlux'] = ({ emissivity, surfaceC, surroundingsC }) =>
      emissivity * wrongSigma * ((surfaceC + KELVIN_OFFSET) ** 4 - (surroundingsC + KELVIN_OFFSET) ** 4);
    expect(failsWith('radiation-coefficient', { radiationCoefficient, stefanBoltzmann: wrongSigma })).toBe(true);
    expect(failsWith('radiation-coefficient', { radiationCoefficient })).toBe(true);
    expect(failsWith('radiative-flux', { radiativeFlux })).toBe(true);
    // The same broken function leaves unrelated cases passing: the failure points at the method.
    expect(failsWith('voltage-drop-three-phase-cu', { radiationCoefficient })).toBe(false);
  });

  it('a skin-effect formula with 0.8·x⁴ left out of the denominator fails the skin-effect cases', () => {
    const skinEffectFactor: ProductLibrary['skinEffectFactor'] = ({ resistance, frequency, ks = 1 }) => {
      const xs2 = (8 * Math.PI * frequency * 1e-7 * ks) / resistance;
      return (xs2 * xs2) / 192;
    };
    expect(failsWith('skin-effect-cu-240-90c-50hz', { skinEffectFactor })).toBe(true);
    expect(failsWith('skin-effect-cu-150-90c-60hz', { skinEffectFactor })).toBe(true);
    expect(failsWith('resistance-cu-240-90c', { skinEffectFactor })).toBe(false);
  });

  it('resistance referred to 0 °C instead of 20 °C fails the resistance cases', () => {
    const resistanceAt: ProductLibrary['resistanceAt'] = ({ r20, alpha20, temperature }) => r20 * (1 + alpha20 * temperature);
    expect(failsWith('resistance-cu-240-90c', { resistanceAt })).toBe(true);
    expect(failsWith('resistance-al-95-70c', { resistanceAt })).toBe(true);
    expect(failsWith('skin-effect-cu-150-90c-60hz', { resistanceAt })).toBe(true);
  });

  it('a k factor without the square root of the logarithm fails every k-factor case', () => {
    const adiabaticK: ProductLibrary['adiabaticK'] = ({ material, initial, final }) => {
      const [K, beta] = material === 'copper' ? [226, 234.5] : [148, 228];
      return K * Math.log((final + beta) / (initial + beta));
    };
    for (const id of ['k-factor-cu-pvc', 'k-factor-cu-xlpe', 'k-factor-al-pvc', 'k-factor-al-xlpe']) expect(failsWith(id, { adiabaticK }), id).toBe(true);
    expect(failsWith('short-circuit-final-temperature', { adiabaticK })).toBe(false);
  });

  it('a voltage drop with b = 1 for a single-phase circuit fails the single-phase case only', () => {
    const voltageDrop: ProductLibrary['voltageDrop'] = (args) => productLibrary.voltageDrop({ ...args, phases: 3 });
    expect(failsWith('voltage-drop-single-phase-al', { voltageDrop })).toBe(true);
    expect(failsWith('voltage-drop-three-phase-cu', { voltageDrop })).toBe(false);
  });

  it('a short-circuit final temperature that forgets β fails its case', () => {
    const shortCircuitFinalTemperature: ProductLibrary['shortCircuitFinalTemperature'] = ({ current, duration, section, initial }) =>
      initial * Math.exp((current * current * duration) / (226 ** 2 * section * section));
    expect(failsWith('short-circuit-final-temperature', { shortCircuitFinalTemperature })).toBe(true);
  });

  it('a tridiagonal solve that drops the upper diagonal in back substitution fails the linear-algebra cases', () => {
    const solveTridiagonal: ProductLibrary['solveTridiagonal'] = (lower, diagonal, _upper, rhs) =>
      productLibrary.solveTridiagonal(lower, diagonal, new Array(diagonal.length).fill(0), rhs);
    expect(failsWith('tridiagonal-vs-dense-elimination', { solveTridiagonal })).toBe(true);
    expect(failsWith('tridiagonal-manufactured-solution', { solveTridiagonal })).toBe(true);
  });

  it('a heat balance with the conductivity 2 % off fails the conduction field cases', () => {
    const solveSteady: ProductLibrary['solveSteady'] = (problem) =>
      productLibrary.solveSteady({
        ...problem,
        geometry: { ...problem.geometry, layers: problem.geometry.layers.map((l) => ({ ...l, conductivity: l.conductivity * 1.02 })) },
      });
    for (const id of ['plane-wall-generation', 'solid-cylinder-generation', 'composite-cylinder', 'cylindrical-layers-conduction']) {
      expect(failsWith(id, { solveSteady }), id).toBe(true);
    }
  });

  it('a heat balance that ignores R(T) (α = 0) fails the runaway cases', () => {
    const solveSteady: ProductLibrary['solveSteady'] = (problem) =>
      productLibrary.solveSteady(problem.source.kind === 'joule' ? { ...problem, source: { ...problem.source, alpha20: 0 } } : problem);
    expect(failsWith('joule-core-temperature', { solveSteady })).toBe(true);
    expect(failsWith('joule-runaway-onset', { solveSteady })).toBe(true);
    expect(failsWith('joule-runaway-beyond-onset', { solveSteady })).toBe(true);
  });

  it('an ampacity 1 % high fails the ampacity cases', () => {
    const ampacity: ProductLibrary['ampacity'] = (candidate, conditions) => {
      const r = productLibrary.ampacity(candidate, conditions);
      return { ...r, current: r.current * 1.01 };
    };
    expect(failsWith('ampacity-buried-dc', { ampacity })).toBe(true);
    expect(failsWith('ampacity-air-ac-fixed-h', { ampacity })).toBe(true);
  });

  it('a seeded catalogue row with a mistyped resistance (0.0745 for 0.0754 Ω/km) fails the IEC 60228 case', () => {
    const catalogueConductors = productLibrary.catalogueConductors.map((row) =>
      row.key === 'cu-240' ? { ...row, r20OhmPerKm: '0.0745' } : row,
    );
    expect(productLibrary.catalogueConductors.some((row) => row.key === 'cu-240')).toBe(true);
    expect(failsWith('catalogue-iec60228-copper', { catalogueConductors })).toBe(true);
    expect(failsWith('catalogue-iec60228-aluminium', { catalogueConductors })).toBe(false);
    // A size dropped from the seed fails too, rather than being skipped.
    const withoutAl150 = productLibrary.catalogueConductors.filter((row) => row.key !== 'al-150');
    expect(failsWith('catalogue-iec60228-aluminium', { catalogueConductors: withoutAl150 })).toBe(true);
  });

  it('a Churchill–Chu cylinder with 0.559 replaced by the plate constant 0.492 fails its case', () => {
    const churchillChuHorizontalCylinder: ProductLibrary['churchillChuHorizontalCylinder'] = (ra, pr) =>
      (0.6 + (0.387 * ra ** (1 / 6)) / (1 + (0.492 / pr) ** (9 / 16)) ** (8 / 27)) ** 2;
    expect(failsWith('churchill-chu-horizontal-cylinder', { churchillChuHorizontalCylinder })).toBe(true);
  });
});

describe('the runner never passes by default', () => {
  const base = getCase('resistance-cu-240-90c')!;
  it('a case that throws fails and says why', () => {
    const r = runCase({ ...base, compute: () => { throw new Error('boom'); } });
    expect(r.pass).toBe(false);
    expect(r.error).toMatch(/boom/);
  });
  it('a missing or non-finite value fails', () => {
    expect(runCase({ ...base, compute: () => ({ values: {} }) }).pass).toBe(false);
    expect(runCase({ ...base, compute: () => ({ values: { r: Number.NaN } }) }).pass).toBe(false);
    expect(runCase({ ...base, compute: () => ({ values: { r: Number.POSITIVE_INFINITY } }) }).pass).toBe(false);
  });
});

describe('linear-algebra references: the in-case dense solver against mathjs lusolve (references.md)', () => {
  it('Thomas and the dense Gaussian elimination both agree with mathjs lusolve to 1e-12', () => {
    for (const seed of [20240601, 7, 99991, 12345]) {
      const system = randomTridiagonalSystem(60, seed);
      const matrix = denseMatrix(system);
      const reference = (lusolve(matrix, system.rhs) as number[][]).map((row) => row[0]);
      const scale = Math.max(...reference.map(Math.abs));
      const thomas = productLibrary.solveTridiagonal(system.lower, system.diagonal, system.upper, system.rhs);
      const dense = denseGaussianSolve(matrix, system.rhs);
      for (let i = 0; i < reference.length; i++) {
        expect(Math.abs(thomas[i] - reference[i]) / scale).toBeLessThan(1e-12);
        expect(Math.abs(dense[i] - reference[i]) / scale).toBeLessThan(1e-12);
      }
    }
  });
});

describe('links from the sizing sheet', () => {
  it('casesForMethod returns the cases of one area or several, with their page anchors', () => {
    const ampacityLinks = casesForMethod('ampacity');
    expect(ampacityLinks.map((l) => l.id)).toEqual([
      'ampacity-buried-dc',
      'ampacity-air-ac-fixed-h',
      'tabulated-cu-xlpe-240-trefoil-air',
      'tabulated-cu-xlpe-240-flat-air',
      'tabulated-cu-xlpe-4x95-air',
      'tabulated-cu-xlpe-2x95-air',
      'tabulated-bar-100x10',
    ]);
    expect(ampacityLinks[0].href).toBe('/verification#case-ampacity-buried-dc');
    const both = casesForMethod(['voltage-drop', 'short-circuit']);
    expect(both.every((l) => l.area === 'voltage-drop' || l.area === 'short-circuit')).toBe(true);
    expect(both.length).toBe(casesForMethod('voltage-drop').length + casesForMethod('short-circuit').length);
    for (const areas of Object.values(METHODS_BEHIND_RESULT)) expect(casesForMethod(areas).length).toBeGreaterThan(0);
  });
});
