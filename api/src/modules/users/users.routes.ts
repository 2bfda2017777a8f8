import { z } from 'zod';
import { MeSchema, SetRolesBodySchema, UserSchema } from '../../contracts/users.js';
import type { Db } from '../../db/knex.js';
import type { RouteTable } from '../../http/route.js';
import { getMe, setUserRoles } from './users.service.js';
import { listUsers } from './users.repository.js';

export function registerUserRoutes(routes: RouteTable, db: Db): void {
  routes.add(
    {
      method: 'get',
      path: '/api/v1/me',
      access: 'signed-in',
      tag: 'users',
      summary: 'The signed-in user and roles',
      response: MeSchema,
    },
    ({ user }) => getMe(db, user.id),
  );

  routes.add(
    {
      method: 'get',
      path: '/api/v1/users',
      access: ['admin'],
      tag: 'users',
      summary: 'Every user with roles',
      response: z.array(UserSchema),
    },
    () => listUsers(db),
  );

  routes.add(
    {
      method: 'put',
      path: '/api/v1/users/:id/roles',
      access: ['admin'],
      tag: 'users',
      summary: "Replace a user's roles (audited)",
      body: SetRolesBodySchema,
      response: UserSchema,
    },
    ({ req, body, user }) => setUserRoles(db, user, String(req.params.id), body.roles),
  );
}
