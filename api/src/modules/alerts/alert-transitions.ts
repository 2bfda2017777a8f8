import type { Knex } from 'knex';
import type { RuleTransition } from '../drift-rules/rule-runtime.js';
import type { ResidualStatistics } from '../tracking/residual-statistics.js';
import { readRaiseContext, residualSigma, type ActiveModel } from './alert-context.js';
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

/**
 * What the ingest already holds for the raise: the active model read with the rule set, each rule's
 * params as evaluated (by rule id), and the loop's residual statistics as locked for this batch.
 */
export interface RaiseContext {
  model: ActiveModel | null;
  params: ReadonlyMap<string, Record<string, unknown>>;
  stats: Pick<ResidualStatistics, 'count' | 'm2'>;
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
 * `known`: what the caller already holds for a raise; read here when it is not given.
 */
export async function applyRuleTransitions(
  trx: Knex.Transaction,
  loop: AlertLoop,
  transitions: RuleTransition[],
  now: Date,
  known?: RaiseContext,
): Promise<AlertChange[]> {
  const changes = new Map<string, AlertChange['type']>();
  let context = known;
  for (const transition of transitions) {
    if (transition.event === 'clear') {
      merge(
        changes,
        await clearAlert(trx, loop.id, transition.kind, now, { slotAt: new Date(transition.slotMs).toISOString() }),
      );
      continue;
    }
    context ??= await readRaiseContext(
      trx,
      loop.id,
      transitions.map((t) => t.ruleId),
    );
    merge(changes, await raiseForRule(trx, loop, transition, context, now));
  }
  return [...changes].map(([alertId, type]) => ({ alertId, type }));
}

async function raiseForRule(
  trx: Knex.Transaction,
  loop: AlertLoop,
  transition: RuleTransition,
  context: RaiseContext,
  now: Date,
): Promise<AlertChange | null> {
  const { model } = context;
  const params = context.params.get(transition.ruleId) ?? null;
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
      // a missing reading has no residual to point anywhere
      residualWindow:
        model && transition.kind !== 'stale' ? { upToMs: transition.slotMs, samplePeriodS: model.samplePeriodS } : null,
      direction: (residuals) => {
        if (!model) return null;
        // the hint is an annotation: a model the direction maths cannot use never holds up the raise
        try {
          return directionOf({
            A: model.A,
            C: model.C,
            samplePeriodS: model.samplePeriodS,
            outputs: loop.outputs,
            residuals,
            sigma: residualSigma(params, context.stats, loop.outputs.length),
          });
        } catch {
          return null;
        }
      },
    },
    now,
  );
}
