import { z } from 'zod';

/** Shadowloop roles, as stored in user_roles (DESIGN.md §2). */
export const ROLES = ['operator', 'engineer', 'oncall', 'admin'] as const;
export type Role = (typeof ROLES)[number];
export const RoleSchema = z.enum(ROLES);

export const ROLE_LABELS: Record<Role, string> = {
  operator: 'operator',
  engineer: 'control engineer',
  oncall: 'on-call engineer',
  admin: 'administrator',
};
