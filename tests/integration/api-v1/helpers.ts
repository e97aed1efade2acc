/**
 * Calls the /api/v1 route handlers in-process (no HTTP server): they use only the standard
 * Request/Response API and the bearer header, so a plain Request reaches them as Next would.
 */
import { expect } from 'vitest';
import type { NextRequest } from 'next/server';
import { POST as evaluatePost } from '@/app/api/v1/evaluate/route';
import { POST as ampacityPost } from '@/app/api/v1/ampacity/route';
import { GET as flagsGet } from '@/app/api/v1/flags/route';

export const ENDPOINTS = {
  evaluate: (req: Request) => evaluatePost(req as NextRequest),
  ampacity: (req: Request) => ampacityPost(req as NextRequest),
  flags: (req: Request) => flagsGet(req as NextRequest),
} as const;

export function jsonRequest(path: string, token: string | null, body: unknown, init: { contentType?: string; raw?: string; headers?: Record<string, string> } = {}): Request {
  const headers: Record<string, string> = { 'content-type': init.contentType ?? 'application/json', ...(init.headers ?? {}) };
  if (token !== null) headers.authorization = `Bearer ${token}`;
  return new Request(`http://127.0.0.1/api/v1/${path}`, { method: 'POST', headers, body: init.raw ?? JSON.stringify(body) });
}

export function getRequest(path: string, token: string | null): Request {
  return new Request(`http://127.0.0.1/api/v1/${path}`, { headers: token === null ? {} : { authorization: `Bearer ${token}` } });
}

export interface ErrorAnswer {
  error: { code: string; message: string; fieldPath?: string; issues?: { path: string; message: string }[] };
}

/** Every error answer is JSON with a code and a plain message; returns it for further checks. */
export async function readError(response: Response): Promise<ErrorAnswer> {
  expect(response.headers.get('content-type') ?? '').toMatch(/application\/json/);
  const body = (await response.json()) as ErrorAnswer;
  expect(typeof body.error.code).toBe('string');
  expect(body.error.message.length).toBeGreaterThan(5);
  return body;
}
