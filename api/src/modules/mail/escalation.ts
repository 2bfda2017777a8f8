import type { Knex } from 'knex';
import type { Db } from '../../db/knex.js';
import type { AlertChange } from '../alerts/alerts.service.js';
import { findOnCall } from '../oncall/oncall-lookup.js';
import { enqueueAlertMail } from './alert-mail.js';

/**
 * Unacknowledged alerts with how long they have waited in this round and the level reached in it.
 * A round starts when people were called: the raise, a re-raise after an acknowledgement, the end
 * of a shelve. A re-raise of an alert nobody acknowledged does not restart the clock (else a
 * chattering alert would never escalate), and a level reached in an earlier round does not count.
 */
const WAITING = `
  WITH w AS (
    SELECT a.id, a.area_id, a.escalation_level, greatest(a.raised_at, (
      SELECT max(e.at) FROM alert_events e WHERE e.alert_id = a.id
        AND ((e.kind = 'reactivated' AND e.from_state = 'acknowledged')
          OR (e.kind = 'unshelved' AND e.to_state = 'unacknowledged')))) AS since
    FROM alerts a WHERE a.state = 'unacknowledged' AND (?::uuid[] IS NULL OR a.id = ANY(?::uuid[])))
  SELECT w.id, w.area_id, w.since, CASE WHEN EXISTS (SELECT 1 FROM alert_events e
    WHERE e.alert_id = w.id AND e.kind = 'escalated' AND e.at >= w.since) THEN w.escalation_level ELSE 0 END AS level
  FROM w`;

type Settings = { secondary_after_min: number; area_after_min: number };
type Waiting = { id: string; area_id: string; since: Date; level: number };
type Step = { level: 1 | 2; reason: 'escalated_secondary' | 'escalated_area'; note: string; skipped: boolean };

/** Every unacknowledged alert, or those of ids. */
async function waiting(db: Db, ids: string[] | null): Promise<Waiting[]> {
  // A PostgreSQL array literal: knex would spread a JavaScript array into a list of parameters.
  const scope = ids && `{${ids.join(',')}}`;
  return ((await db.raw(WAITING, [scope, scope])) as { rows: Waiting[] }).rows;
}

const minutesBetween = (from: Date, to: Date) => (to.getTime() - from.getTime()) / 60_000;

async function nextStep(trx: Knex.Transaction, alert: Waiting, settings: Settings, now: Date): Promise<Step | null> {
  const waited = minutesBetween(alert.since, now);
  const areaDue = waited >= settings.area_after_min;
  if (alert.level >= 2) return null;
  if (alert.level === 1)
    return areaDue
      ? { level: 2, reason: 'escalated_area', note: "Escalated to the area's engineers.", skipped: false }
      : null;
  if (waited < settings.secondary_after_min) return null;
  const { secondary } = await findOnCall(trx, alert.area_id, now);
  if (secondary)
    return {
      level: 1,
      reason: 'escalated_secondary',
      note: `Escalated to ${secondary.name}, secondary on call.`,
      skipped: false,
    };
  if (!areaDue) return null;
  const note = "Nobody was secondary on call, so it went straight to the area's engineers.";
  return { level: 2, reason: 'escalated_area', note, skipped: true };
}

async function escalateOne(db: Db, id: string, settings: Settings, now: Date): Promise<AlertChange | null> {
  return db.transaction(async (trx) => {
    const locked = await trx('alerts').where({ id, state: 'unacknowledged' }).forUpdate().skipLocked().first('id');
    if (!locked) return null;
    const [alert] = await waiting(trx, [id]);
    const step = alert ? await nextStep(trx, alert, settings, now) : null;
    if (!step) return null;
    await trx('alerts').where({ id }).update({ escalation_level: step.level, updated_at: now });
    const messages = await enqueueAlertMail(trx, id, step.reason, { now });
    await trx('alert_events').insert({
      alert_id: id,
      at: now,
      kind: 'escalated',
      from_state: 'unacknowledged',
      to_state: 'unacknowledged',
      note: step.note,
      details: JSON.stringify({ level: step.level, to: step.reason, skippedSecondary: step.skipped, messages }),
    });
    return { alertId: id, type: 'updated' as const };
  });
}

/**
 * Unacknowledged alerts that waited too long: after alert_settings.secondary_after_min the
 * secondary on call hears of it (level 1), after area_after_min the area's engineers (level 2).
 * With nobody secondary on call the first step waits for the area step's time. One transaction
 * per alert, its row locked (one another process holds is skipped and taken at the next sweep).
 * Publish the returned changes with publishAlertChanges.
 */
export async function escalateDueAlerts(db: Db, now: Date = new Date()): Promise<AlertChange[]> {
  const settings = (await db('alert_settings').where({ id: 1 }).first('secondary_after_min', 'area_after_min')) as
    Settings | undefined;
  if (!settings) throw new Error('escalateDueAlerts: the alert_settings row is missing (see the alerts migration)');
  const due = (await waiting(db, null)).filter(
    (a) =>
      a.level < 2 &&
      minutesBetween(a.since, now) >= (a.level === 0 ? settings.secondary_after_min : settings.area_after_min),
  );
  const changes: AlertChange[] = [];
  for (const alert of due) {
    const change = await escalateOne(db, alert.id, settings, now);
    if (change) changes.push(change);
  }
  return changes;
}
