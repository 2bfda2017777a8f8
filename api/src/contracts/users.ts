import { z } from 'zod';
import { RoleSchema } from './roles.js';

export const UserSchema = z.object({
  id: z.uuid(),
  email: z.email(),
  name: z.string(),
  roles: z.array(RoleSchema),
  createdAt: z.iso.datetime({ offset: true }),
  lastSignInAt: z.iso.datetime({ offset: true }).nullable(),
});
export type User = z.infer<typeof UserSchema>;

export const MeSchema = z.object({ id: z.uuid(), email: z.email(), name: z.string(), roles: z.array(RoleSchema) });
export type Me = z.infer<typeof MeSchema>;

export const SetRolesBodySchema = z.object({
  roles: z
    .array(RoleSchema)
    .max(4)
    .refine((r) => new Set(r).size === r.length, 'roles must not repeat'),
});

export const AccessTokenSchema = z.object({
  id: z.uuid(),
  label: z.string(),
  prefix: z.string(),
  createdAt: z.iso.datetime({ offset: true }),
  lastUsedAt: z.iso.datetime({ offset: true }).nullable(),
  revokedAt: z.iso.datetime({ offset: true }).nullable(),
  userEmail: z.email().optional(),
});
export const CreateAccessTokenBodySchema = z.object({ label: z.string().trim().min(1).max(80) });
export const CreatedAccessTokenSchema = AccessTokenSchema.extend({ token: z.string() });

export const AuditEntrySchema = z.object({
  id: z.string(),
  at: z.iso.datetime({ offset: true }),
  actorEmail: z.string().nullable(),
  action: z.string(),
  target: z.string().nullable(),
  details: z.unknown(),
});

export type AccessToken = z.infer<typeof AccessTokenSchema>;
export type CreatedAccessToken = z.infer<typeof CreatedAccessTokenSchema>;
export type AuditEntry = z.infer<typeof AuditEntrySchema>;
