/**
 * Finds every endpoint in the source tree: route handlers (app/**\/route.ts and their exported
 * HTTP methods) and server actions (exported functions of modules that begin with 'use server').
 */
import fs from 'node:fs';
import path from 'node:path';

export const HTTP_METHODS = ['GET', 'HEAD', 'POST', 'PUT', 'PATCH', 'DELETE', 'OPTIONS'] as const;
const SOURCE_ROOTS = ['app', 'server', 'components', 'lib', 'db'];

function walk(dir: string, found: string[] = []): string[] {
  if (!fs.existsSync(dir)) return found;
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) walk(full, found);
    else if (/\.(ts|tsx|js|mjs)$/.test(entry.name)) found.push(full);
  }
  return found;
}

/** `/api/projects/[projectId]` from `app/api/projects/[projectId]/route.ts` (route groups and private folders left out). */
export function routeOf(file: string): string {
  const segments = path.dirname(path.relative('app', file)).split(path.sep).filter((s) => s !== '.' && !/^\(.*\)$/.test(s));
  return `/${segments.join('/')}`;
}

/** The HTTP methods a route module exports, by `export const GET`, `export async function GET`, or `export { x as GET }`. */
export function exportedMethods(source: string): string[] {
  const methods = new Set<string>();
  for (const match of source.matchAll(/export\s+(?:const|let|async\s+function|function)\s+([A-Z]+)\b/g)) {
    if ((HTTP_METHODS as readonly string[]).includes(match[1])) methods.add(match[1]);
  }
  for (const block of source.matchAll(/export\s*\{([^}]*)\}/g)) {
    for (const part of block[1].split(',')) {
      const name = part.trim().split(/\s+as\s+/).pop()?.trim();
      if (name && (HTTP_METHODS as readonly string[]).includes(name)) methods.add(name);
    }
  }
  return [...methods].sort();
}

export function discoverRoutes(root = process.cwd()): { file: string; route: string; method: string }[] {
  return walk(path.join(root, 'app'))
    .filter((file) => /(^|\/)route\.(ts|js)$/.test(file))
    .map((file) => path.relative(root, file))
    .flatMap((file) => exportedMethods(fs.readFileSync(path.join(root, file), 'utf8')).map((method) => ({ file, route: routeOf(file), method })));
}

/** Strips leading comments and blank lines so that a directive after a file comment is still seen. */
function leadingCode(source: string): string {
  return source.replace(/^(?:\s+|\/\/[^\n]*\n|\/\*[\s\S]*?\*\/)*/, '');
}

export function isUseServerModule(source: string): boolean {
  return /^['"]use server['"]/.test(leadingCode(source));
}

/** 'use server' inside a function body (an inline action) rather than at the top of the module. */
export function hasInlineUseServer(source: string): boolean {
  const rest = isUseServerModule(source) ? leadingCode(source).replace(/^['"]use server['"];?/, '') : source;
  return /^\s*['"]use server['"]/m.test(rest);
}

export function exportedFunctions(source: string): string[] {
  const names = new Set<string>();
  for (const match of source.matchAll(/export\s+(?:async\s+)?function\s+([A-Za-z_$][\w$]*)/g)) names.add(match[1]);
  for (const match of source.matchAll(/export\s+const\s+([A-Za-z_$][\w$]*)\s*=\s*(?:async\b|\()/g)) names.add(match[1]);
  for (const block of source.matchAll(/export\s*\{([^}]*)\}/g)) {
    for (const part of block[1].split(',')) {
      const name = part.trim().split(/\s+as\s+/).pop()?.trim();
      if (name && name !== 'default') names.add(name);
    }
  }
  return [...names].sort();
}

export function discoverActions(root = process.cwd()): { file: string; name: string }[] {
  return SOURCE_ROOTS.flatMap((dir) => walk(path.join(root, dir)))
    .map((full) => ({ full, source: fs.readFileSync(full, 'utf8') }))
    .filter(({ source }) => isUseServerModule(source))
    .flatMap(({ full, source }) => exportedFunctions(source).map((name) => ({ file: path.relative(root, full), name })));
}

export function discoverInlineActions(root = process.cwd()): string[] {
  return SOURCE_ROOTS.flatMap((dir) => walk(path.join(root, dir)))
    .filter((full) => hasInlineUseServer(fs.readFileSync(full, 'utf8')))
    .map((full) => path.relative(root, full));
}
