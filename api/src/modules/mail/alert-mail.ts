import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import { AlertDetailSchema, ResidualDirectionSchema, type AlertRuleKind } from '../../contracts/alerts.js';
import { ackLinkRows } from './ack-link-store.js';
import { ackLinkKey } from './ack-token.js';
import { composeAlertMail, type AlertForMail, type AlertMailReason } from './alert-mail-text.js';
import { pickRecipients } from './alert-recipients.js';

export type { AlertMailReason } from './alert-mail-text.js';

/** Where links point and what signs them: PUBLIC_URL and SESSION_SECRET of the api's config. */
export interface AlertMailConfig {
  publicUrl: string;
  secret: string;
}

let configured: AlertMailConfig | null = null;

/**
 * Set once at start-up (createApp): mail is queued deep inside other modules' transactions (the
 * ingest's rule evaluation, shelve expiry, escalation), which have no config at hand.
 */
export function configureAlertMail(config: AlertMailConfig): void {
  configured = { publicUrl: config.publicUrl.replace(/\/+$/, ''), secret: config.secret };
}

/**
 * What a message says of its alert, as one row (alerts, loops, areas) with the expiry its ack links
 * get: alert_settings.ack_link_ttl_min from the transaction's start on the database clock, in whole
 * milliseconds so that a token's copy matches its row exactly. The raise reads it with its insert.
 */
export type AlertMailRow = {
  id: string;
  number: string;
  area_id: string;
  area_name: string;
  tag: string;
  name: string;
  time_zone: string;
  rule_kind: AlertRuleKind;
  rule_version: number | null;
  priority: number;
  raised_at: Date;
  activations: number;
  summary: string;
  detail: unknown;
  direction: unknown;
  ack_expires_at: Date;
};

/** The ack links' expiry as a select column (now() is the transaction's start, the same in every statement). */
export const ACK_EXPIRES_AT_SQL = `date_trunc('milliseconds', now() + make_interval(mins => (SELECT ack_link_ttl_min FROM alert_settings WHERE id = 1)))`;

async function readAlert(trx: Knex.Transaction, alertId: string): Promise<AlertMailRow> {
  const row = (await trx('alerts as a')
    .join('loops as l', 'l.id', 'a.loop_id')
    .join('areas as ar', 'ar.id', 'a.area_id')
    .where('a.id', alertId)
    .first(
      'a.id',
      'a.number',
      'a.area_id',
      'ar.name as area_name',
      'l.tag',
      'l.name',
      'l.time_zone',
      'a.rule_kind',
      'a.rule_version',
      'a.priority',
      'a.activations',
      'a.summary',
      'a.detail',
      'a.direction',
      trx.raw(`greatest(a.raised_at, (SELECT max(e.at) FROM alert_events e
        WHERE e.alert_id = a.id AND e.kind IN ('raised', 'reactivated'))) AS raised_at`),
      trx.raw(`${ACK_EXPIRES_AT_SQL} AS ack_expires_at`),
    )) as AlertMailRow | undefined;
  if (!row) throw new Error(`enqueueAlertMail: there is no alert ${alertId}`);
  return row;
}

function alertForMail(row: AlertMailRow): AlertForMail {
  const detail = AlertDetailSchema.safeParse(row.detail);
  const direction = ResidualDirectionSchema.safeParse(row.direction);
  return {
    id: row.id,
    number: Number(row.number),
    loopTag: row.tag,
    loopName: row.name,
    areaName: row.area_name,
    timeZone: row.time_zone,
    ruleKind: row.rule_kind,
    ruleVersion: row.rule_version,
    priority: row.priority,
    raisedAt: row.raised_at,
    activations: row.activations,
    summary: row.summary,
    detail: detail.success ? detail.data : {},
    hint: direction.success ? direction.data.hint : null,
  };
}

/**
 * Queues the alert's message for everyone who should hear of it (alert-recipients.ts): one
 * mail_outbox row per person with its Message-ID fixed now, and for people with the on-call role a
 * signed one-click acknowledge link. Sends nothing: the outbox sender does, after this transaction
 * commits, so a rolled-back raise never mails anyone. `options.row`: the alert as the caller just
 * read it in this transaction (the raise does), else it is read here. The links and the messages go
 * in as one statement. Returns how many messages were queued.
 */
export async function enqueueAlertMail(
  trx: Knex.Transaction,
  alertId: string,
  reason: AlertMailReason,
  options: { config?: AlertMailConfig; now?: Date; row?: AlertMailRow } = {},
): Promise<number> {
  const config = options.config ?? configured;
  if (!config) throw new Error('enqueueAlertMail: call configureAlertMail({ publicUrl, secret }) at start-up first');
  const publicUrl = config.publicUrl.replace(/\/+$/, '');
  const now = options.now ?? new Date();
  const row = options.row ?? (await readAlert(trx, alertId));
  const alert = alertForMail(row);
  const audience = await pickRecipients(trx, reason, { id: row.area_id, name: alert.areaName }, now);
  if (!audience.people.length) return 0;
  const links = ackLinkRows(
    ackLinkKey(config.secret),
    alert.id,
    audience.people.filter((p) => p.mayAcknowledge).map((p) => p.id),
    row.ack_expires_at,
  );
  const outbox = audience.people.map((person) => {
    const link = links.get(person.id);
    const message = composeAlertMail({
      reason,
      alert,
      audienceNote: audience.note,
      alertUrl: `${publicUrl}/alerts/${alert.id}`,
      ack: link ? { url: `${publicUrl}/a/${link.token}`, expiresAt: link.row.expires_at } : null,
      now,
    });
    return {
      alert_id: alert.id,
      reason,
      to_user_id: person.id,
      to_address: person.email,
      subject: message.subject,
      text: message.text,
      message_id: `<${randomUUID()}.alert-${alert.number}@shadowloop>`,
    };
  });
  const messages = trx('mail_outbox').insert(outbox).toSQL();
  if (!links.size) await trx.raw(messages.sql, messages.bindings);
  else {
    const rows = trx('alert_ack_links')
      .insert([...links.values()].map((l) => l.row))
      .toSQL();
    await trx.raw(`WITH links AS (${rows.sql}) ${messages.sql}`, [...rows.bindings, ...messages.bindings]);
  }
  return audience.people.length;
}
