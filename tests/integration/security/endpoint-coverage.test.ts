// Every endpoint has an entry in the role × endpoint matrix, and every entry an endpoint (issue 6).
// Read from the source tree, so that it fails before the build when someone adds a route or an action.
import { describe, expect, it } from 'vitest';
import { ENDPOINT_MATRIX, entryKey } from './endpoint-matrix';
import { discoverActions, discoverInlineActions, discoverRoutes, exportedFunctions, exportedMethods, isUseServerModule, routeOf } from './discover';

describe('endpoint discovery', () => {
  it('reads route paths and exported methods the way Next.js maps them', () => {
    expect(routeOf('app/api/projects/[projectId]/route.ts')).toBe('/api/projects/[projectId]');
    expect(routeOf('app/(workspace)/export/route.ts')).toBe('/export');
    expect(exportedMethods('export const GET = apiHandler(); export async function POST() {}\nexport { handler as PUT, handler as DELETE };')).toEqual(['DELETE', 'GET', 'POST', 'PUT']);
    expect(exportedMethods('export const dynamic = "force-dynamic"; export function helper() {}')).toEqual([]);
  });

  it("sees a 'use server' module after a file comment, and its exported functions", () => {
    const source = "// why\n/** doc */\n'use server';\nexport async function a() {}\nexport const b = async () => {};\nconst c = 1;\n";
    expect(isUseServerModule(source)).toBe(true);
    expect(exportedFunctions(source)).toEqual(['a', 'b']);
    expect(isUseServerModule("import x from 'y';\n'use server';")).toBe(false);
  });
});

describe('role × endpoint matrix coverage', () => {
  const routeKeys = discoverRoutes().map((r) => `${r.method} ${r.route}`);
  const actionKeys = discoverActions().map((a) => `action ${a.file}#${a.name}`);
  const entryKeys = ENDPOINT_MATRIX.map(entryKey);

  it('finds the route handlers and actions this project has (sanity of the scan)', () => {
    expect(routeKeys).toContain('GET /api/health');
    expect(routeKeys).toContain('POST /api/members/invitations');
    expect(actionKeys).toContain('action server/auth/preferenceActions.ts#setUnitSystemAction');
  });

  it('has an entry for every route handler method and every server action', () => {
    const missing = [...routeKeys, ...actionKeys].filter((key) => !entryKeys.includes(key));
    expect(missing, 'add these to tests/integration/security/endpoint-matrix.ts').toEqual([]);
  });

  it('has no entry for an endpoint that no longer exists, and no entry twice', () => {
    const stale = entryKeys.filter((key) => !routeKeys.includes(key) && !actionKeys.includes(key));
    expect(stale, 'remove or rename these entries').toEqual([]);
    expect(entryKeys.filter((key, index) => entryKeys.indexOf(key) !== index)).toEqual([]);
  });

  it("has no inline 'use server' functions (actions live in 'use server' modules, where this test can see them)", () => {
    expect(discoverInlineActions()).toEqual([]);
  });
});
