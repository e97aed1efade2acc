// Role rights as ../shared/design/product.md ("People and roles") states them (issue 6).
import { describe, expect, it } from 'vitest';
import { can, PERMISSIONS, ROLES, type Permission, type Role } from '@/server/auth/permissions';

// Read off product.md: admin may do everything; designer creates and edits projects, sheets and
// schedules, submits and shares; reviewer reads and approves or returns; viewer reads.
const EXPECTED: Record<Role, Permission[]> = {
  admin: [...PERMISSIONS],
  designer: ['team:read', 'project:write', 'sheet:write', 'sheet:submit', 'sheet:share', 'schedule:write'],
  reviewer: ['team:read', 'sheet:review'],
  viewer: ['team:read'],
};

describe('can(role, permission)', () => {
  it.each(ROLES.flatMap((role) => PERMISSIONS.map((permission) => [role, permission] as const)))('%s → %s', (role, permission) => {
    expect(can(role, permission)).toBe(EXPECTED[role].includes(permission));
  });

  it('keeps members, catalogue edits and API tokens for admins alone', () => {
    for (const permission of ['members:manage', 'catalogue:write', 'apitoken:manage'] as const) {
      expect(ROLES.filter((role) => can(role, permission))).toEqual(['admin']);
    }
  });

  it('refuses a role it does not know', () => {
    expect(can('owner' as Role, 'team:read')).toBe(false);
  });
});
