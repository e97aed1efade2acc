/**
 * `npm run deps:report`: what the production dependencies are, checked without the advisory
 * service that `npm run audit:prod` needs (not reachable from every machine):
 *
 * 1. Licences of the production dependency tree, read from the installed packages' own
 *    package.json (`npm ls --omit=dev --all --parseable`, offline): a count per licence, and every
 *    package whose licence is missing or is not one of the permissive licences listed below, to be
 *    read by a person before a release (copyleft such as GPL/LGPL/MPL, or unknown terms).
 * 2. Direct dependencies more than one major version behind the registry's latest (`npm outdated`,
 *    which asks the registry about this project's own dependencies only). Without the registry the
 *    licence part still prints and this part says it could not be checked.
 *
 * Prints only; exits 1 when the installed tree cannot be read at all.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { isPermissive, licenceOf } from './lib/licences';

interface InstalledPackage {
  name: string;
  version: string;
  licence: string;
  dir: string;
}

function productionTree(): InstalledPackage[] {
  let out: string;
  try {
    out = execFileSync('npm', ['ls', '--omit=dev', '--all', '--parseable'], { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024, stdio: ['ignore', 'pipe', 'pipe'] });
  } catch (error) {
    // npm ls exits 1 on peer-dependency warnings but still prints the tree.
    out = (error as { stdout?: string }).stdout ?? '';
  }
  const root = path.resolve('.');
  const seen = new Map<string, InstalledPackage>();
  for (const dir of out.split('\n').map((l) => l.trim()).filter(Boolean)) {
    if (path.resolve(dir) === root) continue;
    const file = path.join(dir, 'package.json');
    if (!fs.existsSync(file)) continue;
    const manifest = JSON.parse(fs.readFileSync(file, 'utf8')) as Record<string, unknown>;
    const name = String(manifest.name ?? path.basename(dir));
    const version = String(manifest.version ?? '?');
    seen.set(`${name}@${version}`, { name, version, licence: licenceOf(manifest), dir });
  }
  return [...seen.values()].sort((a, b) => a.name.localeCompare(b.name));
}

interface Outdated {
  name: string;
  current: string;
  latest: string;
  type: string;
  majorsBehind: number;
}

function major(version: string): number | null {
  const match = /^(\d+)\./.exec(version);
  return match ? Number(match[1]) : null;
}

function directDependenciesBehind(): Outdated[] | string {
  let out: string;
  try {
    out = execFileSync('npm', ['outdated', '--json', '--long'], { encoding: 'utf8', maxBuffer: 16 * 1024 * 1024, stdio: ['ignore', 'pipe', 'pipe'], timeout: 120_000 });
  } catch (error) {
    // npm outdated exits 1 when anything is outdated; the JSON is on stdout all the same.
    out = (error as { stdout?: string }).stdout ?? '';
    if (!out.trim()) return `the registry could not be asked (${String((error as { stderr?: string }).stderr ?? error).split('\n')[0].slice(0, 160)})`;
  }
  const entries = JSON.parse(out || '{}') as Record<string, { current?: string; latest?: string; type?: string } | Array<{ current?: string; latest?: string; type?: string }>>;
  const rows: Outdated[] = [];
  for (const [name, value] of Object.entries(entries)) {
    for (const entry of Array.isArray(value) ? value : [value]) {
      const current = entry.current ?? '';
      const latest = entry.latest ?? '';
      const from = major(current);
      const to = major(latest);
      if (from === null || to === null) continue;
      if (to - from > 1) rows.push({ name, current, latest, type: entry.type ?? '', majorsBehind: to - from });
    }
  }
  return rows.sort((a, b) => b.majorsBehind - a.majorsBehind || a.name.localeCompare(b.name));
}

function main() {
  const tree = productionTree();
  if (tree.length === 0) {
    console.error('deps report: the production dependency tree could not be read; run `npm ci` first');
    process.exit(1);
  }
  const byLicence = new Map<string, number>();
  for (const p of tree) byLicence.set(p.licence, (byLicence.get(p.licence) ?? 0) + 1);
  console.log(`production dependency tree: ${tree.length} packages (installed, read offline)`);
  console.log('\nlicences');
  for (const [licence, count] of [...byLicence].sort((a, b) => b[1] - a[1])) {
    console.log(`  ${String(count).padStart(4)}  ${licence}${isPermissive(licence) ? '' : '   ← review'}`);
  }
  const review = tree.filter((p) => !isPermissive(p.licence));
  console.log(`\npackages whose licence needs a person to read it: ${review.length}`);
  for (const p of review) console.log(`  ${p.name}@${p.version}  ${p.licence}`);

  // AMPWARDEN_DEPS_OFFLINE=1 leaves the registry out (the test of this script runs without network).
  const behind = process.env.AMPWARDEN_DEPS_OFFLINE === '1' ? 'AMPWARDEN_DEPS_OFFLINE=1' : directDependenciesBehind();
  console.log('\ndirect dependencies more than one major version behind the latest');
  if (typeof behind === 'string') console.log(`  not checked: ${behind}`);
  else if (behind.length === 0) console.log('  none');
  else for (const o of behind) console.log(`  ${o.name}  ${o.current} → ${o.latest}  (${o.majorsBehind} majors behind, ${o.type || 'dependency'})`);
}

main();
