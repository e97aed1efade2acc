/**
 * The one reader of JSON request bodies, for the session routes and the calculation API alike.
 * Every way a body can be unusable answers 4xx naming the problem, never 500:
 *
 * - larger than the cap → 413 `payload_too_large` (by Content-Length when declared, otherwise while
 *   reading, so the cap holds for chunked bodies too);
 * - empty → 400 `invalid_json` (or `{}` where the body is optional);
 * - not JSON → 400 `invalid_json` with the parser's words (position included);
 * - nested deeper than 64 levels → 400 `invalid_json`;
 * - a string (value or key) holding U+0000 → 400 `invalid_text` naming the field: PostgreSQL
 *   cannot store that character in text or jsonb, and no field of ours needs it;
 * - then the zod schema → 400 `invalid_input` with the field paths (server/http/errors.ts).
 *
 * Integers that reach integer columns are bounded in the schemas themselves (INT4_MAX below).
 */
import type { z } from 'zod';
import { ApiError } from './errors';

/** The largest value of a PostgreSQL `integer` column (int4). */
export const INT4_MAX = 2_147_483_647;

/** Session routes send a sheet with its candidates at most; 1 MiB is far beyond that. */
export const DEFAULT_MAX_JSON_BYTES = 1024 * 1024;

const MAX_DEPTH = 64;

export interface ReadJsonOptions {
  maxBytes?: number;
  /** An empty body reads as `{}` (routes whose fields all have defaults). */
  optional?: boolean;
  /** Refuse with 415 unless the Content-Type is JSON (the calculation API). */
  requireJsonType?: boolean;
  /** Said after a 413, e.g. "Split the candidates over several requests." */
  sizeAdvice?: string;
}

function tooLarge(maxBytes: number, declared: string | null, advice: string | undefined): ApiError {
  const size = declared ? `The body is ${declared} bytes; the limit is ${maxBytes} bytes.` : `The body is larger than the limit of ${maxBytes} bytes.`;
  return new ApiError(413, 'payload_too_large', `${size}${advice ? ` ${advice}` : ''}`);
}

async function readText(req: Request, maxBytes: number, advice: string | undefined): Promise<string> {
  const declared = req.headers.get('content-length');
  if (declared !== null && /^\d+$/.test(declared) && Number(declared) > maxBytes) throw tooLarge(maxBytes, declared, advice);
  if (!req.body) return '';
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let received = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    received += value.byteLength;
    if (received > maxBytes) {
      await reader.cancel().catch(() => {});
      throw tooLarge(maxBytes, null, advice);
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks).toString('utf8');
}

/** The path of the first string holding U+0000, or of a level past MAX_DEPTH; walked without recursion. */
function findProblem(value: unknown): { path: string; kind: 'nul' | 'depth' } | null {
  const stack: Array<{ value: unknown; path: string[] }> = [{ value, path: [] }];
  while (stack.length > 0) {
    const { value: current, path } = stack.pop()!;
    if (path.length > MAX_DEPTH) return { path: path.join('.'), kind: 'depth' };
    if (typeof current === 'string') {
      if (current.includes('\u0000')) return { path: path.join('.'), kind: 'nul' };
    } else if (Array.isArray(current)) {
      current.forEach((item, i) => stack.push({ value: item, path: [...path, String(i)] }));
    } else if (current !== null && typeof current === 'object') {
      for (const [key, item] of Object.entries(current)) {
        if (key.includes('\u0000')) return { path: [...path, key.replace(/\u0000/g, '\\u0000')].join('.'), kind: 'nul' };
        stack.push({ value: item, path: [...path, key] });
      }
    }
  }
  return null;
}

export async function readJson(req: Request, options: ReadJsonOptions = {}): Promise<unknown> {
  const maxBytes = options.maxBytes ?? DEFAULT_MAX_JSON_BYTES;
  if (options.requireJsonType) {
    const type = (req.headers.get('content-type') ?? '').split(';')[0].trim().toLowerCase();
    if (type !== 'application/json' && !/^application\/[a-z0-9.+-]+\+json$/.test(type)) {
      throw new ApiError(415, 'unsupported_media_type', `Send the body as JSON with Content-Type: application/json (got ${type ? `'${type.slice(0, 80)}'` : 'none'}).`);
    }
  }
  const text = await readText(req, maxBytes, options.sizeAdvice);
  if (!text.trim()) {
    if (options.optional) return {};
    throw new ApiError(400, 'invalid_json', 'The body is empty; send a JSON object.');
  }
  let value: unknown;
  try {
    value = JSON.parse(text) as unknown;
  } catch (error) {
    const detail = error instanceof SyntaxError ? error.message : 'too deeply nested';
    throw new ApiError(400, 'invalid_json', `The body is not valid JSON (${detail.slice(0, 200)}).`);
  }
  const problem = findProblem(value);
  if (problem?.kind === 'depth') throw new ApiError(400, 'invalid_json', `The body is nested more than ${MAX_DEPTH} levels deep.`);
  if (problem?.kind === 'nul') {
    const where = problem.path || 'the body';
    throw new ApiError(400, 'invalid_text', `${where}: text may not contain the character U+0000 (NUL).`, problem.path || undefined);
  }
  return value;
}

/** Reads the body and checks it against the schema (a ZodError becomes 400 invalid_input). */
export async function readJsonBody<S extends z.ZodType>(req: Request, schema: S, options: ReadJsonOptions = {}): Promise<z.output<S>> {
  return schema.parse(await readJson(req, options));
}
