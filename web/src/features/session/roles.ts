import type { Me } from '@shadowloop/api/contracts';
import { ROLE_LABELS as ROLE_WORDS, ROLES, type Role } from '@shadowloop/api/contracts/role-names';

export { ROLES, type Role };
export type SignedInUser = Me;

export const ROLE_LABELS = Object.fromEntries(
  ROLES.map((role) => [role, ROLE_WORDS[role].charAt(0).toUpperCase() + ROLE_WORDS[role].slice(1)]),
) as Record<Role, string>;

export function hasRole(user: Pick<SignedInUser, 'roles'>, role: Role | undefined): boolean {
  return role === undefined || user.roles.includes(role);
}

export function describeRoles(roles: readonly Role[]): string {
  if (roles.length === 0) return 'no role yet';
  return roles.map((role) => ROLE_LABELS[role] ?? role).join(', ');
}
