import type { z } from 'zod';
import { BACKTEST_LIMITS, type RuleReplaySchema } from '../../contracts/backtests.js';
import { evaluateRules, evaluateStale } from '../drift-rules/rule-evaluation.js';
import type { RuleContext, RuleInForce, RuleReading, RuleStates, RuleTransition } from '../drift-rules/rule-runtime.js';
import { slotTimeMs } from '../readings/sample-grid.js';

export type RuleReplay = z.infer<typeof RuleReplaySchema>;
type ReplayedAlert = RuleReplay['alerts'][number];

/** A loop's drift rules and one version's one-step predictions over a recording (N slots). */
export interface RuleReplayInput {
  rules: RuleInForce[];
  ctx: RuleContext;
  /** Slot numbers, strictly increasing; slot k sits at k·T after the epoch. */
  k: Float64Array;
  samplePeriodS: number;
  /** N×p row-major measured outputs; NaN: no value. */
  measured: Float64Array;
  /** N×p one-step predictions ŷ(k|k−1); NaN: none for that slot. */
  predicted: Float64Array;
  outputs: number;
  targetPerDay: number;
}

/** Readings handed to the evaluator at a time, the rule states carried between batches. */
export const REPLAY_BATCH = 5000;

const SECONDS_PER_DAY = 86_400;

/**
 * The loop's drift rules run over a version's one-step residuals r = y − ŷ with the live
 * evaluator ({@link evaluateRules}; stale rules with {@link evaluateStale} in each gap of the
 * recording), as they would have run had the version been active. Disabled rules are replayed
 * as if enabled, so their counts show what enabling them would do, but they are left out of
 * `total`, `perDay` and the listed alerts: those are what the on-call engineer would have seen.
 */
export function replayRules(input: RuleReplayInput): RuleReplay {
  checkInput(input);
  const replayed = input.rules.map((rule) => ({ ...rule, enabled: true }));
  const residualRules = replayed.filter((rule) => rule.kind !== 'stale');
  const staleRules = replayed.filter((rule) => rule.kind === 'stale');
  const tally = createTally(input.rules);
  const present = readingIndices(input);
  let states: RuleStates = {};
  const staleStates: RuleStates = {};
  for (let start = 0; start < present.length; start += REPLAY_BATCH) {
    const end = Math.min(present.length, start + REPLAY_BATCH);
    const transitions = staleTransitions(staleRules, staleStates, input, present, start, end);
    if (residualRules.length > 0) {
      const evaluation = evaluateRules(residualRules, states, input.ctx, ruleReadings(input, present, start, end));
      states = evaluation.states;
      transitions.push(...evaluation.transitions);
    }
    // stable: a stale raise sits in the gap before this batch's readings, its clear at the next reading
    transitions.sort((a, b) => a.slotMs - b.slotMs);
    for (const transition of transitions) tally.record(transition);
  }
  const days = rangeDays(input.k, input.samplePeriodS);
  return {
    rules: input.rules.map((rule) => ({
      ruleId: rule.id,
      kind: rule.kind,
      priority: rule.priority,
      enabled: rule.enabled,
      raises: tally.raises.get(rule.id) ?? 0,
    })),
    alerts: tally.alerts,
    total: tally.total,
    days,
    perDay: days > 0 ? tally.total / days : 0,
    targetPerDay: input.targetPerDay,
  };
}

function checkInput({ k, measured, predicted, outputs, samplePeriodS, ctx }: RuleReplayInput): void {
  if (!Number.isInteger(outputs) || outputs < 1)
    throw new RangeError(`replayRules: outputs must be ≥ 1, got ${outputs}`);
  if (!(samplePeriodS > 0)) throw new RangeError(`replayRules: samplePeriodS must be > 0, got ${samplePeriodS}`);
  if (ctx.outputs.length !== outputs) {
    throw new RangeError(`replayRules: the rule context has ${ctx.outputs.length} outputs, the recording ${outputs}`);
  }
  const n = k.length;
  if (measured.length !== n * outputs) {
    throw new RangeError(`replayRules: measured holds ${measured.length} values, expected ${n}×${outputs}`);
  }
  if (predicted.length !== n * outputs) {
    throw new RangeError(`replayRules: predicted holds ${predicted.length} values, expected ${n}×${outputs}`);
  }
  for (let i = 1; i < n; i++) {
    if (!(k[i] > k[i - 1])) throw new RangeError(`replayRules: k must increase, k[${i}] = ${k[i]} after ${k[i - 1]}`);
  }
}

