import { buildOpenApiDocument } from '@/lib/api';

export const dynamic = 'force-static';

let document: Record<string, unknown> | undefined;

/** The OpenAPI 3.1 description of /api/v1, generated from the same zod schemas that validate the bodies. */
export function GET() {
  document ??= buildOpenApiDocument();
  return Response.json(document, { headers: { 'cache-control': 'public, max-age=300' } });
}
