/**
 * The layer rule of DEVELOPERS.md ("Layout and rules"), checked on every import of every .ts/.tsx
 * file of the layered folders. Layers point one way:
 *
 *     app → components, server → db → lib
 *
 * - `lib/` is pure TypeScript that runs in the browser and on the server: it imports only other
 *   `lib/` modules and the few npm packages listed in LIB_PACKAGES (each checked to run in a
 *   browser) — never React, Next.js, the database, server code, components or a Node.js module.
 * - `db/` imports `lib/` and its database packages, never `server/`, `components/` or `app/`.
 * - `server/` imports `db/` and `lib/`, never `components/` or `app/`.
 * - `components/` import `lib/` (and each other), never `server/`, `db/` or `app/`; a server
 *   action reaches a client component as a prop from the page or layout in `app/`.
 * - No layer imports `scripts/` or `tests/`.
 *
 * Type-only imports count: a type taken from `db/` still ties a component to the database layer's
 * shapes. There are no exceptions today; an exception would be added to ALLOWED_EXCEPTIONS with
 * the reason beside it.
 *
 * Imports are read with the TypeScript parser (static and type imports, re-exports, `import()`,
 * `import('…')` types and `require()`), not with regular expressions, so a multi-line import or a
 * comment cannot hide one.
 */
import { builtinModules } from 'node:module';
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

const ROOT = path.resolve(import.meta.dirname, '../..');
const LAYERS = ['app', 'components', 'server', 'db', 'lib'] as const;
type Layer = (typeof LAYERS)[number];

/**
 * npm packages `lib/` may import. Each runs in the browser as well as in Node.js: zod and decimal.js
 * are plain JavaScript; papaparse reads text in either; exceljs ships a browser build (its
 * package.json "browser" field) that bundlers pick for the client; @noble/hashes is SHA-256 in plain
 * JavaScript (lib/auth/linkTokens.ts).
 */
const LIB_PACKAGES = new Set(['zod', 'decimal.js', 'papaparse', 'exceljs', '@noble/hashes', 'bcryptjs']);

/** Node.js's own modules, with and without the `node:` prefix (fs, path, crypto, os…). */
const NODE_BUILTINS = new Set(builtinModules.flatMap((name) => [name, `node:${name}`, name.split('/')[0]]));

/** Other folders of the repository that no layer may import. */
const NOT_IMPORTABLE = ['scripts', 'tests'];

/** Layer → layers it must not import. */
const FORBIDDEN_LAYERS: Record<Layer, readonly Layer[]> = {
  app: [],
  components: ['server', 'db', 'app'],
  server: ['components', 'app'],
  db: ['server', 'components', 'app'],
  lib: ['app', 'components', 'server', 'db'],
};

/** `file → import` pairs allowed against the rule, each with its reason. None today. */
const ALLOWED_EXCEPTIONS: ReadonlyArray<{ file: string; target: string; why: string }> = [];

interface ImportRef {
  /** Repository-relative path of the importing file, with forward slashes. */
  file: string;
  specifier: string;
  line: number;
}

/** Every module specifier a file imports, exports from, loads dynamically or names in a type. */
function importsOf(file: string, text: string): ImportRef[] {
  const source = ts.createSourceFile(file, text, ts.ScriptTarget.Latest, true, file.endsWith('.tsx') ? ts.ScriptKind.TSX : ts.ScriptKind.TS);
  const found: ImportRef[] = [];
  const add = (node: ts.Node, specifier: ts.Expression | undefined) => {
    if (specifier && ts.isStringLiteralLike(specifier)) {
      found.push({ file, specifier: specifier.text, line: source.getLineAndCharacterOfPosition(node.getStart(source)).line + 1 });
    }
  };
  const visit = (node: ts.Node) => {
    if (ts.isImportDeclaration(node) || ts.isExportDeclaration(node)) add(node, node.moduleSpecifier);
    else if (ts.isImportEqualsDeclaration(node) && ts.isExternalModuleReference(node.moduleReference)) add(node, node.moduleReference.expression);
    else if (ts.isCallExpression(node)) {
      const callee = node.expression;
      const isDynamicImport = callee.kind === ts.SyntaxKind.ImportKeyword;
      const isRequire = ts.isIdentifier(callee) && callee.text === 'require';
      if ((isDynamicImport || isRequire) && node.arguments.length > 0) add(node, node.arguments[0]);
    } else if (ts.isImportTypeNode(node) && ts.isLiteralTypeNode(node.argument)) add(node, node.argument.literal as ts.Expression);
    ts.forEachChild(node, visit);
  };
  visit(source);
  return found;
}

