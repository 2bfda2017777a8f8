import type { BandParams, CusumParams, NisParams, StaleParams } from '../../contracts/alerts.js';
import { bandDetector, cusumDetector, nisDetector, type Detector } from './rule-detectors.js';
import { freshRuntime, startState, transitionOf } from './rule-state.js';
import type {
  RuleContext,
  RuleEvaluation,
  RuleInForce,
  RuleReading,
  RuleRuntime,
  RuleStates,
  RuleTransition,
} from './rule-runtime.js';

/**
 * The drift rules on a loop's newest readings (in slot order). Pure: the same rules, states and
 * readings give the same result, and a batch split anywhere gives the same states and transitions
 * as the readings one by one. Readings without a residual (no prediction for the slot) move only
 * the stale rule, and break the runs of consecutive samples that band and nis count, as a missing
 * slot does; CUSUM sums carry over a gap.
 */
export function evaluateRules(
  rules: RuleInForce[],
  states: RuleStates,
  ctx: RuleContext,
  readings: RuleReading[],
): RuleEvaluation {
  const next: RuleStates = { ...states };
  const transitions: RuleTransition[] = [];
  let raised = false;
  let building = false;
  for (const rule of rules) {
    const state = evaluateRule(rule, states[rule.id], ctx, readings, transitions);
    next[rule.id] = state;
    if (!rule.enabled) continue;
    raised ||= state.raised;
    building ||= isBuilding(rule, state);
  }
  // stable: one rule's transitions keep their order; the rules' are interleaved by slot
  transitions.sort((a, b) => a.slotMs - b.slotMs);
  return { states: next, transitions, raised, building };
}

/** Counting towards a raise (band, nis), or a CUSUM sum past half its h. */
function isBuilding(rule: RuleInForce, state: RuleRuntime): boolean {
  if (state.raised) return false;
  if (rule.kind === 'cusum') return state.level >= 0.5;
  return (rule.kind === 'band' || rule.kind === 'nis') && state.over > 0;
}

function detectorOf(rule: RuleInForce, ctx: RuleContext): Detector | null {
  const outputs = ctx.outputs.length;
  if (rule.kind === 'band') return bandDetector(rule.params as BandParams, outputs);
  if (rule.kind === 'cusum') return cusumDetector(rule.params as CusumParams, outputs);
  if (rule.kind === 'nis') return nisDetector(rule.params as NisParams, outputs, ctx.innovationCovInverse);
  return null;
}

function evaluateRule(
  rule: RuleInForce,
  prior: RuleRuntime | undefined,
  ctx: RuleContext,
  readings: RuleReading[],
  out: RuleTransition[],
): RuleRuntime {
  const outputs = ctx.outputs.length;
  const state = startState(rule, prior, outputs);
  const first = readings[0];
  if (!rule.enabled || rule.kind === 'stale') {
    // a disabled rule clears once and rests; any reading ends a stale condition
    if (!state.raised) return rule.enabled && !first ? state : freshRuntime(rule.version);
    if (!first) return state;
    const statistic = rule.enabled
      ? { name: 'samples without a reading', value: 0, limit: (rule.params as StaleParams).afterSamples }
      : { name: 'rule disabled', value: state.level, limit: 1 };
    out.push(transitionOf(rule, 'clear', first, statistic, first, null));
    return freshRuntime(rule.version);
  }
  const detector = detectorOf(rule, ctx);
  if (!detector) return state;
  for (const reading of readings) {
    // "N consecutive samples": a missing slot, or a sample with no residual, starts the count again
    const consecutive = state.lastK === undefined || reading.k === state.lastK + 1;
    state.lastK = reading.k;
    if (!consecutive || !reading.residual || reading.residual.length !== outputs) {
      state.over = 0;
      state.inside = 0;
    }
    if (!reading.residual || reading.residual.length !== outputs) continue;
    const step = detector.step(state, reading.residual);
    if (step.event) out.push(transitionOf(rule, step.event, reading, step.statistic, reading, detector.limits));
  }
  return state;
}

export { freshRuntime } from './rule-state.js';
export { evaluateStale } from './stale-evaluation.js';
