/**
 * The calculation API's body: JSON only (415 otherwise), under a byte cap (413), through the
 * shared reader (server/http/body.ts), which answers 400 for a body that does not parse.
 */
import { readJson } from '@/server/http/body';

export async function readJsonBody(req: Request, maxBytes: number): Promise<unknown> {
  return readJson(req, { maxBytes, requireJsonType: true, sizeAdvice: 'Split the candidates over several requests.' });
}
