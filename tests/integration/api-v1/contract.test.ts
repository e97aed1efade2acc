// Issue 11: the v1 bodies — field-path errors, size and batch limits, media type, and the OpenAPI
// document checked by independent validators (the OpenAPI 3.1 meta-schema, and ajv for its schemas).
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Ajv2020 from 'ajv/dist/2020';
import { Validator } from '@seriousme/openapi-schema-validator';
import { closeDb } from '@/db/client';
import { ampacity, compareCandidates } from '@/lib/electrical';
import {
  EXAMPLE_AMPACITY_REQUEST,
  EXAMPLE_BUSBAR_SYSTEM_REQUEST,
  EXAMPLE_EVALUATE_REQUEST,
  MAX_CANDIDATES_PER_REQUEST,
  MAX_REQUEST_BYTES,
  ampacityConditions,
  ampacityResponseSchema,
  buildOpenApiDocument,
  evaluateResponseSchema,
  toWire,
} from '@/lib/api';
import { GET as openApiGet } from '@/app/api/v1/openapi.json/route';
import { createTeamApiToken } from '@/server/apiTokens/manage';
import { createTestTeam } from '../../helpers/fixtures';
import { ENDPOINTS, jsonRequest, readError } from './helpers';

let token: string;
beforeAll(async () => {
  const team = await createTestTeam('api-contract');
  token = (await createTeamApiToken(team.id, null, { name: 'contract', scopes: ['read', 'calc'], requestsPerMinute: 100_000 })).token;
});
afterAll(() => closeDb());

const clone = <T>(value: T): T => structuredClone(value);
/** The library's result as the API sends it (numbers to nine significant digits: tests/lib/api/wire.test.ts). */
function wireValue<T>(value: T): T {
  const wire = toWire(value);
  if (!wire.ok) throw new Error(`the library's result holds a non-finite number at ${wire.path}`);
  return wire.value;
}

describe('POST /api/v1/evaluate', () => {
  it('gives the same numbers as calling lib/electrical directly, to the nine significant digits the API sends (one library, server and API)', async () => {
    const response = await ENDPOINTS.evaluate(jsonRequest('evaluate', token, EXAMPLE_EVALUATE_REQUEST));
    expect(response.status).toBe(200);
    const body = evaluateResponseSchema.parse(await response.json());
    const direct = JSON.parse(JSON.stringify(wireValue(compareCandidates(EXAMPLE_EVALUATE_REQUEST.candidates, EXAMPLE_EVALUATE_REQUEST.conditions))));
    expect(body.evaluations).toEqual(direct.evaluations);
    expect(body.smallestPassingIndex).toBe(direct.smallestPassingIndex);
  });

  it('names the field of a bad value, dot-separated, in a 400 JSON error', async () => {
    const body = clone(EXAMPLE_EVALUATE_REQUEST) as unknown as { candidates: { layers: { thicknessM: unknown }[] }[] };
    body.candidates[1].layers[0].thicknessM = -1;
    const answer = await ENDPOINTS.evaluate(jsonRequest('evaluate', token, body));
    expect(answer.status).toBe(400);
    const error = await readError(answer);
    expect(error.error.code).toBe('invalid_input');
    expect(error.error.issues?.[0].path).toBe('candidates.1.layers.0.thicknessM');
    expect(error.error.message).toMatch(/thickness/i);
  });

  it('names a misspelt key instead of silently assuming a default', async () => {
    const body = clone(EXAMPLE_EVALUATE_REQUEST) as unknown as { conditions: Record<string, unknown> };
    body.conditions.ambientc = 35;
    const error = await readError(await ENDPOINTS.evaluate(jsonRequest('evaluate', token, body)));
    expect(error.error.issues?.some((issue) => issue.path === 'conditions' && /ambientc/.test(issue.message))).toBe(true);
  });

  it('a rule spanning fields that only the library knows (a cable laid as a bar) is a 400 naming the field', async () => {
    const body = clone(EXAMPLE_EVALUATE_REQUEST);
    body.conditions.installation = { kind: 'bar-on-edge' };
    const answer = await ENDPOINTS.evaluate(jsonRequest('evaluate', token, body));
    expect(answer.status).toBe(400);
    expect((await readError(answer)).error.fieldPath).toBe('conditions.installation.kind');
  });

  it(`more than ${MAX_CANDIDATES_PER_REQUEST} candidates → 400 saying the batch limit`, async () => {
    const body = clone(EXAMPLE_EVALUATE_REQUEST);
    body.candidates = Array.from({ length: MAX_CANDIDATES_PER_REQUEST + 1 }, (_, i) => ({ ...EXAMPLE_EVALUATE_REQUEST.candidates[0], id: `c${i}` }));
    const answer = await ENDPOINTS.evaluate(jsonRequest('evaluate', token, body));
    expect(answer.status).toBe(400);
    const error = await readError(answer);
    expect(error.error.issues?.[0].path).toBe('candidates');
    expect(error.error.message).toContain(`At most ${MAX_CANDIDATES_PER_REQUEST} candidates`);
  });

  it(`a body over ${MAX_REQUEST_BYTES} bytes → 413, declared or streamed without a length`, async () => {
    const big = JSON.stringify({ ...EXAMPLE_EVALUATE_REQUEST, padding: 'x'.repeat(MAX_REQUEST_BYTES) });
    const declared = await ENDPOINTS.evaluate(jsonRequest('evaluate', token, null, { raw: big, headers: { 'content-length': String(big.length) } }));
    expect(declared.status).toBe(413);
    expect((await readError(declared)).error.message).toContain(String(MAX_REQUEST_BYTES));
    const encoder = new TextEncoder();
    const stream = new ReadableStream<Uint8Array>({
      start(controller) {
        for (let i = 0; i < 40; i += 1) controller.enqueue(encoder.encode('x'.repeat(10_000)));
        controller.close();
      },
    });
    const chunked = new Request('http://127.0.0.1/api/v1/evaluate', {
      method: 'POST',
      headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' },
      body: stream,
      duplex: 'half',
    } as RequestInit);
    const streamed = await ENDPOINTS.evaluate(chunked);
    expect(streamed.status).toBe(413);
    expect((await readError(streamed)).error.code).toBe('payload_too_large');
  });

  it('a body that is not JSON → 415 (wrong type) or 400 invalid_json (bad text), never 5xx', async () => {
    const wrongType = await ENDPOINTS.evaluate(jsonRequest('evaluate', token, EXAMPLE_EVALUATE_REQUEST, { contentType: 'text/csv' }));
    expect(wrongType.status).toBe(415);
    expect((await readError(wrongType)).error.code).toBe('unsupported_media_type');
    for (const raw of ['', '{', '{"conditions":', 'null', '[]', '"text"', '1e999']) {
      const answer = await ENDPOINTS.evaluate(jsonRequest('evaluate', token, null, { raw }));
      expect(answer.status, raw).toBe(400);
      await readError(answer);
    }
  });
});

