import type { Matrix } from '@shadowloop/simulator/engine';
import type { DriftRuleKind, DriftRuleParams, Priority } from '../../contracts/alerts.js';

/**
 * The seam between the drift rules (evaluated as readings are stored, in the ingest transaction)
 * and the alerts they raise and clear. Pure data; no I/O.
 */

/** A rule as the evaluator needs it (the row of drift_rules, params already validated). */
export interface RuleInForce {
  id: string;
  kind: DriftRuleKind;
  enabled: boolean;
  priority: Priority;
  version: number;
  params: DriftRuleParams;
}

/** The loop's active model version, as an alert raise needs it (read with the rule set). */
export interface RuleModel {
  id: string;
  number: number;
  A: Matrix;
  C: Matrix | null;
  samplePeriodS: number;
  analysis: { stability?: string; spectralRadius?: number } | null;
}

/** One rule's detector state, kept in loop_tracking.rule_state under the rule's id. */
export interface RuleRuntime {
  /** The rule version this state belongs to; counters restart (raised is kept) when it changes. */
  version: number;
  raised: boolean;
  /** Consecutive samples over the limit (band, nis) while not raised. */
  over: number;
  /** Consecutive samples inside the clear limit while raised. */
  inside: number;
  /** Two-sided CUSUM sums per output (cusum). */
  upper: number[];
  lower: number[];
  /** The rule's newest statistic (|r|/limit, max CUSUM sum / h, NIS / limit): 0 … ≥ 1. */
  level: number;
  /** The slot of the newest reading judged; a gap in k breaks a run of consecutive samples. */
  lastK?: number;
}
export type RuleStates = Record<string, RuleRuntime>;

/** What the evaluator knows of the loop and its active model. */
export interface RuleContext {
  outputs: { name: string; unit: string }[];
  samplePeriodS: number;
  /** S⁻¹ of the Kalman correction's innovation covariance C P Cᵀ + R (p×p), or null. */
  innovationCovInverse: number[][] | null;
}

/** A residual-bearing reading in slot order (api/src/modules/tracking ScoredReading has these fields). */
export interface RuleReading {
  k: number;
  slotMs: number;
  measured: number[];
  predicted: number[] | null;
  residual: number[] | null;
}

/** A rule crossed into raised or back to clear at one slot. */
export interface RuleTransition {
  ruleId: string;
  kind: DriftRuleKind;
  ruleVersion: number;
  priority: Priority;
  event: 'raise' | 'clear';
  slotMs: number;
  k: number;
  /** e.g. "|residual| / limit" with value and limit at that slot. */
  statistic: { name: string; value: number; limit: number };
  /** The reading at the transition (for the alert's values with units). */
  measured: number[] | null;
  predicted: number[] | null;
  residual: number[] | null;
  /** Per output limit in output units where the rule has one (band), else null. */
  limits: (number | null)[] | null;
}

export interface RuleEvaluation {
  states: RuleStates;
  transitions: RuleTransition[];
  /** Some enabled rule is raised now. */
  raised: boolean;
  /** Some enabled rule is building up (counting, or a CUSUM sum past half its h) without being raised. */
  building: boolean;
}
