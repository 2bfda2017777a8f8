import { describe, expect, it } from 'vitest';
import { evaluateRules } from '../rule-evaluation.js';
import type { RuleInForce, RuleReading, RuleStates } from '../rule-runtime.js';
import { band, context, cusum, readings, rule } from './rule-fixtures.js';

/** Runs the rules reading by reading and returns, per reading, the events seen and the final states. */
function run(rules: RuleInForce[], residuals: Parameters<typeof readings>[0], outputs = 1, states: RuleStates = {}) {
  const events: string[] = [];
  let current = states;
  let building = false;
  for (const reading of readings(residuals)) {
    const result = evaluateRules(rules, current, context(outputs), [reading]);
    current = result.states;
    building = result.building;
    events.push(result.transitions.map((t) => `${t.kind}:${t.event}`).join(',') || '-');
  }
  return { events, states: current, building };
}

const at = (events: string[], event: string) => events.flatMap((e, i) => (e === event ? [i] : []));

describe('band rule', () => {
  const r = rule('band', band({ raiseAfter: 3, clearAfter: 2, deadband: 0.2 }));

  it('raises after raiseAfter consecutive samples over the limit, not before', () => {
    const { events } = run([r], [1.5, 1.5, 0.5, 1.5, 1.5, -1.2, 0.1]);
    // the third sample is back inside: the count starts again at the fourth
    expect(at(events, 'band:raise')).toEqual([5]);
  });

  it('clears after clearAfter samples inside limit·(1 − deadband); a sample in the deadband restarts the count', () => {
    const { events } = run([r], [2, 2, 2, 0.5, 0.9, 0.5, 0.5, 0.5]);
    // 0.9 is under the limit 1 but not under 0.8: it breaks the run of quiet samples
    expect(at(events, 'band:raise')).toEqual([2]);
    expect(at(events, 'band:clear')).toEqual([6]);
  });

  it('does not chatter on a residual that hovers at the limit', () => {
    const hovering = Array.from({ length: 40 }, (_, i) => (i % 2 === 0 ? 1.05 : 0.95));
    expect(run([r], hovering).events.every((e) => e === '-')).toBe(true);
    const afterRaise = run([r], [2, 2, 2, ...hovering]).events;
    expect(at(afterRaise, 'band:raise')).toEqual([2]);
    expect(at(afterRaise, 'band:clear')).toEqual([]);
  });

  it('watches every output with a limit: one output over is enough; an output without a limit is ignored', () => {
    const two = rule('band', band({ limits: [1, null], raiseAfter: 2 }));
    expect(
      at(
        run(
          [two],
          [
            [0, 5],
            [0, 5],
            [0, 5],
          ],
          2,
        ).events,
        'band:raise',
      ),
    ).toEqual([]);
    const both = rule('band', band({ limits: [1, 2], raiseAfter: 2 }));
    expect(
      at(
        run(
          [both],
          [
            [1.1, 0],
            [0, 2.1],
          ],
          2,
        ).events,
        'band:raise',
      ),
    ).toEqual([1]);
  });

  it('in sigma mode the limit is k·sigma per output, and the transition carries the limits', () => {
    const sigmaRule = rule('band', { mode: 'sigma', k: 3, sigma: [0.1, 2], raiseAfter: 1, clearAfter: 1, deadband: 0 });
    const result = evaluateRules(
      [sigmaRule],
      {},
      context(2),
      readings([
        [0.29, 5.9],
        [0.31, 0],
      ]),
    );
    expect(result.transitions).toHaveLength(1);
    expect(result.transitions[0]).toMatchObject({ event: 'raise', k: 101, limits: [0.30000000000000004, 6] });
    expect(result.transitions[0].statistic.value).toBeCloseTo(0.31 / 0.3, 12);
  });

  it('is building while it counts towards a raise', () => {
    expect(run([r], [0, 1.5]).building).toBe(true);
    expect(run([r], [1.5, 0]).building).toBe(false);
  });
});

describe('cusum rule', () => {
  const r = rule('cusum', cusum({ k: 0.5, h: 4, sigma: [2] }));

  it('raises on the first sample whose sum exceeds h (upper and lower side)', () => {
    // z = 3/2 = 1.5: the upper sum grows by z − k = 1 per sample and exceeds 4 on the fifth
    expect(at(run([r], Array(8).fill(3)).events, 'cusum:raise')).toEqual([4]);
    expect(at(run([r], Array(8).fill(-3)).events, 'cusum:raise')).toEqual([4]);
  });

  it('holds the sums at 2h while raised and clears when every sum is back to 0', () => {
    // raised at sample 4 (sum 5), held at 8 after eight more; then z = 0 takes 0.5 off per sample
    const { events } = run([r], [...Array(13).fill(3), ...Array(20).fill(0)]);
    expect(at(events, 'cusum:raise')).toEqual([4]);
    expect(at(events, 'cusum:clear')).toEqual([13 + 15]);
  });

  it('one signalling output of several is enough', () => {
    const two = rule('cusum', cusum({ sigma: [1, 1] }));
    const { events } = run([two], Array(6).fill([0, -1.5]), 2);
    expect(at(events, 'cusum:raise')).toEqual([4]);
  });

  it('is building from half of h and keeps the sums per output in its state', () => {
    const { building, states } = run([r], [3, 3]);
    expect(building).toBe(true);
    expect(states[r.id]).toMatchObject({ upper: [2], lower: [0], level: 0.5, raised: false });
  });
});

describe('readings without a residual, and missing slots', () => {
  it('do not move cusum, and break the run of consecutive samples a band rule counts', () => {
    const rules = [rule('band', band({ raiseAfter: 2 })), rule('cusum', cusum())];
    const withGaps = readings([2, null, null, 2]);
    const result = evaluateRules(rules, {}, context(), withGaps);
    expect(result.transitions).toEqual([]);
    expect(result.states['rule-band']).toMatchObject({ over: 1, raised: false });
    expect(result.states['rule-cusum'].upper).toEqual([3]);
    const twoInARow = evaluateRules(rules, {}, context(), readings([2, null, 2, 2]));
    expect(twoInARow.transitions.filter((t) => t.kind === 'band').map((t) => t.k)).toEqual([103]);
  });

  it('a slot that never arrived breaks the run too, also across batches', () => {
    const bandRule = [rule('band', band({ raiseAfter: 2 }))];
    const [a, , c] = readings([2, 2, 2]);
    const first = evaluateRules(bandRule, {}, context(), [a]);
    expect(evaluateRules(bandRule, first.states, context(), [c]).transitions).toEqual([]);
    const [, b] = readings([2, 2]);
    expect(evaluateRules(bandRule, first.states, context(), [b]).transitions.map((t) => t.k)).toEqual([b.k]);
  });

  it('and residuals of the wrong length are skipped too', () => {
    const odd: RuleReading[] = readings([[5, 5]]);
    expect(evaluateRules([rule('band', band({ raiseAfter: 1 }))], {}, context(1), odd).transitions).toEqual([]);
  });
});
