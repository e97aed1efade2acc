/**
 * Runs a case: computes Ampwarden's values with the given library and compares each with its
 * reference under the stated tolerance. A case that throws, or leaves a value out, or gives a
 * value that is not a finite number, fails and says why — it never passes by default.
 */
import { productLibrary, type ProductLibrary } from './library';
import type { CaseResult, QuantityResult, Tolerance, VerificationCase } from './types';

export function withinTolerance(value: number, reference: number, tolerance: Tolerance): boolean {
  if (!Number.isFinite(value) || !Number.isFinite(reference)) return false;
  const deviation = Math.abs(value - reference);
  const allowed = tolerance.kind === 'absolute' ? tolerance.value : tolerance.value * Math.abs(reference);
  return deviation <= allowed;
}

export function describeTolerance(tolerance: Tolerance, unit = ''): string {
  if (tolerance.kind === 'relative') {
    const percent = tolerance.value * 100;
    return percent >= 0.01 ? `± ${Number(percent.toPrecision(3))} %` : `± ${tolerance.value.toExponential(0)} (relative)`;
  }
  const magnitude = tolerance.value === 0 ? '0' : tolerance.value >= 1e-3 && tolerance.value < 1e4 ? String(Number(tolerance.value.toPrecision(3))) : tolerance.value.toExponential(0);
  return `± ${magnitude}${unit ? ` ${unit}` : ''}`;
}

function errorMessage(error: unknown): string {
  if (error instanceof Error) return `${error.name === 'Error' ? '' : `${error.name}: `}${error.message}`;
  return String(error);
}

export function runCase(verificationCase: VerificationCase, library: ProductLibrary = productLibrary): CaseResult {
  const base = {
    id: verificationCase.id,
    title: verificationCase.title,
    area: verificationCase.area,
    source: verificationCase.source,
    inputs: verificationCase.inputs,
    ...(verificationCase.notes ? { notes: verificationCase.notes } : {}),
  };
  let computation;
  try {
    computation = verificationCase.compute(library);
  } catch (error) {
    return {
      ...base,
      quantities: verificationCase.quantities.map((q) => ({
        key: q.key,
        label: q.label,
        unit: q.unit,
        reference: q.reference,
        value: Number.NaN,
        deviation: Number.NaN,
        relativeDeviation: null,
        tolerance: q.tolerance,
        pass: false,
      })),
      pass: false,
      error: errorMessage(error),
    };
  }
  const missing: string[] = [];
  const quantities: QuantityResult[] = verificationCase.quantities.map((q) => {
    const raw = computation.values[q.key];
    if (typeof raw !== 'number') missing.push(q.key);
    const value = typeof raw === 'number' ? raw : Number.NaN;
    const deviation = value - q.reference;
    return {
      key: q.key,
      label: q.label,
      unit: q.unit,
      reference: q.reference,
      value,
      deviation,
      relativeDeviation: q.reference === 0 ? null : deviation / Math.abs(q.reference),
      tolerance: q.tolerance,
      pass: withinTolerance(value, q.reference, q.tolerance),
    };
  });
  const result: CaseResult = {
    ...base,
    quantities,
    pass: quantities.length > 0 && missing.length === 0 && quantities.every((q) => q.pass),
    ...(computation.profile ? { profile: computation.profile } : {}),
    ...(computation.convergence ? { convergence: computation.convergence } : {}),
    ...(computation.details ? { details: computation.details } : {}),
  };
  if (missing.length > 0) result.error = `no value computed for: ${missing.join(', ')}`;
  return result;
}