/** What an import points at: a folder of this repository (by path) or an npm / Node.js module. */
type Target = { kind: 'repo'; path: string } | { kind: 'package'; name: string };

function resolveTarget(file: string, specifier: string): Target {
  if (specifier.startsWith('@/')) return { kind: 'repo', path: path.posix.normalize(specifier.slice(2)) };
  if (specifier.startsWith('./') || specifier.startsWith('../') || specifier === '.' || specifier === '..') {
    return { kind: 'repo', path: path.posix.normalize(path.posix.join(path.posix.dirname(file), specifier)) };
  }
  const parts = specifier.split('/');
  return { kind: 'package', name: specifier.startsWith('@') ? parts.slice(0, 2).join('/') : parts[0] };
}

function layerOf(repoPath: string): Layer | null {
  const top = repoPath.split('/')[0];
  return (LAYERS as readonly string[]).includes(top) ? (top as Layer) : null;
}

/** Why an import breaks the rule, or null when it keeps it. */
function violation(ref: ImportRef): string | null {
  const from = layerOf(ref.file);
  if (!from) return null;
  const target = resolveTarget(ref.file, ref.specifier);
  if (target.kind === 'repo') {
    const top = target.path.split('/')[0];
    if (top === '..' || target.path.startsWith('../')) return `${from}/ imports outside the repository`;
    if (NOT_IMPORTABLE.includes(top)) return `${from}/ must not import ${top}/`;
    const to = layerOf(target.path);
    if (to && FORBIDDEN_LAYERS[from].includes(to)) return `${from}/ must not import ${to}/ (layers point app → components/server → db → lib)`;
    return null;
  }
  if (from === 'lib') {
    if (NODE_BUILTINS.has(target.name) || target.name.startsWith('node:')) return `lib/ must not import the Node.js module '${target.name}' (lib runs in the browser too)`;
    if (!LIB_PACKAGES.has(target.name)) {
      return `lib/ must not import the package '${target.name}' (lib is pure TypeScript: no React, Next.js, database or server packages; a package that runs in the browser may be added to LIB_PACKAGES with its reason)`;
    }
  }
  return null;
}

function sourceFiles(dir: string): string[] {
  const out: string[] = [];
  for (const entry of readdirSync(path.join(ROOT, dir), { withFileTypes: true })) {
    const rel = `${dir}/${entry.name}`;
    if (entry.isDirectory()) out.push(...sourceFiles(rel));
    else if (/\.(ts|tsx)$/.test(entry.name)) out.push(rel);
  }
  return out;
}

function allImports(): ImportRef[] {
  return LAYERS.flatMap((layer) => sourceFiles(layer)).flatMap((file) => importsOf(file, readFileSync(path.join(ROOT, file), 'utf8')));
}

function isAllowedException(ref: ImportRef): boolean {
  return ALLOWED_EXCEPTIONS.some((e) => e.file === ref.file && e.target === ref.specifier);
}

