// The licence part of `npm run deps:report` (issue 19, Low), which works without the advisory
// service. SPDX expression rules from the SPDX specification, Annex D (from memory): OR offers a
// choice, AND requires both, AND binds tighter than OR, parentheses group.
import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { isPermissive, licenceOf } from '../../../scripts/lib/licences';

describe('isPermissive (SPDX expressions)', () => {
  it('single permissive ids pass; copyleft and unknown terms are for a person to read', () => {
    for (const id of ['MIT', 'ISC', 'Apache-2.0', 'BSD-3-Clause', '0BSD']) expect(isPermissive(id), id).toBe(true);
    for (const id of ['GPL-3.0-only', 'LGPL-3.0-or-later', 'MPL-2.0', 'UNKNOWN', 'SEE LICENSE IN LICENSE.txt', 'MIT/X11']) expect(isPermissive(id), id).toBe(false);
  });
  it('OR needs one permissive side, AND both; AND binds tighter than OR; parentheses group', () => {
    expect(isPermissive('(MIT OR GPL-3.0-or-later)')).toBe(true);
    expect(isPermissive('MIT AND Zlib')).toBe(true);
    expect(isPermissive('MIT AND LGPL-2.1-only')).toBe(false);
    // (MIT OR GPL) AND LGPL: every choice carries the LGPL.
    expect(isPermissive('(MIT OR GPL-3.0-only) AND LGPL-2.1-only')).toBe(false);
    // MIT OR (GPL AND LGPL): MIT may be chosen.
    expect(isPermissive('MIT OR GPL-3.0-only AND LGPL-2.1-only')).toBe(true);
    expect(isPermissive('Apache-2.0 WITH LLVM-exception')).toBe(true);
    expect(isPermissive('(MIT')).toBe(false);
  });
  it('reads the license field, its old object form and the old licenses array', () => {
    expect(licenceOf({ license: 'MIT' })).toBe('MIT');
    expect(licenceOf({ license: { type: 'BSD-2-Clause' } })).toBe('BSD-2-Clause');
    expect(licenceOf({ licenses: [{ type: 'MIT' }, { type: 'Apache-2.0' }] })).toBe('(MIT OR Apache-2.0)');
    expect(licenceOf({})).toBe('UNKNOWN');
  });
});

describe('npm run deps:report, offline', () => {
  it('prints the licence of every production package from the installed tree without asking any service', () => {
    const out = execFileSync(process.execPath, ['--import', 'tsx', 'scripts/deps-report.ts'], { encoding: 'utf8', env: { ...process.env, AMPWARDEN_DEPS_OFFLINE: '1' }, timeout: 120_000 });
    const total = Number(/production dependency tree: (\d+) packages/.exec(out)?.[1]);
    expect(total).toBeGreaterThan(50);
    const counted = [...out.matchAll(/^\s+(\d+) {2}\S/gm)].reduce((sum, m) => sum + Number(m[1]), 0);
    expect(counted).toBe(total);
    expect(out).toMatch(/direct dependencies more than one major version behind the latest\n {2}not checked: AMPWARDEN_DEPS_OFFLINE=1/);
  });
});
