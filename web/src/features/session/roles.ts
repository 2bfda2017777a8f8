export const ROLES = ['operator', 'engineer', 'oncall', 'admin'] as const;

export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  operator: 'Operator',
  engineer: 'Control engineer',
  oncall: 'On-call engineer',
  admin: 'Administrator',
};

export type SignedInUser = {
  id: string;
  email: string;
  name: string;
  roles: Role[];
};

export function hasRole(user: Pick<SignedInUser, 'roles'>, role: Role | undefined): boolean {
  return role === undefined || user.roles.includes(role);
}

export function describeRoles(roles: readonly Role[]): string {
  if (roles.length === 0) return 'no role yet';
  return roles.map((role) => ROLE_LABELS[role] ?? role).join(', ');
}
