import type { RequestHandler } from 'express';
import type { Db } from '../db/knex.js';
import { AppError } from '../http/errors.js';
import { isUuid } from '../http/params.js';
import { useToken } from '../modules/access-tokens/access-tokens.repository.js';
import { sourceCoversLoop, useIngestToken } from '../modules/ingest-sources/ingest-sources.repository.js';
import { INGEST_TOKEN_PREFIX } from '../modules/ingest-sources/ingest-sources.service.js';
import { findUserById } from '../modules/users/users.repository.js';
import './ingest-principal.js';

const invalidToken = () => new AppError(401, 'invalid_token', 'The access token is unknown or revoked.');

/**
 * Resolves `Authorization: Bearer <token>` to its user (acting with the user's roles), or, for an
 * ingest source's token (sli_…), to an ingest principal that the route table only lets post
 * readings for its loops. Marks how the request was authenticated: token requests skip CSRF,
 * session requests do not.
 */
export function bearerAuth(db: Db): RequestHandler {
  return async (req, _res, next) => {
    const header = req.headers.authorization;
    if (!header) {
      if (req.user) req.authMethod = 'session';
      return next();
    }
    const token = /^Bearer\s+(\S+)$/i.exec(header)?.[1];
    if (!token) throw invalidToken();
    if (token.startsWith(INGEST_TOKEN_PREFIX)) {
      const source = await useIngestToken(db, token);
      if (!source) throw invalidToken();
      req.user = undefined;
      req.ingest = {
        ...source,
        mayPost: async (loopId) => isUuid(loopId) && sourceCoversLoop(db, source.sourceId, loopId),
      };
      req.authMethod = 'token';
      return next();
    }
    const owner = await useToken(db, token);
    const user = owner && (await findUserById(db, owner.userId));
    if (!user) throw invalidToken();
    req.user = { id: user.id, email: user.email, name: user.name, roles: user.roles };
    req.authMethod = 'token';
    next();
  };
}
