/**
 * fast-check generators of request bodies for the calculation API: random JSON, malformed text,
 * mutations of a valid body (a value replaced, a key dropped or added, numbers at the edges), and
 * bodies inside the documented ranges that reach the solver with unusual but legal inputs.
 */
import fc from 'fast-check';
import { EXAMPLE_AMPACITY_REQUEST, EXAMPLE_EVALUATE_REQUEST, MAX_CANDIDATES_PER_REQUEST } from '@/lib/api';
import { INPUT_BOUNDS } from '@/lib/inputBounds';

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

/** Every path to a value inside a JSON value (objects and arrays included). */
export function pathsOf(value: Json, prefix: (string | number)[] = []): (string | number)[][] {
  const paths: (string | number)[][] = [prefix];
  if (Array.isArray(value)) value.forEach((item, index) => paths.push(...pathsOf(item, [...prefix, index])));
  else if (value && typeof value === 'object') for (const [key, item] of Object.entries(value)) paths.push(...pathsOf(item, [...prefix, key]));
  return paths;
}

function setAt(root: Json, path: (string | number)[], mutate: (parent: Record<string | number, Json>, key: string | number) => void): Json {
  if (path.length === 0) return root;
  const copy = structuredClone(root) as Json;
  let parent = copy as unknown as Record<string | number, Json>;
  for (const key of path.slice(0, -1)) {
    // An earlier edit may have removed or replaced this branch: then there is nothing to edit.
    if (parent === null || typeof parent !== 'object') return copy;
    parent = parent[key] as unknown as Record<string | number, Json>;
  }
  if (parent === null || typeof parent !== 'object') return copy;
  mutate(parent, path[path.length - 1]);
  return copy;
}

/** Numbers a careless or hostile client sends: edges, huge, tiny, negative zero, non-integers. */
export const edgeNumber = fc.oneof(
  fc.constantFrom(0, -0, 1, -1, 0.5, 1e-300, -1e-300, 1e300, -1e300, Number.MAX_VALUE, Number.MIN_VALUE, Number.MAX_SAFE_INTEGER, 2 ** 53 + 1, 3, 2, 24, 25, 1000, 1e6),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.integer(),
);

export const anyJson: fc.Arbitrary<Json> = fc.oneof(
  { weight: 3, arbitrary: fc.jsonValue() as fc.Arbitrary<Json> },
  { weight: 1, arbitrary: edgeNumber },
  { weight: 1, arbitrary: fc.constantFrom<Json>(null, true, false, '', 'NaN', 'Infinity', '1e999', [], {}, { kind: 'cable' }, { kind: 'bar' }, { kind: 'buried' }) },
);

/** Mutations of a valid body: one to three edits. */
export function mutatedBody(base: Json): fc.Arbitrary<Json> {
  const paths = pathsOf(base).filter((path) => path.length > 0);
  const edit = fc.oneof(
    fc.record({ op: fc.constant('replace' as const), path: fc.constantFrom(...paths), value: anyJson }),
    fc.record({ op: fc.constant('number' as const), path: fc.constantFrom(...paths), value: edgeNumber as fc.Arbitrary<Json> }),
    fc.record({ op: fc.constant('delete' as const), path: fc.constantFrom(...paths), value: fc.constant(null as Json) }),
    fc.record({ op: fc.constant('add' as const), path: fc.constantFrom(...paths), value: fc.tuple(fc.string({ maxLength: 12 }), anyJson).map(([key, value]) => ({ [key]: value }) as Json) }),
  );
  return fc.array(edit, { minLength: 1, maxLength: 3 }).map((edits) => {
    let body = structuredClone(base);
    for (const { op, path, value } of edits) {
      body = setAt(body, path, (parent, key) => {
        if (parent === null || typeof parent !== 'object') return;
        if (op === 'delete') {
          if (Array.isArray(parent)) parent.splice(Number(key), 1);
          else delete parent[key];
        } else if (op === 'add') {
          const target = parent[key];
          if (target && typeof target === 'object' && !Array.isArray(target)) Object.assign(target, value as object);
        } else parent[key] = value;
      });
    }
    return body;
  });
}

