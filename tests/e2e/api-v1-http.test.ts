// Issue 11: a smaller fuzzing sample of the calculation API over HTTP, against the production build
// (the in-process run in tests/integration/api-v1/fuzz.test.ts does the thousands): whatever the
// body, the server answers JSON below 500, and the answers parse with the documented schemas.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { closeDb } from '@/db/client';
import { ampacityResponseSchema, evaluateResponseSchema, EXAMPLE_EVALUATE_REQUEST } from '@/lib/api';
import { createTeamApiToken } from '@/server/apiTokens/manage';
import { appUrl } from '../helpers/browser';
import { createTestTeam } from '../helpers/fixtures';
import { ampacityBodies, evaluateBodies, malformedText } from '../integration/api-v1/arbitraries';

let token: string;
beforeAll(async () => {
  const team = await createTestTeam('api-http');
  token = (await createTeamApiToken(team.id, null, { name: 'http fuzz', scopes: ['read', 'calc'], requestsPerMinute: 100_000 })).token;
});
afterAll(() => closeDb());

async function post(endpoint: 'evaluate' | 'ampacity', raw: string): Promise<void> {
  const response = await fetch(appUrl(`/api/v1/${endpoint}`), {
    method: 'POST',
    headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' },
    body: raw,
  });
  const context = `${endpoint} ← ${raw.slice(0, 300)}`;
  expect(response.status, context).toBeLessThan(500);
  expect(response.headers.get('content-type') ?? '', context).toMatch(/application\/json/);
  const body = await response.json();
  if (response.status === 200) {
    const parsed = (endpoint === 'evaluate' ? evaluateResponseSchema : ampacityResponseSchema).safeParse(body);
    expect(parsed.success, `${context}\n${parsed.error?.message}`).toBe(true);
  } else {
    expect(typeof body.error.code, context).toBe('string');
    expect(body.error.message.length, context).toBeGreaterThan(5);
  }
}

describe('fuzzing /api/v1 over HTTP (sample)', () => {
  it('100 random, mutated and malformed bodies per endpoint: JSON answers, never 5xx', async () => {
    await fc.assert(fc.asyncProperty(fc.oneof(evaluateBodies.map((b) => JSON.stringify(b)), malformedText), (raw) => post('evaluate', raw)), { numRuns: 100 });
    await fc.assert(fc.asyncProperty(fc.oneof(ampacityBodies.map((b) => JSON.stringify(b)), malformedText), (raw) => post('ampacity', raw)), { numRuns: 100 });
  });

  it('HTTP-level oddities: no content type, a GET on a POST endpoint, an unknown version path', async () => {
    const noType = await fetch(appUrl('/api/v1/evaluate'), { method: 'POST', headers: { authorization: `Bearer ${token}` }, body: JSON.stringify(EXAMPLE_EVALUATE_REQUEST) });
    expect(noType.status).toBe(415);
    const get = await fetch(appUrl('/api/v1/evaluate'), { headers: { authorization: `Bearer ${token}` } });
    expect(get.status).toBe(405);
    const good = await fetch(appUrl('/api/v1/evaluate'), { method: 'POST', headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json; charset=utf-8' }, body: JSON.stringify(EXAMPLE_EVALUATE_REQUEST) });
    expect(good.status).toBe(200);
    expect(good.headers.get('x-ratelimit-limit')).toBe('100000');
  });
});
