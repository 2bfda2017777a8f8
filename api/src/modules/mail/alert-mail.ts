import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import { AlertDetailSchema, ResidualDirectionSchema, type AlertRuleKind } from '../../contracts/alerts.js';
import { createAckLink } from './ack-link-store.js';
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

type Raw = {
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
};

async function readAlert(trx: Knex.Transaction, alertId: string): Promise<{ alert: AlertForMail; areaId: string }> {
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
    )) as Raw | undefined;
  if (!row) throw new Error(`enqueueAlertMail: there is no alert ${alertId}`);
  const detail = AlertDetailSchema.safeParse(row.detail);
  const direction = ResidualDirectionSchema.safeParse(row.direction);
  const alert: AlertForMail = {
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
  return { alert, areaId: row.area_id };
}

/**
 * Queues the alert's message for everyone who should hear of it (alert-recipients.ts): one
 * mail_outbox row per person with its Message-ID fixed now, and for people with the on-call role a
 * signed one-click acknowledge link. Sends nothing: the outbox sender does, after this transaction
 * commits, so a rolled-back raise never mails anyone. Returns how many messages were queued.
 */
export async function enqueueAlertMail(
  trx: Knex.Transaction,
  alertId: string,
  reason: AlertMailReason,
  options: { config?: AlertMailConfig; now?: Date } = {},
): Promise<number> {
  const config = options.config ?? configured;
  if (!config) throw new Error('enqueueAlertMail: call configureAlertMail({ publicUrl, secret }) at start-up first');
  const publicUrl = config.publicUrl.replace(/\/+$/, '');
  const now = options.now ?? new Date();
  const { alert, areaId } = await readAlert(trx, alertId);
  const audience = await pickRecipients(trx, reason, { id: areaId, name: alert.areaName }, now);
  const key = ackLinkKey(config.secret);
  for (const person of audience.people) {
    const link = person.mayAcknowledge ? await createAckLink(trx, key, alert.id, person.id) : null;
    const message = composeAlertMail({
      reason,
      alert,
      audienceNote: audience.note,
      alertUrl: `${publicUrl}/alerts/${alert.id}`,
      ack: link && { url: `${publicUrl}/a/${link.token}`, expiresAt: link.expiresAt },
      now,
    });
    await trx('mail_outbox').insert({
      alert_id: alert.id,
      reason,
      to_user_id: person.id,
      to_address: person.email,
      subject: message.subject,
      text: message.text,
      message_id: `<${randomUUID()}.alert-${alert.number}@shadowloop>`,
    });
  }
  return audience.people.length;
}