const layer = fc.record(
  {
    name: fc.constantFrom('insulation', 'sheath', 'screen'),
    role: fc.constantFrom('insulation', 'semiconductor', 'screen', 'bedding', 'armour', 'sheath', 'jacket', 'filler', 'other'),
    thicknessM: fc.double({ min: 1e-6, max: 0.5, noNaN: true }),
    thermalResistivityKmPerW: fc.double({ min: 1e-3, max: 1e4, noNaN: true }),
    continuousLimitC: fc.double({ min: -50, max: 1000, noNaN: true }),
    shortCircuitLimitC: fc.double({ min: -50, max: 1000, noNaN: true }),
  },
  { requiredKeys: ['name', 'thicknessM', 'thermalResistivityKmPerW'] },
);

const cable = fc.record(
  {
    kind: fc.constant('cable'),
    material: fc.constantFrom('copper', 'aluminium'),
    r20OhmPerM: fc.double({ min: 1e-7, max: 1, noNaN: true }),
    sectionMm2: fc.double({ min: 0.1, max: 5000, noNaN: true }),
    conductorDiameterM: fc.double({ min: 1e-4, max: 0.2, noNaN: true }),
    cores: fc.integer({ min: 1, max: 5 }),
    layers: fc.array(layer, { minLength: 1, maxLength: 4 }),
    emissivity: fc.double({ min: 0, max: 1, noNaN: true }),
    parallel: fc.integer({ min: 1, max: 100 }),
    sourceNotes: fc.array(fc.constantFrom('datasheet', 'from memory'), { maxLength: 2 }),
    costs: fc.record({ conductorPricePerKg: fc.constantFrom('9.50', '0', '12.125'), pricePerM: fc.double({ min: 0, max: 1e4, noNaN: true }) }, { requiredKeys: [] }),
  },
  { requiredKeys: ['kind', 'material', 'r20OhmPerM', 'sectionMm2', 'conductorDiameterM', 'layers'] },
);

const bar = fc.record(
  {
    kind: fc.constant('bar'),
    material: fc.constantFrom('copper', 'aluminium'),
    r20OhmPerM: fc.double({ min: 1e-7, max: 1, noNaN: true }),
    widthM: fc.double({ min: 1e-4, max: 1, noNaN: true }),
    thicknessM: fc.double({ min: 1e-4, max: 0.2, noNaN: true }),
    barsPerPhase: fc.integer({ min: 1, max: 20 }),
    emissivity: fc.double({ min: 0, max: 1, noNaN: true }),
    acResistanceRatio: fc.double({ min: 1, max: 10, noNaN: true }),
    terminalLimitC: fc.double({ min: -50, max: 1000, noNaN: true }),
    shortCircuitLimitC: fc.double({ min: -50, max: 1000, noNaN: true }),
    coating: fc.record(
      { thicknessM: fc.double({ min: 1e-6, max: 0.05, noNaN: true }), thermalResistivityKmPerW: fc.double({ min: 1e-3, max: 1e4, noNaN: true }), continuousLimitC: fc.double({ min: -50, max: 1000, noNaN: true }) },
      { requiredKeys: ['thicknessM', 'thermalResistivityKmPerW'] },
    ),
  },
  { requiredKeys: ['kind', 'material', 'r20OhmPerM', 'widthM', 'thicknessM'] },
);

const installation = fc.oneof(
  fc.record({ kind: fc.constant('cable-in-air'), formation: fc.constantFrom('trefoil', 'flat'), spacingM: fc.double({ min: 1e-3, max: 100, noNaN: true }) }, { requiredKeys: ['kind'] }),
  fc.constant({ kind: 'bar-on-edge' }),
  fc.constant({ kind: 'bar-flat' }),
  fc.record(
    { kind: fc.constant('buried'), depthM: fc.double({ min: 1e-3, max: 20, noNaN: true }), soilResistivityKmPerW: fc.double({ min: 0.1, max: 20, noNaN: true }), groundC: fc.double({ min: -60, max: 200, noNaN: true }) },
    { requiredKeys: ['kind', 'depthM'] },
  ),
  fc.record({ kind: fc.constant('enclosure'), deratingFactor: fc.double({ min: 0.01, max: 1, noNaN: true }), inside: fc.constantFrom('cable-in-air', 'bar-on-edge', 'bar-flat') }),
);

