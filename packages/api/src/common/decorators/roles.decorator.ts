import { SetMetadata } from '@nestjs/common';
import type { Role } from '@workback/core';

export const ROLES_KEY = 'workback:roles';
export const ADMIN_ONLY = 'workback:admin-only';

/** Household roles allowed on a route; others get 403. Without it every member may. */
export const Roles = (...roles: Role[]) => SetMetadata(ROLES_KEY, roles);

/** The site operator only (ADMIN_EMAILS); needs no household and sees no children's data. */
export const AdminOnly = () => SetMetadata(ADMIN_ONLY, true);
