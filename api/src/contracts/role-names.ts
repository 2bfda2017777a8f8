/** Shadowloop roles (DESIGN.md §2), free of any schema library so the web app can import them. */
export const ROLES = ['operator', 'engineer', 'oncall', 'admin'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  operator: 'operator',
  engineer: 'control engineer',
  oncall: 'on-call engineer',
  admin: 'administrator',
};
