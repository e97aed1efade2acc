/**
 * Reads a JSON request body under a byte cap: 415 when it is not JSON, 413 when it is too large
 * (by Content-Length when the client declares it, otherwise while reading — the cap holds even
 * for chunked bodies), 400 when it does not parse.
 */
import { ApiError } from '@/server/http/errors';

export async function readJsonBody(req: Request, maxBytes: number): Promise<unknown> {
  const type = (req.headers.get('content-type') ?? '').split(';')[0].trim().toLowerCase();
  if (type !== 'application/json' && !/^application\/[a-z0-9.+-]+\+json$/.test(type)) {
    throw new ApiError(415, 'unsupported_media_type', `Send the body as JSON with Content-Type: application/json (got ${type ? `'${type.slice(0, 80)}'` : 'none'}).`);
  }
  const declared = req.headers.get('content-length');
  if (declared !== null && /^\d+$/.test(declared) && Number(declared) > maxBytes) {
    throw new ApiError(413, 'payload_too_large', `The body is ${declared} bytes; the limit is ${maxBytes} bytes. Split the candidates over several requests.`);
  }
  if (!req.body) throw new ApiError(400, 'invalid_json', 'The body is empty; send a JSON object.');
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let received = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    received += value.byteLength;
    if (received > maxBytes) {
      await reader.cancel().catch(() => {});
      throw new ApiError(413, 'payload_too_large', `The body is larger than the limit of ${maxBytes} bytes. Split the candidates over several requests.`);
    }
    chunks.push(value);
  }
  const text = Buffer.concat(chunks).toString('utf8');
  if (!text.trim()) throw new ApiError(400, 'invalid_json', 'The body is empty; send a JSON object.');
  try {
    return JSON.parse(text) as unknown;
  } catch (error) {
    const detail = error instanceof SyntaxError ? error.message : 'unreadable';
    throw new ApiError(400, 'invalid_json', `The body is not valid JSON (${detail.slice(0, 200)}).`);
  }
}
