import { z } from 'zod';
import { AccessTokenSchema, CreateAccessTokenBodySchema, CreatedAccessTokenSchema } from '../../contracts/users.js';
import type { Db } from '../../db/knex.js';
import type { RouteTable } from '../../http/route.js';
import { createAccessToken, listAccessTokens, revokeAccessToken } from './access-tokens.service.js';

export function registerAccessTokenRoutes(routes: RouteTable, db: Db): void {
  routes.add(
    {
      method: 'get',
      path: '/api/v1/access-tokens',
      access: 'signed-in',
      tag: 'access tokens',
      summary: "Your access tokens; all=true lists every user's (admin)",
      query: z.object({ all: z.enum(['true', 'false']).optional() }),
      response: z.array(AccessTokenSchema),
    },
    ({ user, query }) => listAccessTokens(db, user, query.all === 'true'),
  );

  routes.add(
    {
      method: 'post',
      path: '/api/v1/access-tokens',
      access: 'signed-in',
      tag: 'access tokens',
      status: 201,
      summary: 'Create an access token (the secret is shown once)',
      body: CreateAccessTokenBodySchema,
      response: CreatedAccessTokenSchema,
    },
    ({ user, body }) => createAccessToken(db, user, body.label),
  );

  routes.add(
    {
      method: 'delete',
      path: '/api/v1/access-tokens/:id',
      access: 'signed-in',
      tag: 'access tokens',
      summary: 'Revoke an access token (its owner or an admin)',
    },
    async ({ user, req }) => {
      await revokeAccessToken(db, user, String(req.params.id));
    },
  );
}
