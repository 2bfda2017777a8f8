import type { Role } from '../contracts/roles.js';

/** The person (or script acting for them) behind a request. */
export interface SignedInUser {
  id: string;
  email: string;
  name: string;
  roles: Role[];
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace -- augmenting Express's request type
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type -- passport's User gains our fields
    interface User extends SignedInUser {}
    interface Request {
      authMethod?: 'session' | 'token';
    }
  }
}
