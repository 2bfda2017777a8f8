import type { Knex } from 'knex';
import type { z } from 'zod';
import type { SignedInUser } from '../../auth/user.js';
import {
  ALERT_STATES,
  type Alert,
  type AlertListQuerySchema,
  type AlertState,
  type AlertWithEvents,
  type CloseCause,
} from '../../contracts/alerts.js';
import type { Db } from '../../db/knex.js';
import { AppError, notFound } from '../../http/errors.js';
import { isUuid } from '../../http/params.js';
import type { TwinPublisher } from '../../realtime/publisher.js';
import { recordAudit } from '../audit/audit.repository.js';
import { readAlertSettings } from '../oncall/alert-settings.js';
import type { LifecycleAction } from './alert-lifecycle.js';
import { listAlertEvents } from './alert-events.repository.js';
import { applyLifecycle } from './alert-store.js';
import { refusalMessage } from './refusal-message.js';
import { findAlert, listAlertRows, lockAlert, type AlertRow } from './alerts.repository.js';

/** An alert that was raised or changed in a transaction; published after commit. */
export interface AlertChange {
  alertId: string;
  type: 'raised' | 'updated';
}

export type AckVia = 'app' | 'mail_link';

const OPEN_STATES = ALERT_STATES.filter((s) => s !== 'closed');

export function listAlerts(db: Db, query: z.infer<typeof AlertListQuerySchema>): Promise<Alert[]> {
  const states = query.state?.flatMap((s): AlertState[] => (s === 'open' ? [...OPEN_STATES] : [s]));
  return listAlertRows(db, { ...query, states, priorities: query.priority });
}

export async function getAlert(db: Db, id: string): Promise<AlertWithEvents> {
  const alert = isUuid(id) ? await findAlert(db, id) : undefined;
  if (!alert) throw notFound(`Alert ${id}`);
  return { ...alert, events: await listAlertEvents(db, id) };
}

interface PersonalChange {
  verb: 'acknowledged' | 'shelved' | 'closed';
  action: (row: AlertRow, now: Date) => LifecycleAction;
  note: string;
  details?: Record<string, unknown>;
}

/**
 * One person's change of one alert, on the transaction given: the row is locked first, so of two
 * people acting at once one gets the change and the other a 409 that says what happened.
 * Event and audit entry are written with the change.
 */
async function changeLocked(trx: Knex.Transaction, actor: SignedInUser, id: string, change: PersonalChange) {
  const row = isUuid(id) ? await lockAlert(trx, id) : undefined;
  if (!row) throw notFound(`Alert ${id}`);
  const result = await applyLifecycle(trx, row, change.action(row, new Date()), {
    note: change.note || null,
    details: change.details,
  });
  if (result.outcome === 'refused')
    throw new AppError(result.status, result.code, await refusalMessage(trx, row, result.reason));
  if (result.outcome === 'unchanged') return;
  const loop = (await trx('loops').where({ id: row.loop_id }).first('tag')) as { tag: string };
  await recordAudit(trx, {
    actor,
    action: `alert.${change.verb}`,
    targetType: 'alert',
    targetId: row.id,
    details: {
      loopId: row.loop_id,
      loopTag: loop.tag,
      number: Number(row.number),
      note: change.note,
      ...change.details,
    },
  });
}

async function changeAlert(db: Db, actor: SignedInUser, id: string, change: PersonalChange): Promise<Alert> {
  await db.transaction((trx) => changeLocked(trx, actor, id, change));
  return (await findAlert(db, id)) as Alert;
}

/**
 * Acknowledges one alert. `db` may be a transaction (the one-click link acknowledges inside its
 * own); the caller publishes the change.
 */
export async function acknowledgeAlert(
  db: Db,
  actor: SignedInUser,
  alertId: string,
  note: string,
  via: AckVia = 'app',
): Promise<Alert> {
  return changeAlert(db, actor, alertId, {
    verb: 'acknowledged',
    action: (_row, now) => ({ type: 'acknowledge', at: now, actor: actor.id }),
    note,
    details: { via },
  });
}

