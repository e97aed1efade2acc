// The one JSON body reader (issue 19, Low): every unusable body is a 4xx that names the problem.
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { ApiError } from '@/server/http/errors';
import { INT4_MAX, readJson, readJsonBody } from '@/server/http/body';

const post = (body: string, headers: Record<string, string> = {}) => new Request('http://127.0.0.1/x', { method: 'POST', body, headers });

async function refusal(promise: Promise<unknown>): Promise<ApiError> {
  const error = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  if (!(error instanceof ApiError)) throw new Error(`expected an ApiError, got ${String(error)}`);
  return error;
}

describe('readJson', () => {
  it('malformed JSON is 400 invalid_json with the parser’s words', async () => {
    const e = await refusal(readJson(post('{"title": ')));
    expect(e).toMatchObject({ status: 400, code: 'invalid_json' });
    expect(e.message).toMatch(/not valid JSON/);
  });

  it('U+0000 in a value or a key is 400 invalid_text naming the field', async () => {
    const e = await refusal(readJson(post(JSON.stringify({ inputs: { notes: ['ok', 'bad\u0000'] } }))));
    expect(e).toMatchObject({ status: 400, code: 'invalid_text', fieldPath: 'inputs.notes.1' });
    expect((await refusal(readJson(post('{"a\\u0000b": 1}')))).code).toBe('invalid_text');
  });

  it('nesting past 64 levels is 400; an empty body is 400 unless optional', async () => {
    expect((await refusal(readJson(post('['.repeat(100) + ']'.repeat(100))))).code).toBe('invalid_json');
    expect((await refusal(readJson(post('')))).code).toBe('invalid_json');
    expect(await readJson(post(''), { optional: true })).toEqual({});
  });

  it('a body over the cap is 413, declared or streamed', async () => {
    expect((await refusal(readJson(post('{"a":"xxxxxxxx"}'), { maxBytes: 8 }))).status).toBe(413);
    const stream = new ReadableStream<Uint8Array>({
      start(c) {
        c.enqueue(new TextEncoder().encode('{"a":"'));
        c.enqueue(new TextEncoder().encode('x'.repeat(100)));
        c.close();
      },
    });
    const streamed = new Request('http://127.0.0.1/x', { method: 'POST', body: stream, duplex: 'half' } as RequestInit);
    expect((await refusal(readJson(streamed, { maxBytes: 50 }))).status).toBe(413);
  });

  it('with requireJsonType, another content type is 415', async () => {
    expect((await refusal(readJson(post('{}', { 'content-type': 'text/csv' }), { requireJsonType: true }))).status).toBe(415);
  });

  it(`readJsonBody applies the schema: an integer past ${INT4_MAX} (PostgreSQL integer) is a zod 400, not a database error`, async () => {
    const schema = z.object({ expectedVersion: z.number().int().max(INT4_MAX) });
    const error = await readJsonBody(post(JSON.stringify({ expectedVersion: 3_000_000_000 })), schema).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(z.ZodError);
    expect(await readJsonBody(post('{"expectedVersion": 7}'), schema)).toEqual({ expectedVersion: 7 });
  });
});
