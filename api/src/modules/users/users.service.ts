import { announceRevocation } from '../../realtime/access-revocation.js';
import type { SignedInUser } from '../../auth/user.js';
import type { Role } from '../../contracts/roles.js';
import type { Db } from '../../db/knex.js';
import { AppError, notFound } from '../../http/errors.js';
import { isUuid } from '../../http/params.js';
import { recordAudit } from '../audit/audit.repository.js';
import { findUserById, replaceRoles } from './users.repository.js';

export async function getMe(db: Db, userId: string) {
  const user = await findUserById(db, userId);
  if (!user) throw notFound('Your user record');
  return { id: user.id, email: user.email, name: user.name, roles: user.roles };
}

/** Replaces a user's roles; an admin cannot remove their own admin role (no lock-out). */
export async function setUserRoles(db: Db, actor: SignedInUser, userId: string, roles: Role[]) {
  if (!isUuid(userId)) throw notFound(`User ${userId}`);
  if (actor.id === userId && !roles.includes('admin')) {
    throw new AppError(422, 'own_admin_role', 'You cannot remove your own admin role; ask another administrator.');
  }
  await db.transaction(async (trx) => {
    const before = await findUserById(trx, userId);
    if (!before) throw notFound(`User ${userId}`);
    await replaceRoles(trx, userId, roles);
    await announceRevocation(trx, { userId });
    await recordAudit(trx, {
      actor,
      action: 'user.roles_changed',
      targetType: 'user',
      targetId: userId,
      details: { email: before.email, before: before.roles, after: [...roles].sort() },
    });
  });
  return findUserById(db, userId);
}
