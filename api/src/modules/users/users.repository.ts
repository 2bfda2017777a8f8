import type { Db } from '../../db/knex.js';
import type { Role } from '../../contracts/roles.js';

export interface UserRow {
  id: string;
  email: string;
  name: string;
  roles: Role[];
  createdAt: string;
  lastSignInAt: string | null;
}

const iso = (d: Date | null) => (d ? d.toISOString() : null);

function selectUsers(db: Db) {
  return db('users as u')
    .leftJoin('user_roles as r', 'r.user_id', 'u.id')
    .groupBy('u.id')
    .select(
      'u.id',
      'u.email',
      'u.name',
      'u.created_at',
      'u.last_sign_in_at',
      db.raw(`coalesce(array_agg(r.role ORDER BY r.role) FILTER (WHERE r.role IS NOT NULL), '{}') as roles`),
    );
}

type Raw = { id: string; email: string; name: string; created_at: Date; last_sign_in_at: Date | null; roles: Role[] };
const toUser = (r: Raw): UserRow => ({
  id: r.id,
  email: r.email,
  name: r.name,
  roles: r.roles,
  createdAt: iso(r.created_at) as string,
  lastSignInAt: iso(r.last_sign_in_at),
});

export async function findUserById(db: Db, id: string): Promise<UserRow | undefined> {
  const row = (await selectUsers(db).where('u.id', id).first()) as Raw | undefined;
  return row && toUser(row);
}

export async function findUserByEmail(db: Db, email: string): Promise<UserRow | undefined> {
  const row = (await selectUsers(db).where('u.email', email.toLowerCase()).first()) as Raw | undefined;
  return row && toUser(row);
}

export async function listUsers(db: Db): Promise<UserRow[]> {
  return ((await selectUsers(db).orderBy('u.email')) as Raw[]).map(toUser);
}

/** Creates the user on first sign-in (with the given roles) or records the sign-in. */
export async function recordSignIn(
  db: Db,
  claims: { subject: string; email: string; name: string },
  rolesForNewUser: Role[],
): Promise<{ id: string; created: boolean }> {
  return db.transaction(async (trx) => {
    const email = claims.email.toLowerCase();
    const existing = await trx('users').where({ email }).first<{ id: string } | undefined>('id');
    if (existing) {
      await trx('users')
        .where({ id: existing.id })
        .update({ last_sign_in_at: trx.fn.now(), oidc_subject: claims.subject, name: claims.name });
      return { id: existing.id, created: false };
    }
    const [row] = await trx('users')
      .insert({ email, name: claims.name, oidc_subject: claims.subject, last_sign_in_at: trx.fn.now() })
      .returning<{ id: string }[]>('id');
    if (rolesForNewUser.length)
      await trx('user_roles').insert(rolesForNewUser.map((role) => ({ user_id: row.id, role })));
    return { id: row.id, created: true };
  });
}

export async function replaceRoles(trx: Db, userId: string, roles: Role[]): Promise<void> {
  await trx('user_roles').where({ user_id: userId }).delete();
  if (roles.length) await trx('user_roles').insert(roles.map((role) => ({ user_id: userId, role })));
}
