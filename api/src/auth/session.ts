import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type pg from 'pg';
import type { Config } from '../config/config.js';

export const SESSION_COOKIE = 'shadowloop.sid';

/** Browser sessions live in PostgreSQL (table sessions); the cookie is httpOnly and SameSite=Lax. */
export function createSessionMiddleware(config: Config, pool: pg.Pool) {
  const PgStore = connectPgSimple(session);
  return session({
    name: SESSION_COOKIE,
    secret: config.SESSION_SECRET,
    store: new PgStore({ pool, tableName: 'sessions', createTableIfMissing: false, pruneSessionInterval: 15 * 60 }),
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: { httpOnly: true, sameSite: 'lax', secure: config.COOKIE_SECURE, maxAge: 12 * 60 * 60 * 1000 },
  });
}
