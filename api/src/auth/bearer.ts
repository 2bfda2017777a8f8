import type { RequestHandler } from 'express';
import type { Db } from '../db/knex.js';
import { AppError } from '../http/errors.js';
import { useToken } from '../modules/access-tokens/access-tokens.repository.js';
import { findUserById } from '../modules/users/users.repository.js';

/**
 * Resolves `Authorization: Bearer <token>` to its user (acting with the user's roles), and marks
 * how the request was authenticated: token requests skip CSRF, session requests do not.
 */
export function bearerAuth(db: Db): RequestHandler {
  return async (req, _res, next) => {
    const header = req.headers.authorization;
    if (!header) {
      if (req.user) req.authMethod = 'session';
      return next();
    }
    const match = /^Bearer\s+(\S+)$/i.exec(header);
    const owner = match ? await useToken(db, match[1]) : undefined;
    const user = owner && (await findUserById(db, owner.userId));
    if (!user) throw new AppError(401, 'invalid_token', 'The access token is unknown or revoked.');
    req.user = { id: user.id, email: user.email, name: user.name, roles: user.roles };
    req.authMethod = 'token';
    next();
  };
}
