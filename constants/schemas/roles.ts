import { z } from 'zod';

/** What each role may do is described in DESIGN.md §2; the server enforces it on every route. */
export const ROLES = ['admin', 'specialist', 'engineer', 'approver'] as const;
export type Role = (typeof ROLES)[number];
export const zRole = z.enum(ROLES);

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  specialist: 'Compliance specialist',
  engineer: 'Test engineer',
  approver: 'Approver',
};

/** Roles in the canonical order of ROLES, whatever order they were given in. */
export const sortRoles = (roles: readonly Role[]): Role[] => [...roles].sort((a, b) => ROLES.indexOf(a) - ROLES.indexOf(b));
