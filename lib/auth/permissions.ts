/**
 * Roles and their rights (../shared/design/product.md, "People and roles"). Pure: no database,
 * no Next.js, so that pages, route handlers, server actions, components and tests share one table.
 * The database enum `role` (db/schema/core.ts) is built from ROLES.
 */
export const ROLES = ['admin', 'designer', 'reviewer', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

export const PERMISSIONS = [
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
  /** Bring back a deleted project, sheet or schedule within its 30 days (issue 23): admins only. */
  'document:restore',
] as const;
export type Permission = (typeof PERMISSIONS)[number];

/**
 * What each role may do. Admin holds everything. A reviewer may not approve a sheet they
 * authored; that rule needs the sheet and is enforced where sheets are reviewed, not here.
 */
export const ROLE_PERMISSIONS: Readonly<Record<Role, readonly Permission[]>> = {
  admin: PERMISSIONS,
  designer: ['team:read', 'project:write', 'sheet:write', 'sheet:submit', 'sheet:share', 'schedule:write'],
  reviewer: ['team:read', 'sheet:review'],
  viewer: ['team:read'],
};

export function can(role: Role, permission: Permission): boolean {
  return ROLE_PERMISSIONS[role]?.includes(permission) ?? false;
}

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}

/** Plain words for the roles, shown on the members page and in mail. */
export const ROLE_LABELS: Readonly<Record<Role, string>> = {
  admin: 'Admin',
  designer: 'Designer',
  reviewer: 'Reviewer',
  viewer: 'Viewer',
};
