import type { IncomingMessage, ServerResponse } from 'node:http';
import type { RequestHandler } from 'express';
import type pg from 'pg';
import { createPassport } from '../auth/passport.js';
import { createSessionMiddleware } from '../auth/session.js';
import type { SignedInUser } from '../auth/user.js';
import type { Config } from '../config/config.js';
import type { Db } from '../db/knex.js';
import { useToken } from '../modules/access-tokens/access-tokens.repository.js';
import { INGEST_TOKEN_PREFIX } from '../modules/ingest-sources/ingest-sources.service.js';
import { findUserById } from '../modules/users/users.repository.js';
import { sessionRoom, tokenRoom, userRoom } from './access-revocation.js';
import type { RealtimeServer } from './realtime-types.js';

type EngineRequest = IncomingMessage & { _query?: Record<string, string>; user?: SignedInUser; sessionID?: string };
type EngineMiddleware = (req: EngineRequest, res: ServerResponse, next: (error?: unknown) => void) => void;

/** Runs an Express middleware on the handshake request only (later polling requests carry a sid). */
const onHandshake =
  (middleware: RequestHandler): EngineMiddleware =>
  (req, res, next) => {
    if (req._query?.sid === undefined) (middleware as unknown as EngineMiddleware)(req, res, next);
    else next();
  };

async function userOfToken(db: Db, token: unknown): Promise<{ user: SignedInUser; tokenId: string } | undefined> {
  if (typeof token !== 'string' || !token || token.startsWith(INGEST_TOKEN_PREFIX)) return undefined;
  const owner = await useToken(db, token);
  const user = owner && (await findUserById(db, owner.userId));
  return user
    ? { user: { id: user.id, email: user.email, name: user.name, roles: user.roles }, tokenId: owner.tokenId }
    : undefined;
}

const refusal = () =>
  Object.assign(new Error('unauthenticated'), {
    data: { code: 'unauthenticated', message: 'Sign in first, or pass an access token as auth: { token }.' },
  });

/**
 * Who is behind a socket: the browser session (the same express-session and passport as the HTTP
 * api, run on the handshake), else an access token in the handshake's auth. Anyone else is refused
 * with connect_error "unauthenticated". Ingest tokens cannot watch.
 */
export function authenticateSockets(io: RealtimeServer, deps: { config: Config; db: Db; pool: pg.Pool }): void {
  const passport = createPassport(deps.config, deps.db);
  io.engine.use(onHandshake(createSessionMiddleware(deps.config, deps.pool)));
  io.engine.use(onHandshake(passport.initialize()));
  io.engine.use(onHandshake(passport.session()));
  io.use((socket, next) => {
    const request = socket.request as EngineRequest;
    const sessionUser = request.user;
    const resolve = sessionUser
      ? Promise.resolve({
          user: sessionUser,
          credential: { kind: 'session', sessionId: request.sessionID ?? '' } as const,
        })
      : userOfToken(deps.db, (socket.handshake.auth as { token?: unknown }).token).then(
          (found) => found && { user: found.user, credential: { kind: 'token', tokenId: found.tokenId } as const },
        );
    resolve.then(
      (found) => {
        if (!found) return next(refusal());
        socket.data.user = found.user;
        socket.data.credential = found.credential;
        // rooms by credential and person, so that revoking either closes this socket (access-revocation.ts)
        void socket.join([
          userRoom(found.user.id),
          found.credential.kind === 'session'
            ? sessionRoom(found.credential.sessionId)
            : tokenRoom(found.credential.tokenId),
        ]);
        next();
      },
      (error: Error) => next(error),
    );
  });
}
