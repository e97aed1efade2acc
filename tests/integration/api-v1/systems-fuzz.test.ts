// Issues 18 and 21 through the v1 route handlers, in-process: mutations of the new fields of a
// bus-bar system body (installation.system, the bars' R_p0.2) and of a protected cable circuit (the
// device with its time–current curve, the earth-fault loop, third harmonics) get a 200 whose answer parses with the
// documented schema, or a 4xx JSON error naming the field — never a 5xx, and never a candidate
// that failed inside the library without saying why. A non-monotone curve is refused with its
// point's path (the library's rule, lib/electrical/protection/device.ts).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { closeDb } from '@/db/client';
import { EXAMPLE_BUSBAR_SYSTEM_REQUEST, EXAMPLE_EVALUATE_REQUEST, evaluateResponseSchema } from '@/lib/api';
import { createTeamApiToken } from '@/server/apiTokens/manage';
import { createTestTeam } from '../../helpers/fixtures';
import { ENDPOINTS, jsonRequest, readError } from './helpers';
import { anyJson, edgeNumber, pathsOf } from './arbitraries';

type Json = Parameters<typeof pathsOf>[0];
type Path = (string | number)[];

/**
 * One to three edits of the fields these issues added — installation.system, the bars' R_p0.2,
 * protection, thirdHarmonicPercent — each a value replaced, a number at an edge, a key dropped or
 * one added. (The candidate's older fields are fuzzed by fuzz.test.ts.)
 */
function mutatedNewFields(base: Json): fc.Arbitrary<Json> {
  const isNew = (p: Path) =>
    p.length > 0 &&
    ((p[0] === 'conditions' && (p[1] === 'protection' || p[1] === 'thirdHarmonicPercent' || (p[1] === 'installation' && p[2] === 'system'))) || (p[0] === 'candidates' && p[2] === 'yieldStrengthPa'));
  const paths = pathsOf(base).filter(isNew);
  const edit = fc.record({
    op: fc.constantFrom('replace', 'number', 'delete', 'add'),
    path: fc.constantFrom(...paths),
    value: fc.oneof(anyJson, edgeNumber as fc.Arbitrary<Json>),
    key: fc.string({ maxLength: 12 }),
  });
  return fc.array(edit, { minLength: 1, maxLength: 3 }).map((edits) => {
    const body = structuredClone(base) as Record<string | number, unknown>;
    for (const { op, path, value, key } of edits) {
      let parent: unknown = body;
      for (const k of path.slice(0, -1)) parent = parent && typeof parent === 'object' ? (parent as Record<string | number, unknown>)[k] : undefined;
      if (!parent || typeof parent !== 'object') continue;
      const p = parent as Record<string | number, unknown>;
      const last = path[path.length - 1];
      if (op === 'delete') delete p[last];
      else if (op === 'add' && p[last] && typeof p[last] === 'object') (p[last] as Record<string, unknown>)[key] = value;
      else p[last] = op === 'number' && typeof value !== 'number' ? 0 : value;
    }
    return body as Json;
  });
}

let token: string;
beforeAll(async () => {
  const team = await createTestTeam('api-systems');
  token = (await createTeamApiToken(team.id, null, { name: 'systems', scopes: ['calc'], requestsPerMinute: 100_000 })).token;
});
afterAll(() => closeDb());

const statuses: Record<number, number> = {};

async function send(body: unknown): Promise<Response> {
  return ENDPOINTS.evaluate(jsonRequest('evaluate', token, null, { raw: JSON.stringify(body) }));
}

async function checkAnswer(body: unknown): Promise<void> {
  const response = await send(body);
  const context = JSON.stringify(body).slice(0, 400);
  statuses[response.status] = (statuses[response.status] ?? 0) + 1;
  expect(response.status, context).toBeLessThan(500);
  const answer = await response.json();
  if (response.status === 200) {
    const parsed = evaluateResponseSchema.safeParse(answer);
    expect(parsed.success, `${context}\n${parsed.error?.message}`).toBe(true);
    for (const evaluation of answer.evaluations) if (!evaluation.ok) expect(evaluation.error.code, context).not.toBe('EVALUATION_FAILED');
  } else {
    expect(typeof answer.error?.code, context).toBe('string');
  }
}

// One pack per request keeps a run within the machine's time (each pack solve takes tenths of a second).
const systemBody = { ...structuredClone(EXAMPLE_BUSBAR_SYSTEM_REQUEST), candidates: [structuredClone(EXAMPLE_BUSBAR_SYSTEM_REQUEST.candidates[0])] } as unknown as Json;
const protectedCable = structuredClone(EXAMPLE_EVALUATE_REQUEST) as unknown as Record<string, Record<string, unknown>>;
protectedCable.conditions.protection = {
  device: {
    kind: 'fuse-gG-iec60269',
    ratedCurrentA: 250,
    timeCurrentCurve: [
      { currentA: 750, timeS: 1000 },
      { currentA: 1500, timeS: 10 },
      { currentA: 3000, timeS: 0.2 },
      { currentA: 6000, timeS: 0.02 },
    ],
  },
  systemEarthing: 'TN',
  circuit: 'distribution',
  source: { resistanceOhm: 0.01, reactanceOhm: 0.03 },
  protectiveConductor: { sectionMm2: 70 },
};
protectedCable.conditions.thirdHarmonicPercent = 20;

describe('fuzzing the bus-bar system and protection bodies (fast-check)', () => {
  it('the two bases are valid and computed', async () => {
    for (const body of [systemBody, protectedCable]) {
      const response = await send(body);
      expect(response.status).toBe(200);
      const answer = evaluateResponseSchema.parse(await response.json());
      expect(answer.evaluations.every((e) => e.ok)).toBe(true);
    }
  });

  it('a curve whose time rises is refused 400 with the point’s path', async () => {
    const body = structuredClone(protectedCable);
    (body.conditions.protection as { device: { timeCurrentCurve: Array<{ timeS: number }> } }).device.timeCurrentCurve[2].timeS = 20;
    const response = await send(body);
    expect(response.status).toBe(400);
    const error = (await readError(response)).error;
    expect(error.code).toBe('invalid_input');
    expect(error.issues?.map((i) => i.path)).toEqual(['conditions.protection.device.timeCurrentCurve.2.timeS']);
    expect(error.message).toMatch(/^conditions\.protection\.device\.timeCurrentCurve\.2\.timeS: must not exceed the previous point's time \(10 s\)/);
  });

  it('60 mutations of the bus-bar system body: a valid answer or a 4xx error, never a 5xx', async () => {
    await fc.assert(fc.asyncProperty(mutatedNewFields(systemBody), checkAnswer), { numRuns: 60 });
  });

  it('300 mutations of the protected cable body: a valid answer or a 4xx error, never a 5xx', async () => {
    await fc.assert(fc.asyncProperty(mutatedNewFields(protectedCable as unknown as Json), checkAnswer), { numRuns: 300 });
    // Both kinds of answer were met.
    expect(statuses[200] ?? 0).toBeGreaterThan(0);
    expect(statuses[400] ?? 0).toBeGreaterThan(0);
  });
});
