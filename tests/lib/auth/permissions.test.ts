// Role rights as ../shared/design/product.md ("People and roles") states them (issue 6).
import { describe, expect, it } from 'vitest';
import { can, PERMISSIONS, ROLES, type Permission, type Role } from '@/lib/auth/permissions';

// Read off product.md, written out by hand (never copied from the table under test): admin may do
// everything — read, projects, sheets, submit, review, share, catalogue edits and imports, members
// and roles, schedules, API tokens; designer creates and edits projects, sheets and schedules,
// submits and shares; reviewer reads and approves or returns; viewer reads. Issue 23 adds: an
// admin restores a deleted project, sheet or schedule (document:restore).
const EVERY_RIGHT: Permission[] = [
  'team:read',
  'project:write',
  'sheet:write',
  'sheet:submit',
  'sheet:review',
  'sheet:share',
  'catalogue:write',
  'members:manage',
  'schedule:write',
  'apitoken:manage',
  'document:restore',
];
const EXPECTED: Record<Role, Permission[]> = {
  admin: EVERY_RIGHT,
  designer: ['team:read', 'project:write', 'sheet:write', 'sheet:submit', 'sheet:share', 'schedule:write'],
  reviewer: ['team:read', 'sheet:review'],
  viewer: ['team:read'],
};

describe('can(role, permission)', () => {
  it('knows exactly the four roles of product.md and the rights listed above (a new one needs a decision here)', () => {
    expect([...ROLES]).toEqual(['admin', 'designer', 'reviewer', 'viewer']);
    expect([...PERMISSIONS].sort()).toEqual([...EVERY_RIGHT].sort());
  });

  it.each(ROLES.flatMap((role) => PERMISSIONS.map((permission) => [role, permission] as const)))('%s → %s', (role, permission) => {
    expect(can(role, permission)).toBe(EXPECTED[role].includes(permission));
  });

  it('keeps members, catalogue edits and API tokens for admins alone', () => {
    for (const permission of ['members:manage', 'catalogue:write', 'apitoken:manage', 'document:restore'] as const) {
      expect(ROLES.filter((role) => can(role, permission))).toEqual(['admin']);
    }
  });

  it('refuses a role it does not know', () => {
    expect(can('owner' as Role, 'team:read')).toBe(false);
  });
});
