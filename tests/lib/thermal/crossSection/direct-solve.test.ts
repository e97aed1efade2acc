/**
 * The iterative solve against a general-purpose sparse direct solve of the same system: mathjs
 * 15.2.0 `slu` (its port of CSparse's sparse LU, Davis 2006) and `lusolve`, in tests only. The
 * system (K − Σβ s sᵀ)·θ = b is taken from the solver's assembly; what is checked is that the
 * preconditioned conjugate gradients (every preconditioner) solve it, to 1e-6 K.
 */
import * as mathjs from 'mathjs';
import { lusolve, slu, type Matrix } from 'mathjs';
import { describe, expect, it } from 'vitest';
import type { CrossSectionInput } from '@/lib/thermal/crossSection';
import { assemble } from '@/lib/thermal/crossSection/assemble';
import { prepareCrossSection, solvePrepared, tangentEntries, tangentSystem } from '@/lib/thermal/crossSection/solve';
import { validateCrossSection } from '@/lib/thermal/crossSection/validate';
import { exampleCable } from './helpers';

const INPUT: CrossSectionInput = {
  domain: { widthM: 8, depthM: 4 },
  soil: { thermalResistivityKmPerW: 1.5 },
  regions: [
    { name: 'topsoil', depthTopM: 0, depthBottomM: 0.4, thermalResistivityKmPerW: 2.2 },
    { name: 'backfill', xMinM: -0.5, xMaxM: 0.6, depthTopM: 0.6, depthBottomM: 1.3, thermalResistivityKmPerW: 0.9 },
  ],
  cables: [exampleCable(-0.2, 1.0, 420), exampleCable(-0.164, 1.0, 420), exampleCable(0.3, 0.9, 300)],
  heatSources: [
    { kind: 'line', xM: 1.5, depthM: 1.2, wattsPerM: 25 },
    { kind: 'rectangle', xMinM: -2, xMaxM: -1.4, depthTopM: 1.8, depthBottomM: 2.1, wattsPerM: 40 },
  ],
  surface: { kind: 'convective', airTemperatureC: 25, heatTransferCoefficientWPerM2K: 12 },
  deepGroundTemperatureC: 14,
  mesh: { cellsAcrossCable: 6, growthRatio: 1.4, maxCellM: 0.5 },
};

describe('sparse direct solve (mathjs slu) of the same system', () => {
  const system = assemble(validateCrossSection(INPUT));
  const currents = INPUT.cables.map((c) => c.conductor.currentA);
  // Without ducts the first outer pass is the final system (Joule heat is linear in T).
  const tangent = tangentSystem(system, currents, INPUT.cables.map(() => system.referenceC));
  const { rows, cols, values } = tangentEntries(system, tangent.terms);
  const n = system.n;
  // Compressed columns for mathjs (duplicates summed; the matrix is symmetric, so rows and
  // columns may be swapped freely).
  const byColumn = new Map<number, Map<number, number>>();
  for (let k = 0; k < rows.length; k++) {
    const column = byColumn.get(cols[k]) ?? new Map<number, number>();
    column.set(rows[k], (column.get(rows[k]) ?? 0) + values[k]);
    byColumn.set(cols[k], column);
  }
  const cscValues: number[] = [];
  const cscIndex: number[] = [];
  const cscPtr: number[] = [0];
  for (let j = 0; j < n; j++) {
    const column = [...(byColumn.get(j) ?? new Map<number, number>()).entries()].sort((a, b) => a[0] - b[0]);
    for (const [i, v] of column) {
      cscIndex.push(i);
      cscValues.push(v);
    }
    cscPtr.push(cscIndex.length);
  }
  // mathjs exports the SparseMatrix class at run time; its type declarations leave it out.
  const SparseMatrix = (mathjs as unknown as { SparseMatrix: new (data: { values: number[]; index: number[]; ptr: number[]; size: number[] }) => Matrix }).SparseMatrix;
  const matrix = new SparseMatrix({ values: cscValues, index: cscIndex, ptr: cscPtr, size: [n, n] });
  const lu = slu(matrix, 2, 1);
  const solved = lusolve(lu, Array.from(tangent.rhs));
  const direct = ((Array.isArray(solved) ? solved : solved.toArray()) as number[][]).map((row) => row[0]);

  it('has a grid of a useful size', () => {
    expect(n).toBeGreaterThan(500);
    expect(n).toBeLessThan(6000);
  });

  for (const preconditioner of ['amg', 'ic0', 'jacobi'] as const) {
    it(`PCG with ${preconditioner} agrees to 1e-6 K in every cell and closes the energy balance to 1e-6`, () => {
      const result = solvePrepared(prepareCrossSection(INPUT, preconditioner));
      if (!result.converged) throw new Error(result.message);
      let worst = 0;
      for (let cell = 0; cell < system.cells; cell++) worst = Math.max(worst, Math.abs(result.field.temperaturesC[cell] - system.referenceC - direct[cell]));
      expect(worst).toBeLessThan(1e-6);
      expect(result.heat.energyResidual).toBeLessThan(1e-6);
    });
  }
});
