import type { Knex } from 'knex';
import { applyRuleTransitions } from '../alerts/alert-transitions.js';
import type { AlertChange } from '../alerts/alerts.service.js';
import { evaluateRules } from '../drift-rules/rule-evaluation.js';
import { recentRuleSet } from '../drift-rules/rule-set.js';
import type { RuleTransition } from '../drift-rules/rule-runtime.js';
import type { RuleSet } from '../drift-rules/rule-set.js';
import type { ScoredReading, TrackingState } from '../tracking/tracking-fold.js';
import type { LiveLoop } from './live-loop.js';

/**
 * The drift rules on the readings a batch just stored, inside the ingest transaction (the loop's
 * tracking row is locked): the rules' detector states move on, raises and clears become alerts, and
 * the tracking status says `diverged` while a rule is raised and `drifting` while one builds up.
 * `transitions` counts the raises and clears, also those that changed no alert (a raise recorded
 * during maintenance): the caller commits such a batch durably.
 * Late readings (not newer than the last slot) are stored and scored but do not feed the rules:
 * the present is judged in slot order only.
 */
export async function checkDrift(
  trx: Knex.Transaction,
  target: LiveLoop,
  before: TrackingState,
  folded: TrackingState,
  stored: ScoredReading[],
  now: Date,
): Promise<{ tracking: TrackingState; changes: AlertChange[]; transitions: number }> {
  const fresh = stored.filter((r) => before.lastSlotMs === null || r.slotMs > before.lastSlotMs);
  if (!fresh.length) return { tracking: folded, changes: [], transitions: 0 };
  // on a cache miss, read through the transaction's connection: no second connection while one is held
  const ruleSet = await recentRuleSet(trx, target.id);
  if (!ruleSet.rules.length) return { tracking: folded, changes: [], transitions: 0 };
  const evaluation = evaluateRules(
    ruleSet.rules,
    before.ruleStates,
    {
      outputs: target.outputSignals,
      samplePeriodS: target.samplePeriodS,
      innovationCovInverse: ruleSet.innovationCovInverse,
    },
    fresh,
  );
  let status = folded.status;
  if (target.hasTwin) {
    if (evaluation.raised) status = 'diverged';
    else if (evaluation.building && status === 'in_step') status = 'drifting';
  }
  const changes = evaluation.transitions.length
    ? await applyToAlerts(trx, target, ruleSet, before, evaluation.transitions, now)
    : [];
  return {
    tracking: { ...folded, status, ruleStates: evaluation.states },
    changes,
    transitions: evaluation.transitions.length,
  };
}

/**
 * Turns the rules' raises and clears into alerts, handing over what the caller already read (the
 * rule set with its active model, the loop's residual statistics) so the raise reads nothing twice.
 * Used by the ingest and by the stale sweep.
 */
export function applyToAlerts(
  trx: Knex.Transaction,
  loop: LiveLoop,
  ruleSet: RuleSet,
  tracking: Pick<TrackingState, 'stats'>,
  transitions: RuleTransition[],
  now: Date,
): Promise<AlertChange[]> {
  return applyRuleTransitions(
    trx,
    {
      id: loop.id,
      tag: loop.tag,
      name: loop.name,
      area: loop.area,
      maintenance: loop.maintenance,
      outputs: loop.outputSignals,
    },
    transitions,
    now,
    {
      model: ruleSet.model,
      params: new Map(ruleSet.rules.map((r) => [r.id, r.params as Record<string, unknown>])),
      stats: tracking.stats,
    },
  );
}
