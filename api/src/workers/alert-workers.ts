import type { Logger } from 'pino';
import type { Config } from '../config/config.js';
import type { Db } from '../db/knex.js';
import { expireShelves, publishAlertChanges } from '../modules/alerts/alerts.service.js';
import { escalateDueAlerts } from '../modules/mail/escalation.js';
import { startMailSender } from '../modules/mail/outbox-sender.js';
import { sweepStaleLoops } from '../modules/readings/stale-sweep.js';
import type { TwinPublisher } from '../realtime/publisher.js';

export interface AlertWorkers {
  /** One pass of the sweep (stale rules, shelve expiry, escalation); tests call it directly. */
  sweepOnce(): Promise<void>;
  stop(): Promise<void>;
}

/**
 * The api's background work for alerts: the mail outbox sender and a sweep every
 * ALERT_SWEEP_INTERVAL_MS that raises stale rules, ends expired shelving and escalates alerts left
 * unacknowledged. Every api process may run them: each step claims its rows with row locks, so
 * nothing happens twice.
 */
export function startAlertWorkers(deps: {
  db: Db;
  config: Config;
  logger: Logger;
  publisher: TwinPublisher;
}): AlertWorkers {
  const { db, config, logger, publisher } = deps;
  const sender = startMailSender({ db, config, logger });
  let running: Promise<void> | null = null;
  let stopped = false;

  const sweepOnce = async () => {
    const now = new Date();
    const stale = await sweepStaleLoops(db, now);
    await publishAlertChanges(db, publisher, stale);
    await expireShelves(db, publisher, now);
    const escalated = await escalateDueAlerts(db, now);
    await publishAlertChanges(db, publisher, escalated);
  };
  const tick = () => {
    if (stopped || running) return;
    running = sweepOnce()
      .catch((error: unknown) => logger.error({ err: error }, 'alert sweep failed; retrying at the next interval'))
      .finally(() => {
        running = null;
      });
  };
  const timer = setInterval(tick, config.ALERT_SWEEP_INTERVAL_MS);
  timer.unref();
  return {
    sweepOnce,
    stop: async () => {
      stopped = true;
      clearInterval(timer);
      await running;
      await sender.stop();
    },
  };
}