describe('the layer rule (DEVELOPERS.md): app → components/server → db → lib', () => {
  // The checker itself, on imports written for the purpose: each forbidden kind is caught, and the
  // allowed directions pass, so an empty list of violations below means something.
  it.each([
    ['lib/sheet/x.ts', 'react', true],
    ['lib/sheet/x.ts', 'react-dom/client', true],
    ['lib/sheet/x.ts', 'next/link', true],
    ['lib/sheet/x.ts', 'next-auth', true],
    ['lib/sheet/x.ts', 'drizzle-orm', true],
    ['lib/sheet/x.ts', 'pg', true],
    ['lib/sheet/x.ts', 'node:crypto', true],
    ['lib/sheet/x.ts', 'fs', true],
    ['lib/sheet/x.ts', 'fs/promises', true],
    ['lib/sheet/x.ts', '@/db/client', true],
    ['lib/sheet/x.ts', '../../server/auth/session', true],
    ['lib/sheet/x.ts', '@/components/sheet/CandidateGrid', true],
    ['lib/sheet/x.ts', '@/app/layout', true],
    ['lib/sheet/x.ts', '../../tests/helpers/fixtures', true],
    ['lib/sheet/x.ts', '../electrical/sizing/types', false],
    ['lib/sheet/x.ts', '@/lib/units', false],
    ['lib/sheet/x.ts', 'zod', false],
    ['db/queries/x.ts', '../../server/auth/tokens', true],
    ['db/queries/x.ts', '@/components/share/sheetTables', true],
    ['db/queries/x.ts', '@/app/api/health/route', true],
    ['db/queries/x.ts', '../../lib/sheet', false],
    ['db/queries/x.ts', 'drizzle-orm', false],
    ['server/pdf/x.tsx', '@/components/shell/CautionNotice', true],
    ['server/pdf/x.tsx', '@/app/layout', true],
    ['server/pdf/x.tsx', '@/db/queries/sheets', false],
    ['server/pdf/x.tsx', '@/lib/sheet/schema', false],
    ['components/sheet/x.tsx', '@/server/auth/permissions', true],
    ['components/sheet/x.tsx', '@/db/queries/sheets', true],
    ['components/sheet/x.tsx', '../../app/layout', true],
    ['components/sheet/x.tsx', '@/lib/auth/permissions', false],
    ['components/sheet/x.tsx', 'react', false],
    ['app/x/page.tsx', '@/server/auth/session', false],
    ['app/x/page.tsx', '@/components/sheet/CandidateGrid', false],
  ] as const)('%s importing %s is refused: %s', (file, specifier, refused) => {
    expect(violation({ file, specifier, line: 1 }) !== null).toBe(refused);
  });

  it('reads every kind of import: static, type-only, multi-line, re-export, import(), import type nodes, require()', () => {
    const text = [
      "import a from 'pkg-a';",
      "import type { B } from 'pkg-b';",
      'import {',
      '  c,',
      "} from 'pkg-c';",
      "export { d } from 'pkg-d';",
      "export * from 'pkg-e';",
      "const f = await import('pkg-f');",
      "type G = typeof import('pkg-g');",
      "const h = require('pkg-h');",
      "import i = require('pkg-i');",
      "// import j from 'pkg-j';",
    ].join('\n');
    expect(importsOf('lib/x.ts', text).map((r) => r.specifier)).toEqual(['pkg-a', 'pkg-b', 'pkg-c', 'pkg-d', 'pkg-e', 'pkg-f', 'pkg-g', 'pkg-h', 'pkg-i']);
  });

  it('no .ts/.tsx file of app/, components/, server/, db/ or lib/ imports against the rule', () => {
    const imports = allImports();
    // The scan found the code: every layer has files with imports.
    for (const layer of LAYERS) expect(imports.some((r) => r.file.startsWith(`${layer}/`)), `${layer}/ has imports`).toBe(true);
    const broken = imports
      .filter((ref) => !isAllowedException(ref))
      .flatMap((ref) => {
        const why = violation(ref);
        return why ? [`${ref.file}:${ref.line} imports '${ref.specifier}': ${why}`] : [];
      });
    expect(broken).toEqual([]);
  });

  it('every allowed exception still exists (a stale exception would hide a future one)', () => {
    const imports = allImports();
    for (const e of ALLOWED_EXCEPTIONS) expect(imports.some((r) => r.file === e.file && r.specifier === e.target), `${e.file} → ${e.target}`).toBe(true);
  });
});
