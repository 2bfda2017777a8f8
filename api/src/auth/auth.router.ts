import { announceRevocation } from '../realtime/access-revocation.js';
import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { Config } from '../config/config.js';
import type { Db } from '../db/knex.js';
import { AppError } from '../http/errors.js';
import type { CsrfCheck } from '../http/route.js';
import { recordAudit } from '../modules/audit/audit.repository.js';
import type { createPassport } from './passport.js';
import { SESSION_COOKIE } from './session.js';

declare module 'express-session' {
  interface SessionData {
    returnTo?: string;
  }
}

const safeReturnPath = (value: unknown): string | undefined =>
  typeof value === 'string' && /^\/(?!\/)[\w\-./?=&%]*$/.test(value) ? value : undefined;

/** Sign-in through the identity provider, its callback, and sign-out. */
export function createAuthRouter(deps: {
  config: Config;
  db: Db;
  passport: ReturnType<typeof createPassport>;
  csrfValid: CsrfCheck;
}) {
  const { config, db, passport, csrfValid } = deps;
  const router = Router();
  const signInLimit = rateLimit({
    windowMs: 60_000,
    limit: config.SIGN_IN_RATE_LIMIT_PER_MINUTE,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) =>
      next(
        new AppError(429, 'rate_limited', 'Too many sign-in attempts from this address; wait a minute and try again.'),
      ),
  });

  router.get('/auth/login', signInLimit, (req, res, next) => {
    req.session.returnTo = safeReturnPath(req.query.returnTo);
    passport.authenticate('oidc')(req, res, next);
  });

  router.get(
    '/auth/callback',
    signInLimit,
    passport.authenticate('oidc', { failureRedirect: '/signin?error=sign-in-failed', keepSessionInfo: true }),
    (req, res) => {
      const target = req.session.returnTo ?? '/';
      delete req.session.returnTo;
      res.redirect(target);
    },
  );

  router.post('/auth/logout', async (req, res) => {
    const user = req.user;
    if (user && req.authMethod === 'session' && !csrfValid(req)) {
      throw new AppError(403, 'csrf_invalid', 'Missing or invalid CSRF token: send the x-csrf-token header.');
    }
    if (user) await recordAudit(db, { actor: user, action: 'user.signed_out', targetType: 'user', targetId: user.id });
    // the sockets this browser session opened close with it
    if (req.authMethod === 'session') await announceRevocation(db, { sessionId: req.sessionID });
    await new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
    await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
    res.clearCookie(SESSION_COOKIE);
    res.status(204).end();
  });
  return router;
}
