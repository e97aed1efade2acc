import { ZodError } from 'zod';
import { DatabaseConfigError } from '@/db/client';

/** An error a route handler means to show: its status, a stable code and a plain message. */
export class ApiError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    /** The input field at fault, dot-separated (`candidates.0.currentA`). */
    public readonly fieldPath?: string,
    /** Extra answer headers, such as Retry-After on 429. */
    public readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

export interface ErrorBody {
  error: { code: string; message: string; fieldPath?: string; issues?: { path: string; message: string }[] };
}

const UNREACHABLE_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'ENOTFOUND', 'EAI_AGAIN', 'EHOSTUNREACH', '57P01', '57P03', '08000', '08001', '08006']);

/** True when the error (or anything in its cause chain) says PostgreSQL cannot be reached. */
export function isDatabaseUnreachable(error: unknown): boolean {
  for (let current: unknown = error, depth = 0; current && depth < 6; depth += 1) {
    if (current instanceof DatabaseConfigError) return true;
    const candidate = current as { code?: unknown; message?: unknown; cause?: unknown; errors?: unknown };
    if (typeof candidate.code === 'string' && UNREACHABLE_CODES.has(candidate.code)) return true;
    if (typeof candidate.message === 'string' && /connection terminated|timeout exceeded when trying to connect|Connection terminated unexpectedly|not queryable|connection error/i.test(candidate.message)) return true;
    // AggregateError from net.connect when several addresses fail.
    if (Array.isArray(candidate.errors) && candidate.errors.some(isDatabaseUnreachable)) return true;
    current = candidate.cause;
  }
  return false;
}

/**
 * PostgreSQL refusing a value the client sent: 22003 numeric value out of range, 22021 a byte
 * sequence not valid in UTF-8 (U+0000), 22P05 an untranslatable character (U+0000 in jsonb). The
 * body reader and the schemas refuse these first; this is the net behind them, so that such
 * input is a 400 rather than a 500.
 */
const INPUT_VALUE_CODES = new Set(['22003', '22021', '22P05']);

function isInputValueError(error: unknown): boolean {
  for (let current: unknown = error, depth = 0; current && depth < 6; depth += 1) {
    const candidate = current as { code?: unknown; cause?: unknown };
    if (typeof candidate.code === 'string' && INPUT_VALUE_CODES.has(candidate.code)) return true;
    current = candidate.cause;
  }
  return false;
}

export function zodIssues(error: ZodError): { path: string; message: string }[] {
  return error.issues.map((issue) => ({ path: issue.path.map(String).join('.'), message: issue.message }));
}

/** Maps any thrown value to the JSON error answer of the API. */
export function errorResponse(error: unknown): Response {
  if (error instanceof ApiError) {
    const body: ErrorBody = { error: { code: error.code, message: error.message, ...(error.fieldPath ? { fieldPath: error.fieldPath } : {}) } };
    return Response.json(body, { status: error.status, headers: error.headers });
  }
  if (error instanceof ZodError) {
    const issues = zodIssues(error);
    const first = issues[0];
    const message = first ? `${first.path ? `${first.path}: ` : ''}${first.message}` : 'The input is not valid.';
    return Response.json({ error: { code: 'invalid_input', message, issues } } satisfies ErrorBody, { status: 400 });
  }
  if (isInputValueError(error)) {
    return Response.json(
      { error: { code: 'invalid_input', message: 'A value in the request is out of range or holds a character that cannot be stored (such as U+0000).' } } satisfies ErrorBody,
      { status: 400 },
    );
  }
  if (isDatabaseUnreachable(error)) {
    return Response.json(
      { error: { code: 'database_unavailable', message: 'The database cannot be reached just now; try again in a moment.' } } satisfies ErrorBody,
      { status: 503, headers: { 'retry-after': '5' } },
    );
  }
  console.error('ampwarden: unhandled error in a route handler', error);
  return Response.json({ error: { code: 'internal_error', message: 'Something went wrong on the server; the error has been logged.' } } satisfies ErrorBody, {
    status: 500,
  });
}