/** Slots of the recording holding a reading (some finite measured value): what the live ingest would have seen. */
function readingIndices({ k, measured, outputs }: RuleReplayInput): Int32Array {
  const indices = new Int32Array(k.length);
  let count = 0;
  for (let i = 0; i < k.length; i++) {
    for (let o = 0; o < outputs; o++) {
      if (Number.isFinite(measured[i * outputs + o])) {
        indices[count++] = i;
        break;
      }
    }
  }
  return indices.subarray(0, count);
}

/** Values of slot i as an array, or null when one is not finite. */
function rowOf(values: Float64Array, i: number, p: number): number[] | null {
  const row = new Array<number>(p);
  for (let o = 0; o < p; o++) {
    const value = values[i * p + o];
    if (!Number.isFinite(value)) return null;
    row[o] = value;
  }
  return row;
}

function ruleReadings(input: RuleReplayInput, present: Int32Array, start: number, end: number): RuleReading[] {
  const { k, measured, predicted, outputs: p, samplePeriodS } = input;
  const readings = new Array<RuleReading>(end - start);
  for (let j = start; j < end; j++) {
    const i = present[j];
    const y = rowOf(measured, i, p);
    const yHat = rowOf(predicted, i, p);
    readings[j - start] = {
      k: k[i],
      slotMs: slotTimeMs(k[i], samplePeriodS),
      measured: y ?? Array.from(measured.subarray(i * p, i * p + p)),
      predicted: yHat,
      residual: y && yHat ? y.map((value, o) => value - yHat[o]) : null,
    };
  }
  return readings;
}

/**
 * The stale rules over the gaps before readings start … end−1. At each gap the rule is asked just
 * before the next reading arrives (half a millisecond before its slot: slot times are whole
 * milliseconds apart), so a gap of ≥ afterSamples missing slots raises once, at slot
 * k_before + afterSamples, and the next reading clears it.
 */
function staleTransitions(
  rules: RuleInForce[],
  states: RuleStates,
  { k, samplePeriodS }: RuleReplayInput,
  present: Int32Array,
  start: number,
  end: number,
): RuleTransition[] {
  const transitions: RuleTransition[] = [];
  if (rules.length === 0) return transitions;
  for (let j = Math.max(1, start); j < end; j++) {
    const lastMs = slotTimeMs(k[present[j - 1]], samplePeriodS);
    const nextMs = slotTimeMs(k[present[j]], samplePeriodS);
    if (nextMs - lastMs <= slotTimeMs(1, samplePeriodS)) continue;
    for (const rule of rules) {
      const before = evaluateStale(rule, states[rule.id], {
        lastReadingMs: lastMs,
        nowMs: nextMs - 0.5,
        samplePeriodS,
        lastSlotMs: lastMs,
      });
      const after = evaluateStale(rule, before.state, {
        lastReadingMs: nextMs,
        nowMs: nextMs,
        samplePeriodS,
        lastSlotMs: nextMs,
      });
      for (const transition of [before.transition, after.transition]) if (transition) transitions.push(transition);
      states[rule.id] = after.state;
    }
  }
  return transitions;
}

const figure = (value: number) => String(Number(value.toPrecision(3)));
const isoOf = (slotMs: number) => new Date(slotMs).toISOString();

/** Raises per rule (all rules), and the alerts of the enabled rules: counted, the first few listed with their clear. */
function createTally(rules: RuleInForce[]) {
  const enabled = new Set(rules.filter((rule) => rule.enabled).map((rule) => rule.id));
  const raises = new Map<string, number>();
  const alerts: ReplayedAlert[] = [];
  const open = new Map<string, ReplayedAlert>();
  const tally = { raises, alerts, total: 0, record };
  function record(transition: RuleTransition): void {
    if (transition.event === 'clear') {
      const alert = open.get(transition.ruleId);
      if (alert) alert.clearedAt = isoOf(transition.slotMs);
      open.delete(transition.ruleId);
      return;
    }
    raises.set(transition.ruleId, (raises.get(transition.ruleId) ?? 0) + 1);
    if (!enabled.has(transition.ruleId)) return;
    tally.total += 1;
    if (alerts.length >= BACKTEST_LIMITS.listedAlerts) return;
    const { name, value, limit } = transition.statistic;
    const alert: ReplayedAlert = {
      ruleId: transition.ruleId,
      kind: transition.kind,
      raisedAt: isoOf(transition.slotMs),
      clearedAt: null,
      statistic: `${name} = ${figure(value)} (limit ${figure(limit)})`,
    };
    alerts.push(alert);
    open.set(transition.ruleId, alert);
  }
  return tally;
}

/** days = slots × T / 86,400 with slots = k[N−1] − k[0] + 1 (missing slots included); 0 without slots. */
function rangeDays(k: Float64Array, samplePeriodS: number): number {
  if (k.length === 0) return 0;
  return ((k[k.length - 1] - k[0] + 1) * samplePeriodS) / SECONDS_PER_DAY;
}
