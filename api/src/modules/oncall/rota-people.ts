import type { Person, RotaPerson } from '../../contracts/alerts.js';
import type { Role } from '../../contracts/roles.js';
import type { Db } from '../../db/knex.js';
import { AppError, badRequest } from '../../http/errors.js';

/** Roles that let a person take on-call shifts (an administrator may cover a shift). */
export const ROTA_ROLES: readonly Role[] = ['oncall', 'admin'];

type Raw = { id: string; name: string; email: string; roles: string[] };

const withRoles = (db: Db) =>
  db('users as u')
    .leftJoin('user_roles as r', 'r.user_id', 'u.id')
    .groupBy('u.id')
    .select(
      'u.id',
      'u.name',
      'u.email',
      db.raw(`coalesce(array_agg(r.role ORDER BY r.role) FILTER (WHERE r.role IS NOT NULL), '{}') as roles`),
    );

/** Everyone who holds one of `roles`, by name. */
export async function listPeopleWithRole(db: Db, roles: readonly Role[]): Promise<RotaPerson[]> {
  const rows = (await withRoles(db)
    .havingRaw('coalesce(bool_or(r.role = ANY(?)), false)', [roles as Role[]])
    .orderBy('u.name')) as Raw[];
  return rows.map((r) => ({ id: r.id, name: r.name, email: r.email, roles: r.roles }));
}

async function findPeople(db: Db, ids: string[]): Promise<Map<string, Raw>> {
  const rows = ids.length ? ((await withRoles(db).whereIn('u.id', ids)) as Raw[]) : [];
  return new Map(rows.map((r) => [r.id, r]));
}

/**
 * The people behind `ids`, each of whom must exist and hold one of `roles`; otherwise a 400
 * (unknown user) or 422 (role missing) naming the field and the person.
 */
export async function requirePeopleWithRole(
  db: Db,
  ids: string[],
  roles: readonly Role[],
  field: string,
): Promise<Person[]> {
  const found = await findPeople(db, ids);
  const unknown = ids.filter((id) => !found.has(id));
  if (unknown.length)
    throw badRequest(
      `There is no user with id ${unknown.join(', ')} (${field}).`,
      unknown.map((id) => ({ path: field, message: `unknown user ${id}` })),
    );
  const lacking = ids.map((id) => found.get(id) as Raw).filter((p) => !p.roles.some((r) => roles.includes(r as Role)));
  if (lacking.length)
    throw new AppError(
      422,
      'role_missing',
      `${lacking.map((p) => `${p.name} (${p.email})`).join(', ')} does not hold the ${roles.join(' or ')} role (${field}); an administrator can grant it under Users.`,
      lacking.map((p) => ({ path: field, message: `${p.email} lacks the ${roles.join(' or ')} role` })),
    );
  return ids.map((id) => {
    const { name, email } = found.get(id) as Raw;
    return { id, name, email };
  });
}