export async function shelveAlert(
  db: Db,
  actor: SignedInUser,
  alertId: string,
  body: { note: string; until: string },
): Promise<Alert> {
  const { shelveMaxHours } = await readAlertSettings(db);
  return changeAlert(db, actor, alertId, {
    verb: 'shelved',
    action: (_row, now) => ({
      type: 'shelve',
      at: now,
      actor: actor.id,
      until: new Date(body.until),
      reason: body.note,
      maxHours: shelveMaxHours,
    }),
    note: body.note,
    details: { until: new Date(body.until).toISOString() },
  });
}

export async function closeAlert(
  db: Db,
  actor: SignedInUser,
  alertId: string,
  body: { cause: CloseCause; note: string },
): Promise<Alert> {
  return changeAlert(db, actor, alertId, {
    verb: 'closed',
    action: (_row, now) => ({ type: 'close', at: now, actor: actor.id, cause: body.cause, note: body.note }),
    note: body.note,
    details: { cause: body.cause },
  });
}

/**
 * Acknowledges several alerts in one transaction; one that cannot be acknowledged is skipped with
 * the reason (its savepoint rolls back) and the others go through. Rows are locked in id order.
 */
export async function acknowledgeAlerts(db: Db, actor: SignedInUser, ids: string[], note: string) {
  // a deadlock with an ingest raising or clearing one of these alerts at the same moment: try again
  for (let attempt = 1; ; attempt++) {
    try {
      return await acknowledgeAlertsOnce(db, actor, ids, note);
    } catch (error) {
      if ((error as { code?: string }).code !== '40P01' || attempt >= 3) throw error;
    }
  }
}

async function acknowledgeAlertsOnce(db: Db, actor: SignedInUser, ids: string[], note: string) {
  const acknowledged: string[] = [];
  const skipped: { id: string; reason: string }[] = [];
  const unique = [...new Set(ids)].sort();
  await db.transaction(async (trx) => {
    // every row locked up front, in one statement and one order
    await trx('alerts').whereIn('id', unique).orderBy('id').forUpdate().select('id');
    for (const id of unique) {
      try {
        await trx.transaction((savepoint) =>
          changeLocked(savepoint, actor, id, {
            verb: 'acknowledged',
            action: (_row, now) => ({ type: 'acknowledge', at: now, actor: actor.id }),
            note,
            details: { via: 'app', bulk: true },
          }),
        );
        acknowledged.push(id);
      } catch (error) {
        if (!(error instanceof AppError)) throw error;
        skipped.push({ id, reason: error.message });
      }
    }
  });
  return { acknowledged, skipped };
}

/** Sends `alert:raised` / `alert:updated` with the full alert, after the change committed. */
export async function publishAlertChanges(db: Db, publisher: TwinPublisher, changes: AlertChange[]): Promise<void> {
  if (!changes.length) return;
  const ids = [...new Set(changes.map((c) => c.alertId))];
  const alerts = new Map((await listAlertRows(db, { ids, limit: ids.length })).map((a) => [a.id, a]));
  for (const change of changes) {
    const alert = alerts.get(change.alertId);
    if (!alert) continue;
    if (change.type === 'raised') publisher.alertRaised(alert);
    else publisher.alertUpdated(alert);
  }
}

const EXPIRY_BATCH = 500;

/**
 * Ends the shelving of every alert whose shelf time is over: back to unacknowledged (with a mail)
 * while the condition is present, else returned_unacknowledged. Rows are claimed with SKIP LOCKED,
 * so several api processes sweeping at once never expire one alert twice. Returns how many ended.
 */
export async function expireShelves(db: Db, publisher: TwinPublisher, now: Date = new Date()): Promise<number> {
  const changes = await db.transaction(async (trx) => {
    const due = (await trx('alerts')
      .where('state', 'shelved')
      .where('shelved_until', '<=', now)
      .orderBy('shelved_until')
      .limit(EXPIRY_BATCH)
      .forUpdate()
      .skipLocked()) as AlertRow[];
    const done: AlertChange[] = [];
    for (const row of due) {
      const result = await applyLifecycle(
        trx,
        row,
        { type: 'expire_shelve', at: now },
        { details: { shelvedUntil: row.shelved_until?.toISOString() ?? null } },
      );
      if (result.outcome === 'changed') done.push({ alertId: row.id, type: 'updated' });
    }
    return done;
  });
  await publishAlertChanges(db, publisher, changes);
  return changes.length;
}
