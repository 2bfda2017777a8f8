import { Router, type Response } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { Config } from '../../config/config.js';
import type { Db } from '../../db/knex.js';
import { AppError } from '../../http/errors.js';
import type { TwinPublisher } from '../../realtime/publisher.js';
import { publishAlertChanges } from '../alerts/alerts.service.js';
import { consumeAckLink, verifyAckToken } from './ack-links.js';
import { ackLinkKey } from './ack-token.js';

const TOKEN_SHAPE = /^[A-Za-z0-9_-]{1,200}\.[A-Za-z0-9_-]{1,100}$/;

/** Where the web app shows the outcome: ?ack=done|used|expired|forbidden|someone_else|already|invalid. */
function land(res: Response, alertId: string | null, outcome: string): void {
  res.set('Cache-Control', 'no-store');
  res.redirect(302, alertId ? `/alerts/${alertId}?ack=${outcome}` : `/alerts?ack=${outcome}`);
}

/**
 * GET /a/:token, the one-click acknowledge link of alert e-mails: without a session it sends the
 * person to sign in and back; with the on-call role it acknowledges the alert once and lands on
 * the alert's page with the outcome, for the person it was mailed to only. The token is the
 * protection a GET with an effect needs (signed, single use, short-lived, bound to its addressee);
 * mail scanners that open links have no session and change nothing.
 */
export function createAckLinkRouter(deps: { db: Db; config: Config; publisher: TwinPublisher }): Router {
  const { db, publisher } = deps;
  const key = ackLinkKey(deps.config.SESSION_SECRET);
  const router = Router();
  const limit = rateLimit({
    windowMs: 60_000,
    limit: 60,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) =>
      next(new AppError(429, 'rate_limited', 'Too many acknowledge links opened from this address; wait a minute.')),
  });

  router.get('/a/:token', limit, async (req, res) => {
    const token = String(req.params.token);
    if (!TOKEN_SHAPE.test(token)) return land(res, null, 'invalid');
    if (!req.user) {
      res.set('Cache-Control', 'no-store');
      return res.redirect(302, `/auth/login?returnTo=${encodeURIComponent(`/a/${token}`)}`);
    }
    const check = await verifyAckToken(db, key, token);
    if (check.status === 'invalid') return land(res, null, 'invalid');
    if (check.status !== 'valid') return land(res, check.alertId, check.status);
    if (!req.user.roles.includes('oncall')) return land(res, check.alertId, 'forbidden');
    // a link acts only for the person it was mailed to: a forwarded or planted link changes nothing
    if (check.addresseeId && check.addresseeId !== req.user.id) return land(res, check.alertId, 'someone_else');
    const result = await consumeAckLink(db, key, token, req.user);
    if (result.outcome === 'invalid') return land(res, null, 'invalid');
    if (result.outcome === 'done')
      await publishAlertChanges(db, publisher, [{ alertId: result.alertId, type: 'updated' }]);
    land(res, result.alertId, result.outcome);
  });
  return router;
}
