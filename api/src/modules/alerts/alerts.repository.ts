import type { Knex } from 'knex';
import type {
  Alert,
  AlertDetail,
  AlertRuleKind,
  AlertState,
  CloseCause,
  Person,
  Priority,
  ResidualDirection,
} from '../../contracts/alerts.js';
import type { Db } from '../../db/knex.js';
import type { LifecycleAlert } from './alert-lifecycle.js';

/** A row of alerts, as stored. */
export interface AlertRow {
  id: string;
  number: string | number;
  loop_id: string;
  area_id: string;
  rule_id: string | null;
  rule_kind: AlertRuleKind;
  rule_version: number | null;
  version_id: string | null;
  priority: Priority;
  state: AlertState;
  active: boolean;
  raised_at: Date;
  active_since: Date;
  cleared_at: Date | null;
  activations: number;
  acknowledged_at: Date | null;
  acknowledged_by: string | null;
  shelved_until: Date | null;
  shelved_by: string | null;
  shelve_reason: string | null;
  closed_at: Date | null;
  closed_by: string | null;
  close_cause: CloseCause | null;
  close_note: string | null;
  summary: string;
  detail: AlertDetail;
  direction: ResidualDirection | null;
  escalation_level: number;
  updated_at: Date;
}

type JoinedRow = AlertRow & {
  loop_tag: string;
  loop_name: string;
  ack_name: string | null;
  ack_email: string | null;
  closer_name: string | null;
  closer_email: string | null;
};

export interface AlertFilter {
  states?: AlertState[];
  area?: string;
  loopId?: string;
  priorities?: number[];
  from?: string;
  to?: string;
  limit: number;
  ids?: string[];
  order?: 'newest' | 'urgent';
}

/** The queue's urgency rank of an alert row (see AlertListQuerySchema.order). */
const URGENCY_RANK = `CASE
  WHEN a.state = 'unacknowledged' THEN 0
  WHEN a.state = 'returned_unacknowledged' THEN 1
  WHEN a.state = 'acknowledged' AND a.active THEN 2
  WHEN a.state = 'shelved' THEN 3
  WHEN a.state = 'acknowledged' THEN 4
  ELSE 5 END`;

export function selectAlerts(db: Db): Knex.QueryBuilder {
  return db('alerts as a')
    .join('loops as l', 'l.id', 'a.loop_id')
    .leftJoin('users as ack', 'ack.id', 'a.acknowledged_by')
    .leftJoin('users as closer', 'closer.id', 'a.closed_by')
    .select(
      'a.*',
      'l.tag as loop_tag',
      'l.name as loop_name',
      'ack.name as ack_name',
      'ack.email as ack_email',
      'closer.name as closer_name',
      'closer.email as closer_email',
    );
}

const person = (id: string | null, name: string | null, email: string | null): Person | null =>
  id && name !== null && email !== null ? { id, name, email } : null;
const iso = (d: Date | null) => (d ? d.toISOString() : null);

export function toAlert(r: JoinedRow): Alert {
  return {
    id: r.id,
    number: Number(r.number),
    loopId: r.loop_id,
    loopTag: r.loop_tag,
    loopName: r.loop_name,
    area: r.area_id,
    rule: r.rule_kind,
    ruleId: r.rule_id,
    ruleVersion: r.rule_version,
    priority: r.priority,
    state: r.state,
    active: r.active,
    raisedAt: r.raised_at.toISOString(),
    activeSince: r.active_since.toISOString(),
    clearedAt: iso(r.cleared_at),
    activations: r.activations,
    acknowledgedAt: iso(r.acknowledged_at),
    acknowledgedBy: person(r.acknowledged_by, r.ack_name, r.ack_email),
    shelvedUntil: iso(r.shelved_until),
    shelveReason: r.shelve_reason,
    closedAt: iso(r.closed_at),
    closedBy: person(r.closed_by, r.closer_name, r.closer_email),
    closeCause: r.close_cause,
    closeNote: r.close_note,
    summary: r.summary,
    detail: r.detail,
    direction: r.direction,
    escalationLevel: r.escalation_level,
    updatedAt: r.updated_at.toISOString(),
  };
}

/** Newest first, or most urgent first; `states` already expanded (open → the four open states). */
export async function listAlertRows(db: Db, filter: AlertFilter): Promise<Alert[]> {
  const rows = (await selectAlerts(db)
    .modify((q) => {
      if (filter.states) q.whereIn('a.state', filter.states);
      if (filter.area) q.where('a.area_id', filter.area);
      if (filter.loopId) q.where('a.loop_id', filter.loopId);
      if (filter.priorities) q.whereIn('a.priority', filter.priorities);
      if (filter.from) q.where('a.raised_at', '>=', filter.from);
      if (filter.to) q.where('a.raised_at', '<', filter.to);
      if (filter.ids) q.whereIn('a.id', filter.ids);
    })
    .modify((q) => {
      if (filter.order === 'urgent') q.orderByRaw(`${URGENCY_RANK}, a.priority, a.active_since DESC, a.number DESC`);
      else
        q.orderBy([
          { column: 'a.raised_at', order: 'desc' },
          { column: 'a.number', order: 'desc' },
        ]);
    })
    .limit(filter.limit)) as JoinedRow[];
  return rows.map(toAlert);
}

export async function findAlert(db: Db, id: string): Promise<Alert | undefined> {
  const row = (await selectAlerts(db).where('a.id', id).first()) as JoinedRow | undefined;
  return row && toAlert(row);
}

/** The alert row, locked until the transaction ends: concurrent changes of one alert queue here. */
export async function lockAlert(trx: Knex.Transaction, id: string): Promise<AlertRow | undefined> {
  return trx<AlertRow>('alerts').where({ id }).forUpdate().first();
}

/** The open alert of a loop's rule, locked (at most one: alerts_one_open_per_rule). */
export async function lockOpenAlert(
  trx: Knex.Transaction,
  loopId: string,
  ruleKind: AlertRuleKind,
): Promise<AlertRow | undefined> {
  return trx<AlertRow>('alerts')
    .where({ loop_id: loopId, rule_kind: ruleKind })
    .whereNot('state', 'closed')
    .forUpdate()
    .first();
}

export const lifecycleOf = (r: AlertRow): LifecycleAlert => ({
  state: r.state,
  active: r.active,
  activations: r.activations,
  clearedAt: r.cleared_at,
  acknowledgedAt: r.acknowledged_at,
  acknowledgedBy: r.acknowledged_by,
  shelvedUntil: r.shelved_until,
  shelvedBy: r.shelved_by,
  shelveReason: r.shelve_reason,
  closedAt: r.closed_at,
  closedBy: r.closed_by,
  closeCause: r.close_cause,
  closeNote: r.close_note,
});

export const lifecycleColumns = (a: LifecycleAlert) => ({
  state: a.state,
  active: a.active,
  activations: a.activations,
  cleared_at: a.clearedAt,
  acknowledged_at: a.acknowledgedAt,
  acknowledged_by: a.acknowledgedBy,
  shelved_until: a.shelvedUntil,
  shelved_by: a.shelvedBy,
  shelve_reason: a.shelveReason,
  closed_at: a.closedAt,
  closed_by: a.closedBy,
  close_cause: a.closeCause,
  close_note: a.closeNote,
});

export async function updateAlertRow(
  trx: Knex.Transaction,
  id: string,
  columns: Partial<Record<keyof AlertRow, unknown>>,
): Promise<void> {
  await trx('alerts')
    .where({ id })
    .update({ ...columns, updated_at: trx.fn.now() });
}
