import type { Knex } from 'knex';
import { enqueueAlertMail } from '../mail/alert-mail.js';
import { transition, type LifecycleAction, type LifecycleResult } from './alert-lifecycle.js';
import { insertAlertEvent } from './alert-events.repository.js';
import { lifecycleColumns, lifecycleOf, updateAlertRow, type AlertRow } from './alerts.repository.js';

export interface ApplyOptions {
  /** The person's note, kept on the event. */
  note?: string | null;
  details?: Record<string, unknown>;
  /** Further columns written with the change (e.g. the newest summary on a re-raise). */
  columns?: Partial<Record<keyof AlertRow, unknown>>;
}

/**
 * Runs one life-cycle action on a locked alert row and, when it changes something, writes the row,
 * the timeline event and the e-mail the machine asked for — all in the caller's transaction.
 */
export async function applyLifecycle(
  trx: Knex.Transaction,
  row: AlertRow,
  action: LifecycleAction,
  options: ApplyOptions = {},
): Promise<LifecycleResult> {
  const result = transition(lifecycleOf(row), action);
  if (result.outcome !== 'changed') return result;
  await updateAlertRow(trx, row.id, { ...lifecycleColumns(result.next), ...options.columns });
  await insertAlertEvent(trx, {
    alertId: row.id,
    at: action.at,
    kind: result.event,
    actorId: 'actor' in action ? action.actor : null,
    fromState: row.state,
    toState: result.next.state,
    note: options.note ?? null,
    details: options.details,
  });
  if (result.mail) await enqueueAlertMail(trx, row.id, result.mail);
  return result;
}
