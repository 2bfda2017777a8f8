import type { Knex } from 'knex';
import type { AlertEvent, AlertState } from '../../contracts/alerts.js';
import type { Db } from '../../db/knex.js';

export interface NewAlertEvent {
  alertId: string;
  at: Date;
  kind: AlertEvent['kind'];
  /** null: the system (rules, sweeps). */
  actorId: string | null;
  fromState: AlertState | null;
  toState: AlertState | null;
  note?: string | null;
  details?: Record<string, unknown>;
}

export async function insertAlertEvent(trx: Knex.Transaction, event: NewAlertEvent): Promise<void> {
  await trx('alert_events').insert({
    alert_id: event.alertId,
    at: event.at,
    kind: event.kind,
    actor_id: event.actorId,
    from_state: event.fromState,
    to_state: event.toState,
    note: event.note ?? null,
    details: JSON.stringify(event.details ?? {}),
  });
}

type Raw = {
  id: string | number;
  at: Date;
  kind: AlertEvent['kind'];
  actor_id: string | null;
  actor_name: string | null;
  actor_email: string | null;
  from_state: AlertState | null;
  to_state: AlertState | null;
  note: string | null;
  details: Record<string, unknown>;
};

/** An alert's timeline, oldest first, with the people by name. */
export async function listAlertEvents(db: Db, alertId: string): Promise<AlertEvent[]> {
  const rows = (await db('alert_events as e')
    .leftJoin('users as u', 'u.id', 'e.actor_id')
    .where('e.alert_id', alertId)
    .orderBy([{ column: 'e.at' }, { column: 'e.id' }])
    .select('e.*', 'u.name as actor_name', 'u.email as actor_email')) as Raw[];
  return rows.map((r) => ({
    id: Number(r.id),
    at: r.at.toISOString(),
    kind: r.kind,
    actor:
      r.actor_id && r.actor_name !== null ? { id: r.actor_id, name: r.actor_name, email: r.actor_email ?? '' } : null,
    fromState: r.from_state,
    toState: r.to_state,
    note: r.note,
    details: r.details ?? {},
  }));
}
