'use client';
/** Client calls of the sheet API; errors carry the HTTP status and the JSON error body. */
import type { SheetInputs } from '@/lib/sheet/schema';

export class SheetApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly body: Record<string, unknown>,
  ) {
    super(message);
  }
}

async function call<T>(url: string, init?: RequestInit): Promise<T> {
  const response = await fetch(url, { ...init, headers: { 'content-type': 'application/json', ...(init?.headers ?? {}) } });
  const body = (await response.json().catch(() => ({}))) as Record<string, unknown>;
  if (!response.ok) {
    const error = (body.error ?? {}) as Record<string, unknown>;
    throw new SheetApiError(response.status, String(error.code ?? 'error'), String(error.message ?? `The server answered ${response.status}.`), error);
  }
  return body as T;
}

export const sheetApi = {
  get: (sheetId: string) => call<{ sheet: unknown }>(`/api/sheets/${sheetId}`),
  history: (sheetId: string) => call<{ history: unknown[] }>(`/api/sheets/${sheetId}/history`),
  save: (sheetId: string, body: { expectedVersion: number; inputs: SheetInputs; title?: string; circuitTag?: string }) =>
    call<{ version: number }>(`/api/sheets/${sheetId}`, { method: 'PUT', body: JSON.stringify(body) }),
  transition: (sheetId: string, body: { action: 'submit' | 'withdraw' | 'approve' | 'return'; comment?: string; expectedVersion?: number }) =>
    call<{ version: number; status: string }>(`/api/sheets/${sheetId}/transitions`, { method: 'POST', body: JSON.stringify(body) }),
  acknowledge: (sheetId: string, flagCode: string, comment: string) =>
    call<{ acknowledged: string }>(`/api/sheets/${sheetId}/flags/${encodeURIComponent(flagCode)}/acknowledgement`, { method: 'PUT', body: JSON.stringify({ comment }) }),
  revise: (sheetId: string) => call<{ sheet: { id: string } }>(`/api/sheets/${sheetId}/revisions`, { method: 'POST', body: '{}' }),
};
