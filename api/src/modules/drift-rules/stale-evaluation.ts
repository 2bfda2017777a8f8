import type { StaleParams } from '../../contracts/alerts.js';
import { slotOf, slotTimeMs } from '../readings/sample-grid.js';
import type { RuleInForce, RuleRuntime, RuleTransition } from './rule-runtime.js';
import { freshRuntime, startState, transitionOf } from './rule-state.js';

/**
 * The stale rule between readings: raises when the newest reading is more than `afterSamples`
 * sample periods old (as the loop's `stale` status is derived), at the first slot past that.
 * A loop that never had a reading is being commissioned, not stale: it does not raise. Fresh
 * readings clear it (the ingest does so through {@link evaluateRules}; this catches readings that
 * came another way), and a disabled rule clears once.
 */
export function evaluateStale(
  rule: RuleInForce,
  state: RuleRuntime | undefined,
  input: { lastReadingMs: number | null; nowMs: number; samplePeriodS: number; lastSlotMs: number | null },
): { state: RuleRuntime; transition: RuleTransition | null } {
  const current = startState(rule, state, 0);
  const afterSamples = (rule.params as StaleParams).afterSamples;
  const periodMs = slotTimeMs(1, input.samplePeriodS);
  const missing =
    input.lastReadingMs === null ? 0 : Math.max(0, Math.floor((input.nowMs - input.lastReadingMs) / periodMs));
  const stale = input.lastReadingMs !== null && input.nowMs - input.lastReadingMs > afterSamples * periodMs;
  const statistic = { name: 'samples without a reading', value: missing, limit: afterSamples };
  const lastK =
    input.lastSlotMs !== null
      ? slotOf(input.lastSlotMs, input.samplePeriodS).k
      : slotOf(input.lastReadingMs ?? input.nowMs, input.samplePeriodS).k;
  const at = (k: number) => ({ k, slotMs: slotTimeMs(k, input.samplePeriodS) });
  if (!rule.enabled || !stale) {
    const clear = current.raised
      ? transitionOf(
          rule,
          'clear',
          at(rule.enabled ? lastK : slotOf(input.nowMs, input.samplePeriodS).k),
          statistic,
          null,
          null,
        )
      : null;
    return {
      state: { ...freshRuntime(rule.version), level: rule.enabled ? missing / afterSamples : 0 },
      transition: clear,
    };
  }
  const next = { ...current, level: missing / afterSamples };
  if (current.raised) return { state: next, transition: null };
  next.raised = true;
  return { state: next, transition: transitionOf(rule, 'raise', at(lastK + afterSamples), statistic, null, null) };
}
