import type { CusumParams } from '../../contracts/alerts.js';
import type { DetectorStep } from './rule-detectors.js';
import type { RuleInForce, RuleReading, RuleRuntime, RuleTransition } from './rule-runtime.js';

/** A rule's runtime state: how it starts, how it continues, and the transitions it emits. */
export const freshRuntime = (version: number): RuleRuntime => ({
  version,
  raised: false,
  over: 0,
  inside: 0,
  upper: [],
  lower: [],
  level: 0,
});

const count = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : 0);
const sums = (v: unknown) => (Array.isArray(v) && v.every((x) => typeof x === 'number') ? [...(v as number[])] : []);

/**
 * The rule's state to continue from (a copy; stored JSON is read defensively). A new rule version
 * restarts the counters and keeps `raised`; a raised CUSUM restarts its sums at h, so that it still
 * needs about h/k in-control samples to clear rather than clearing on the first quiet one.
 */
export function startState(rule: RuleInForce, prior: RuleRuntime | undefined, outputs: number): RuleRuntime {
  if (!prior) return freshRuntime(rule.version);
  if (prior.version !== rule.version) {
    const restarted = { ...freshRuntime(rule.version), raised: prior.raised === true };
    if (rule.kind === 'cusum' && restarted.raised) {
      const h = (rule.params as CusumParams).h;
      restarted.upper = new Array<number>(outputs).fill(h);
      restarted.lower = new Array<number>(outputs).fill(h);
    }
    return restarted;
  }
  return {
    version: rule.version,
    raised: prior.raised === true,
    over: count(prior.over),
    inside: count(prior.inside),
    upper: sums(prior.upper),
    lower: sums(prior.lower),
    level: count(prior.level),
    ...(typeof prior.lastK === 'number' ? { lastK: prior.lastK } : {}),
  };
}

export function transitionOf(
  rule: RuleInForce,
  event: 'raise' | 'clear',
  at: { k: number; slotMs: number },
  statistic: DetectorStep['statistic'],
  reading: RuleReading | null,
  limits: (number | null)[] | null,
): RuleTransition {
  return {
    ruleId: rule.id,
    kind: rule.kind,
    ruleVersion: rule.version,
    priority: rule.priority,
    event,
    slotMs: at.slotMs,
    k: at.k,
    statistic,
    measured: reading?.measured ?? null,
    predicted: reading?.predicted ?? null,
    residual: reading?.residual ?? null,
    limits,
  };
}
