import type { Role } from '../features/session/roles';

export type SectionKey = 'floor' | 'loops' | 'models' | 'alerts' | 'rota' | 'admin';

export type Section = {
  key: SectionKey;
  path: string;
  label: string;
  requiredRole?: Role;
};

export const SECTIONS: readonly Section[] = [
  { key: 'floor', path: '/', label: 'Floor' },
  { key: 'loops', path: '/loops', label: 'Loops' },
  { key: 'models', path: '/models', label: 'Models', requiredRole: 'engineer' },
  { key: 'alerts', path: '/alerts', label: 'Alerts' },
  { key: 'rota', path: '/rota', label: 'Rota' },
  { key: 'admin', path: '/admin', label: 'Admin', requiredRole: 'admin' },
];

export function sectionRole(key: SectionKey): Role | undefined {
  return SECTIONS.find((section) => section.key === key)?.requiredRole;
}
