import type { Role } from '../../api/src/contracts/roles.js';

export interface DemoAccount {
  email: string;
  name: string;
  roles: Role[];
}

/** Every demo account signs in with this password on the local identity provider. */
export const DEMO_PASSWORD = 'shadowloop-demo';

/** The invented Quillmere staff that the demo seed and the local identity provider share. */
export const DEMO_ACCOUNTS: DemoAccount[] = [
  { email: 'operator@quillmere.example', name: 'Ines Marlow', roles: ['operator'] },
  { email: 'engineer@quillmere.example', name: 'Tobias Renner', roles: ['engineer'] },
  { email: 'reviewer@quillmere.example', name: 'Priya Hallam', roles: ['engineer'] },
  { email: 'oncall@quillmere.example', name: 'Dara Okafor', roles: ['oncall'] },
  { email: 'admin@quillmere.example', name: 'Ruth Ellery', roles: ['operator', 'engineer', 'oncall', 'admin'] },
];
