/**
 * Roles a user can hold in a household, plus the site operator.
 * `Role.owner` → `'owner'`.
 */
export const Role = {
  owner: 'owner',
  parent: 'parent',
  tutor: 'tutor',
} as const;
export type Role = (typeof Role)[keyof typeof Role];

/** All household roles, in order of authority. */
export const ROLES: readonly Role[] = [Role.owner, Role.parent, Role.tutor];

/** Roles that may change household data (everything but notes, pins and plans). */
export const EDITOR_ROLES: readonly Role[] = [Role.owner, Role.parent];

/** `isRole('tutor')` → `true`; `isRole('admin')` → `false` (admin is not a household role). */
export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}
