import type { Knex } from 'knex';
import type { AlertDetail, AlertRuleKind, Priority, ResidualDirection } from '../../contracts/alerts.js';
import { enqueueAlertMail } from '../mail/alert-mail.js';
import { raise } from './alert-lifecycle.js';
import { insertAlertEvent } from './alert-events.repository.js';
import { applyLifecycle } from './alert-store.js';
import { lifecycleColumns, lockOpenAlert } from './alerts.repository.js';
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
  /** Computed only when an alert is written (not for a suppressed raise). */
  direction: () => Promise<ResidualDirection | null>;
}

const OPEN_PER_RULE = "(loop_id, rule_kind) WHERE state <> 'closed'";

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
  const existing = await reraiseOpen(trx, spec, now);
  if (existing !== undefined) return existing;
  const direction = await spec.direction();
  const first = raise();
  const [inserted] = (await trx('alerts')
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
      summary: spec.summary,
      detail: JSON.stringify(spec.detail),
      direction: direction ? JSON.stringify(direction) : null,
    })
    .onConflict(trx.raw(OPEN_PER_RULE))
    .ignore()
    .returning('id')) as { id: string }[];
  // another transaction opened the alert first: ours is a raise of that one
  if (!inserted) return (await reraiseOpen(trx, spec, now)) ?? null;
  await insertAlertEvent(trx, {
    alertId: inserted.id,
    at: now,
    kind: first.event,
    actorId: null,
    fromState: null,
    toState: first.next.state,
    details: { slotAt: spec.detail.slotAt ?? null, ruleVersion: spec.ruleVersion, versionId: spec.versionId },
  });
  await enqueueAlertMail(trx, inserted.id, first.mail);
  return { alertId: inserted.id, type: 'raised' };
}

/** undefined: no open alert of this rule; null: it exists and the raise changed nothing. */
async function reraiseOpen(trx: Knex.Transaction, spec: RaiseSpec, now: Date): Promise<AlertChange | null | undefined> {
  const open = await lockOpenAlert(trx, spec.loopId, spec.ruleKind);
  if (!open) return undefined;
  if (open.active || open.state === 'closed') return null;
  const direction = await spec.direction();
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
