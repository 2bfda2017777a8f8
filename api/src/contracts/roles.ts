import { z } from 'zod';
import { ROLES } from './role-names.js';

export { ROLES, ROLE_LABELS, type Role } from './role-names.js';
export const RoleSchema = z.enum(ROLES);
