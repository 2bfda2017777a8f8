import nodemailer, { type Transporter } from 'nodemailer';
import type { Logger } from 'pino';
import type { Config } from '../../config/config.js';
import type { Db } from '../../db/knex.js';

/**
 * Drains mail_outbox to the SMTP relay.
 *
 * Delivery guarantee: at least once, and once in practice. Each message is claimed with
 * FOR UPDATE SKIP LOCKED in its own transaction, sent, and marked sent in that same transaction,
 * so any number of api processes can run a sender without two of them sending one row. A crash
 * (or a lost database connection) after the relay accepted the message but before the commit
 * leaves the row unsent, and it is sent again: with the same Message-ID, fixed when queued, so the
 * receiver can drop the repeat (the local capture does, ops/mail/server.ts). A refused or failed
 * send is retried after MAIL_RETRY_BASE_MS·2^(attempts−1), at most MAIL_RETRY_MAX_MS, for as long
 * as it takes: an outage delays mail and loses none. The error of the last try stays in last_error.
 */
export interface MailSender {
  /** Stops polling and waits for a send in progress to finish and be recorded. */
  stop(): Promise<void>;
  /** Sends every message due now; resolves with how many were sent (0 once stopped). */
  drainOnce(): Promise<number>;
}

/** Most messages one drain sends before it yields to the next poll. */
const DRAIN_LIMIT = 200;

export function retryDelayMs(attempts: number, baseMs: number, maxMs: number): number {
  return Math.min(baseMs * 2 ** Math.max(0, attempts - 1), maxMs);
}

type OutboxRow = {
  id: string;
  alert_id: string | null;
  reason: string;
  to_address: string;
  subject: string;
  text: string;
  message_id: string;
  attempts: number;
};

type Attempt = { result: 'sent' | 'failed'; row: OutboxRow; error?: string } | { result: 'none' };

async function recordSent(trx: Db, row: OutboxRow): Promise<void> {
  await trx('mail_outbox')
    .where({ id: row.id })
    .update({ attempts: row.attempts + 1, sent_at: trx.raw('clock_timestamp()'), last_error: null });
  if (!row.alert_id) return;
  await trx('alert_events').insert({
    alert_id: row.alert_id,
    kind: 'notified',
    at: trx.raw('clock_timestamp()'),
    details: JSON.stringify({ to: row.to_address, reason: row.reason, messageId: row.message_id }),
  });
  await trx('alerts')
    .where({ id: row.alert_id })
    .update({ notified_at: trx.raw('coalesce(notified_at, clock_timestamp())') });
}

async function attemptOne(db: Db, transport: Transporter, config: Config): Promise<Attempt> {
  return db.transaction(async (trx): Promise<Attempt> => {
    const row = (await trx('mail_outbox')
      .whereNull('sent_at')
      .andWhere('next_attempt_at', '<=', trx.fn.now())
      .orderBy([{ column: 'next_attempt_at' }, { column: 'id' }])
      .forUpdate()
      .skipLocked()
      .first('id', 'alert_id', 'reason', 'to_address', 'subject', 'text', 'message_id', 'attempts')) as
      OutboxRow | undefined;
    if (!row) return { result: 'none' };
    try {
      await transport.sendMail({
        from: config.MAIL_FROM,
        to: row.to_address,
        subject: row.subject,
        text: row.text,
        messageId: row.message_id,
      });
    } catch (failure) {
      const error = failure instanceof Error ? failure.message : String(failure);
      const attempts = row.attempts + 1;
      const delayS = retryDelayMs(attempts, config.MAIL_RETRY_BASE_MS, config.MAIL_RETRY_MAX_MS) / 1000;
      await trx('mail_outbox')
        .where({ id: row.id })
        .update({
          attempts,
          last_error: error.slice(0, 2000),
          next_attempt_at: trx.raw('clock_timestamp() + make_interval(secs => ?)', [delayS]),
        });
      return { result: 'failed', row, error };
    }
    await recordSent(trx, row);
    return { result: 'sent', row };
  });
}

/** Starts polling every MAIL_POLL_INTERVAL_MS (first drain at once). */
export function startMailSender(deps: { db: Db; config: Config; logger: Logger }): MailSender {
  const { db, config, logger } = deps;
  const transport = nodemailer.createTransport({
    host: config.SMTP_HOST,
    port: config.SMTP_PORT,
    secure: false,
    ignoreTLS: true,
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 30_000,
  });
  let stopped = false;
  let timer: NodeJS.Timeout | undefined;
  const inFlight = new Set<Promise<number>>();

  async function drain(): Promise<number> {
    let sent = 0;
    for (let i = 0; i < DRAIN_LIMIT && !stopped; i++) {
      const attempt = await attemptOne(db, transport, config);
      if (attempt.result === 'none') break;
      if (attempt.result === 'sent') sent++;
      else
        logger.warn(
          {
            outboxId: attempt.row.id,
            to: attempt.row.to_address,
            attempts: attempt.row.attempts + 1,
            err: attempt.error,
          },
          'alert mail not sent; will retry',
        );
    }
    return sent;
  }

  function drainOnce(): Promise<number> {
    const run = drain().finally(() => inFlight.delete(run));
    inFlight.add(run);
    return run;
  }

  async function poll(): Promise<void> {
    try {
      const sent = await drainOnce();
      if (sent) logger.info({ sent }, 'alert mail sent');
    } catch (error) {
      logger.error({ err: error }, 'mail outbox drain failed; trying again at the next poll');
    }
    if (!stopped) timer = setTimeout(() => void poll(), config.MAIL_POLL_INTERVAL_MS).unref();
  }
  timer = setTimeout(() => void poll(), 0).unref();

  return {
    drainOnce,
    stop: async () => {
      stopped = true;
      clearTimeout(timer);
      await Promise.allSettled([...inFlight]);
      transport.close();
    },
  };
}
