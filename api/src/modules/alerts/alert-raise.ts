import type { Knex } from 'knex';
import type { AlertDetail, AlertRuleKind, Priority, ResidualDirection } from '../../contracts/alerts.js';
import { enqueueAlertMail, type AlertMailRow } from '../mail/alert-mail.js';
import { residualWindowSql, type ResidualWindow } from './alert-context.js';
import { raise } from './alert-lifecycle.js';
import { applyLifecycle } from './alert-store.js';
import { lifecycleColumns, lockOpenAlert, type AlertRow } from './alerts.repository.js';
import type { AlertChange } from './alerts.service.js';

/** Everything a raise writes about its condition. */
export interface RaiseSpec {
  loopId: string;
  area: string;
  maintenance: boolean;
  ruleKind: AlertRuleKind;
  ruleId: string | null;
  ruleVersion: number | null;
  priority: Priority;
  versionId: string | null;
  summary: string;
  detail: AlertDetail;
  /** The residuals the direction looks at (read with the open-alert check); null: no direction. */
  residualWindow: ResidualWindow | null;
  /** From those residuals (oldest first); used only when an alert is written (not for a suppressed raise). */
  direction: (residuals: number[][]) => ResidualDirection | null;
}

const OPEN_PER_RULE = "(loop_id, rule_kind) WHERE state <> 'closed'";

/** The open alert of the rule (locked) and, when the spec asks for it, the residual window. */
async function lockOpen(
  trx: Knex.Transaction,
  spec: RaiseSpec,
): Promise<{ open: AlertRow | undefined; residuals: number[][] }> {
  if (!spec.residualWindow) return { open: await lockOpenAlert(trx, spec.loopId, spec.ruleKind), residuals: [] };
  // one round trip: the locking select of lockOpenAlert and the residuals, side by side
  const { rows } = (await trx.raw(
    `WITH open AS (
      SELECT * FROM alerts WHERE loop_id = ? AND rule_kind = ? AND NOT state = 'closed' LIMIT 1 FOR UPDATE
    )
    SELECT o.*, (?) AS recent_residuals FROM (SELECT 1) one LEFT JOIN open o ON true`,
    [spec.loopId, spec.ruleKind, residualWindowSql(trx, spec.loopId, spec.residualWindow)],
  )) as { rows: (AlertRow & { recent_residuals: number[][] | null })[] };
  const { recent_residuals: residuals, ...row } = rows[0];
  return { open: row.id ? (row as AlertRow) : undefined, residuals: residuals ?? [] };
}

const directionOf = (spec: RaiseSpec, residuals: number[][]) =>
  spec.residualWindow ? spec.direction(residuals) : null;

/**
 * The new alert, its first event and what its e-mail says of it (alerts, loops, areas; the ack
 * links' expiry on the database clock), in one statement; no row when another transaction holds
 * the rule's open alert (alerts_one_open_per_rule).
 */
async function insertAlert(
  trx: Knex.Transaction,
  spec: RaiseSpec,
  first: ReturnType<typeof raise>,
  direction: ResidualDirection | null,
  now: Date,
): Promise<AlertMailRow | undefined> {
  const insert = trx('alerts')
    .insert({
      ...lifecycleColumns(first.next),
      loop_id: spec.loopId,
      area_id: spec.area,
      rule_id: spec.ruleId,
      rule_kind: spec.ruleKind,
      rule_version: spec.ruleVersion,
      version_id: spec.versionId,
      priority: spec.priority,
      raised_at: now,
      active_since: now,
      summary: spec.summary,
      detail: JSON.stringify(spec.detail),
      direction: direction ? JSON.stringify(direction) : null,
    })
    .onConflict(trx.raw(OPEN_PER_RULE))
    .ignore()
    .returning('*');
  const { rows } = (await trx.raw(
    `WITH a AS (?), e AS (
      INSERT INTO alert_events (alert_id, at, kind, actor_id, from_state, to_state, note, details)
      SELECT a.id, ?, ?, NULL, NULL, ?, NULL, ? FROM a
    )
    SELECT a.id, a.number, a.area_id, ar.name AS area_name, l.tag, l.name, l.time_zone, a.rule_kind,
      a.rule_version, a.priority, a.activations, a.summary, a.detail, a.direction, a.raised_at,
      date_trunc('milliseconds', now() + make_interval(mins => (SELECT ack_link_ttl_min FROM alert_settings WHERE id = 1))) AS ack_expires_at
    FROM a JOIN loops l ON l.id = a.loop_id JOIN areas ar ON ar.id = a.area_id`,
    [
      insert,
      now,
      first.event,
      first.next.state,
      JSON.stringify({ slotAt: spec.detail.slotAt ?? null, ruleVersion: spec.ruleVersion, versionId: spec.versionId }),
    ],
  )) as { rows: AlertMailRow[] };
  return rows[0];
}

/**
 * A rule (or the model check) raised on a loop: in maintenance the raise is only recorded; an open
 * alert of the same rule is raised again (one open alert per loop and rule, alerts_one_open_per_rule);
 * else a new alert with its first event and its e-mail. Returns the change to publish, if any.
 */
export async function raiseAlert(trx: Knex.Transaction, spec: RaiseSpec, now: Date): Promise<AlertChange | null> {
  if (spec.maintenance) {
    await trx('alert_suppressions').insert({
      loop_id: spec.loopId,
      rule_kind: spec.ruleKind,
      at: now,
      summary: spec.summary,
      detail: JSON.stringify(spec.detail),
    });
    return null;
  }
  const { open, residuals } = await lockOpen(trx, spec);
  if (open) return reraiseOpen(trx, spec, open, residuals, now);
  const first = raise();
  const inserted = await insertAlert(trx, spec, first, directionOf(spec, residuals), now);
  // another transaction opened the alert first: ours is a raise of that one
  if (!inserted) {
    const other = await lockOpen(trx, spec);
    return other.open ? reraiseOpen(trx, spec, other.open, other.residuals, now) : null;
  }
  await enqueueAlertMail(trx, inserted.id, first.mail, { row: inserted });
  return { alertId: inserted.id, type: 'raised' };
}

/** The rule's open alert raised again; null when that changed nothing. */
async function reraiseOpen(
  trx: Knex.Transaction,
  spec: RaiseSpec,
  open: AlertRow,
  residuals: number[][],
  now: Date,
): Promise<AlertChange | null> {
  if (open.active || open.state === 'closed') return null;
  const direction = directionOf(spec, residuals);
  const result = await applyLifecycle(
    trx,
    open,
    { type: 'reraise', at: now },
    {
      details: { slotAt: spec.detail.slotAt ?? null, ruleVersion: spec.ruleVersion },
      columns: {
        priority: spec.priority,
        rule_id: spec.ruleId,
        rule_version: spec.ruleVersion,
        version_id: spec.versionId,
        summary: spec.summary,
        detail: JSON.stringify(spec.detail),
        direction: direction ? JSON.stringify(direction) : null,
        active_since: now,
      },
    },
  );
  return result.outcome === 'changed' ? { alertId: open.id, type: 'updated' } : null;
}

/** The condition of a loop's rule went away: the open alert (if any) clears. */
export async function clearAlert(
  trx: Knex.Transaction,
  loopId: string,
  ruleKind: AlertRuleKind,
  now: Date,
  details: Record<string, unknown> = {},
): Promise<AlertChange | null> {
  const open = await lockOpenAlert(trx, loopId, ruleKind);
  if (!open) return null;
  const result = await applyLifecycle(trx, open, { type: 'clear', at: now }, { details });
  return result.outcome === 'changed' ? { alertId: open.id, type: 'updated' } : null;
}