describe('calculations run off the request thread (issue 19: nothing may stall the server)', () => {
  it('the event loop keeps turning while a bus-bar system is computed (a quarter second or more of solving)', async () => {
    // A first call starts the calculation thread, so that only the calculation itself is timed below.
    expect((await ENDPOINTS.evaluate(jsonRequest('evaluate', token, EXAMPLE_EVALUATE_REQUEST))).status).toBe(200);
    const delay = monitorEventLoopDelay({ resolution: 5 });
    delay.enable();
    const started = performance.now();
    const answer = await ENDPOINTS.evaluate(jsonRequest('evaluate', token, EXAMPLE_BUSBAR_SYSTEM_REQUEST));
    const tookMs = performance.now() - started;
    delay.disable();
    expect(answer.status).toBe(200);
    expect(tookMs, 'the calculation is long enough to be seen').toBeGreaterThan(100);
    // Computed on this thread, the loop would stand still for the whole calculation.
    expect(delay.max / 1e6, `longest stall ${(delay.max / 1e6).toFixed(0)} ms during a ${tookMs.toFixed(0)} ms calculation`).toBeLessThan(tookMs / 3);
  });
});

describe('POST /api/v1/ampacity', () => {
  it('answers the same ampacity as lib/electrical, and the design current may be left out', async () => {
    const response = await ENDPOINTS.ampacity(jsonRequest('ampacity', token, EXAMPLE_AMPACITY_REQUEST));
    expect(response.status).toBe(200);
    const body = ampacityResponseSchema.parse(await response.json());
    const direct = JSON.parse(JSON.stringify(wireValue(ampacity(EXAMPLE_AMPACITY_REQUEST.candidate, ampacityConditions(EXAMPLE_AMPACITY_REQUEST)))));
    expect(body.ampacity).toEqual(direct);
    expect(body.ampacity.current).toBeGreaterThan(0);
  });

  it('a bad candidate field is reported under candidate.*', async () => {
    const body = clone(EXAMPLE_AMPACITY_REQUEST) as unknown as { candidate: Record<string, unknown> };
    delete body.candidate.terminalLimitC;
    const answer = await ENDPOINTS.ampacity(jsonRequest('ampacity', token, body));
    expect(answer.status).toBe(400);
    // No limit is known for a bare bar without a terminal limit: the library names the field.
    expect((await readError(answer)).error.fieldPath).toBe('candidate.terminalLimitC');
  });
});

describe('GET /api/v1/openapi.json', () => {
  it('is a valid OpenAPI 3.1 document (checked against the OpenAPI meta-schema by an independent validator)', async () => {
    const response = await openApiGet();
    expect(response.status).toBe(200);
    const document = await response.json();
    expect(document.openapi).toBe('3.1.0');
    const validator = new Validator();
    const result = await validator.validate(document);
    expect(result.errors ?? []).toEqual([]);
    expect(result.valid).toBe(true);
    expect(Object.keys(document.paths).sort()).toEqual(['/api/v1/ampacity', '/api/v1/evaluate', '/api/v1/flags', '/api/v1/openapi.json']);
  });

  it('its request schemas, read by ajv (not zod), accept the examples and refuse what zod refuses', () => {
    const document = buildOpenApiDocument() as { components: { schemas: Record<string, object> } };
    const ajv = new Ajv2020({ strict: false, allErrors: true });
    for (const [id, schema] of Object.entries(document.components.schemas)) ajv.addSchema(schema, `#/components/schemas/${id}`);
    const validateEvaluate = ajv.getSchema('#/components/schemas/EvaluateRequest')!;
    expect(validateEvaluate(EXAMPLE_EVALUATE_REQUEST), JSON.stringify(validateEvaluate.errors)).toBe(true);
    const validateAmpacity = ajv.getSchema('#/components/schemas/AmpacityRequest')!;
    expect(validateAmpacity(EXAMPLE_AMPACITY_REQUEST), JSON.stringify(validateAmpacity.errors)).toBe(true);
    const bad = clone(EXAMPLE_EVALUATE_REQUEST) as unknown as { conditions: Record<string, unknown> };
    bad.conditions.phases = 2;
    expect(validateEvaluate(bad)).toBe(false);
    const tooMany = { ...EXAMPLE_EVALUATE_REQUEST, candidates: Array.from({ length: MAX_CANDIDATES_PER_REQUEST + 1 }, () => EXAMPLE_EVALUATE_REQUEST.candidates[0]) };
    expect(validateEvaluate(tooMany)).toBe(false);
  });
});