export const inRangeConditions = fc.record(
  {
    // Ranges of lib/inputBounds, the table the API schemas read.
    designCurrentA: fc.double({ min: INPUT_BOUNDS.designCurrentA.min, minExcluded: true, max: INPUT_BOUNDS.designCurrentA.max, noNaN: true }),
    frequencyHz: fc.constantFrom(0, 50, 60, 400, 1000),
    phases: fc.constantFrom(1, 3),
    nominalVoltageV: fc.double({ min: 1, max: INPUT_BOUNDS.nominalVoltageV.max, noNaN: true }),
    lengthM: fc.double({ min: 0, max: INPUT_BOUNDS.lengthM.max, noNaN: true }),
    powerFactor: fc.double({ min: 0, max: 1, noNaN: true }),
    ambientC: fc.double({ min: -60, max: 200, noNaN: true }),
    installation,
    windSpeedMPerS: fc.double({ min: 0, max: 60, noNaN: true }),
    fault: fc.record({ currentA: fc.double({ min: 1, max: INPUT_BOUNDS.faultCurrentA.max, noNaN: true }), durationS: fc.double({ min: 1e-3, max: 60, noNaN: true }) }),
    temperatureLimitC: fc.double({ min: -50, max: 1000, noNaN: true }),
    groupingFactor: fc.double({ min: 0.01, max: 1, noNaN: true }),
    surfaceCoefficientWPerM2K: fc.double({ min: 0.01, max: 1e5, noNaN: true }),
    maxVoltageDropPercent: fc.double({ min: 0.01, max: 100, noNaN: true }),
    economics: fc.record({
      lossLoadFactor: fc.double({ min: 0, max: 1, noNaN: true }),
      energyPricePerKWh: fc.constantFrom('0.12', '0', 0.3),
      discountRatePercent: fc.double({ min: -99, max: 99, noNaN: true }),
      years: fc.integer({ min: 0, max: 200 }),
    }),
  },
  { requiredKeys: ['designCurrentA', 'frequencyHz', 'phases', 'nominalVoltageV', 'lengthM', 'powerFactor', 'installation'] },
);

export const inRangeCandidate = fc.oneof(cable, bar);

export const inRangeEvaluateBody = fc.record({
  conditions: inRangeConditions,
  candidates: fc.array(inRangeCandidate, { minLength: 1, maxLength: 3 }),
}) as fc.Arbitrary<Json>;

export const inRangeAmpacityBody = fc.record({ conditions: inRangeConditions, candidate: inRangeCandidate }) as fc.Arbitrary<Json>;

export const evaluateBodies = fc.oneof(
  { weight: 2, arbitrary: anyJson },
  { weight: 3, arbitrary: mutatedBody(EXAMPLE_EVALUATE_REQUEST as unknown as Json) },
  { weight: 1, arbitrary: fc.record({ conditions: anyJson, candidates: fc.array(anyJson, { maxLength: MAX_CANDIDATES_PER_REQUEST + 2 }) }) as fc.Arbitrary<Json> },
);

export const ampacityBodies = fc.oneof(
  { weight: 2, arbitrary: anyJson },
  { weight: 3, arbitrary: mutatedBody(EXAMPLE_AMPACITY_REQUEST as unknown as Json) },
  { weight: 1, arbitrary: fc.record({ conditions: anyJson, candidate: anyJson }) as fc.Arbitrary<Json> },
);

/** Text that is usually not JSON at all, or JSON with numbers JavaScript turns into Infinity. */
export const malformedText = fc.oneof(
  fc.string({ maxLength: 200 }),
  fc.constantFrom('{"conditions": 1e999, "candidates": []}', '{"candidates":[{"kind":"cable","r20OhmPerM":-1e999}]}', '{"a":', '\u0000', '{}{}', '[', 'true', '{"__proto__":{"polluted":1}}'),
);
