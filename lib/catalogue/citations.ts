/**
 * Which catalogue value is cited by which source column, and the rule that a changed value
 * carries its citation (issue 23): an edit of a value must name, in the same edit, where the new
 * value comes from. Otherwise the row keeps citing a table for a figure that table never gave,
 * and the reviewer reading "IEC 60228 Table 2" beside it is misled. The grid prompts for the
 * source; the server (db/queries/catalogue.ts) refuses an edit without it.
 */
import Decimal from 'decimal.js';
import { MAX_BUILD_LAYERS, type CatalogueKind } from './schemas';

function layerCitations(): Record<string, string> {
  const cited: Record<string, string> = {};
  for (let n = 1; n <= MAX_BUILD_LAYERS; n++) {
    cited[`layer${n}CoveringKey`] = `layer${n}Source`;
    cited[`layer${n}ThicknessMm`] = `layer${n}Source`;
  }
  return cited;
}

/** Value field → the source field that cites it. Fields not listed (names, keys, shapes…) need no citation. */
export const CITED_BY: Readonly<Record<CatalogueKind, Readonly<Record<string, string>>>> = {
  materials: {
    rho20OhmM: 'electricalSource',
    alpha20PerK: 'electricalSource',
    thermalConductivityWPerMK: 'thermalSource',
    densityKgPerM3: 'thermalSource',
    specificHeatJPerKgK: 'thermalSource',
    adiabaticK: 'shortCircuitSource',
    betaK: 'shortCircuitSource',
    // A price is a team figure, but it still goes stale: say where and when it was quoted.
    pricePerKg: 'priceNote',
  },
  conductors: {
    // The nominal section is a dimension of the conductor standard or datasheet.
    sectionMm2: 'dimensionSource',
    r20OhmPerKm: 'resistanceSource',
    diameterMm: 'dimensionSource',
    widthMm: 'dimensionSource',
    thicknessMm: 'dimensionSource',
    yieldStrengthMpa: 'yieldStrengthSource',
  },
  coverings: {
    thermalResistivityKmPerW: 'resistivitySource',
    continuousLimitC: 'limitsSource',
    shortCircuitLimitC: 'limitsSource',
    emissivity: 'emissivitySource',
  },
  builds: layerCitations(),
};

export function citingField(kind: CatalogueKind, field: string): string | undefined {
  return CITED_BY[kind][field];
}

const blank = (v: unknown) => v === null || v === undefined || (typeof v === 'string' && v.trim() === '');

/** Equal as the catalogue means it: decimals by value ("0.90" = "0.9"), text exactly, empties alike. */
export function sameCatalogueValue(a: unknown, b: unknown): boolean {
  if (blank(a) || blank(b)) return blank(a) && blank(b);
  const left = String(a).trim();
  const right = String(b).trim();
  if (left === right) return true;
  try {
    return new Decimal(left).eq(new Decimal(right));
  } catch {
    return false;
  }
}

export interface MissingCitation {
  /** The value that changed. */
  field: string;
  /** The source field the edit must name. */
  sourceField: string;
}

/**
 * The cited values an edit changes without naming their source in the same edit: `before` is the
 * stored row, `changes` the fields the edit sends. A source sent blank does not count.
 */
export function missingCitations(kind: CatalogueKind, before: Record<string, unknown>, changes: Record<string, unknown>): MissingCitation[] {
  const missing: MissingCitation[] = [];
  for (const [field, value] of Object.entries(changes)) {
    const sourceField = citingField(kind, field);
    if (!sourceField || sameCatalogueValue(before[field], value)) continue;
    if (!(sourceField in changes) || blank(changes[sourceField])) missing.push({ field, sourceField });
  }
  return missing;
}
