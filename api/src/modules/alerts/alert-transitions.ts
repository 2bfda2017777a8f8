import type { Knex } from 'knex';
import type { RuleTransition } from '../drift-rules/rule-runtime.js';
import { findModel, findRuleParams, residualSigma, residualWindow, type ActiveModel } from './alert-context.js';
import { clearAlert, raiseAlert } from './alert-raise.js';
import { detailOf, summaryOf } from './alert-summary.js';
import type { AlertChange } from './alerts.service.js';
import { directionOf } from './direction-hint.js';

/** The loop as the alert raise needs it. */
export interface AlertLoop {
  id: string;
  tag: string;
  name: string;
  area: string;
  maintenance: boolean;
  outputs: { name: string; unit: string }[];
}

/** Merges changes per alert; a raise stays a raise when the same alert also changed later. */
function merge(changes: Map<string, AlertChange['type']>, change: AlertChange | null): void {
  if (!change) return;
  if (changes.get(change.alertId) !== 'raised') changes.set(change.alertId, change.type);
}

/**
 * Turns the drift rules' raises and clears (rule-evaluation, in the ingest transaction) into
 * alerts: raised, raised again, cleared or — for a loop in maintenance — recorded as suppressed.
 * Runs in the caller's transaction; the caller publishes the returned changes after commit.
 */
export async function applyRuleTransitions(
  trx: Knex.Transaction,
  loop: AlertLoop,
  transitions: RuleTransition[],
  now: Date,
): Promise<AlertChange[]> {
  const changes = new Map<string, AlertChange['type']>();
  let model: Promise<ActiveModel | null> | undefined;
  const activeModel = () => (model ??= findModel(trx, { loopId: loop.id }));
  for (const transition of transitions) {
    if (transition.event === 'clear') {
      merge(
        changes,
        await clearAlert(trx, loop.id, transition.kind, now, { slotAt: new Date(transition.slotMs).toISOString() }),
      );
      continue;
    }
    merge(changes, await raiseForRule(trx, loop, transition, await activeModel(), now));
  }
  return [...changes].map(([alertId, type]) => ({ alertId, type }));
}

async function raiseForRule(
  trx: Knex.Transaction,
  loop: AlertLoop,
  transition: RuleTransition,
  model: ActiveModel | null,
  now: Date,
): Promise<AlertChange | null> {
  const params = await findRuleParams(trx, transition.ruleId);
  const raiseAfter = typeof params?.raiseAfter === 'number' ? params.raiseAfter : null;
  const sigma = Array.isArray(params?.sigma) ? (params.sigma as number[]) : null;
  const summary = summaryOf(transition, {
    loopTag: loop.tag,
    outputs: loop.outputs,
    raiseAfter: transition.kind === 'band' || transition.kind === 'nis' ? raiseAfter : null,
    sigma,
    samplePeriodS: model?.samplePeriodS ?? null,
  });
  return raiseAlert(
    trx,
    {
      loopId: loop.id,
      area: loop.area,
      maintenance: loop.maintenance,
      ruleKind: transition.kind,
      ruleId: transition.ruleId,
      ruleVersion: transition.ruleVersion,
      priority: transition.priority,
      versionId: model?.id ?? null,
      summary,
      detail: detailOf(transition, loop.outputs),
      direction: async () => {
        // a missing reading has no residual to point anywhere
        if (!model || transition.kind === 'stale') return null;
        const residuals = await residualWindow(trx, loop.id, transition.slotMs, model.samplePeriodS);
        return directionOf({
          A: model.A,
          C: model.C,
          samplePeriodS: model.samplePeriodS,
          outputs: loop.outputs,
          residuals,
          sigma: await residualSigma(trx, loop.id, params, loop.outputs.length),
        });
      },
    },
    now,
  );
}
