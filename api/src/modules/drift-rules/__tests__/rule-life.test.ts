import { chiSquareQuantile, nis } from '@shadowloop/simulator/engine';
import { describe, expect, it } from 'vitest';
import { quadraticForm } from '../rule-detectors.js';
import { evaluateRules, evaluateStale, freshRuntime } from '../rule-evaluation.js';
import type { RuleStates } from '../rule-runtime.js';
import { band, context, cusum, nisParams, readings, rule, seededNormal } from './rule-fixtures.js';

describe('nis rule', () => {
  const S = [
    [2, 0.5],
    [0.5, 1],
  ];
  const det = 2 * 1 - 0.5 * 0.5;
  const inverse = [
    [1 / det, -0.5 / det],
    [-0.5 / det, 2 / det],
  ];

  it('rᵀ S⁻¹ r with the inverted covariance equals the engine nis(r, S)', () => {
    for (const r of [
      [1, 2],
      [-3, 0.5],
      [0.1, -0.2],
    ])
      expect(quadraticForm(r, inverse)).toBeCloseTo(nis(r, S), 12);
  });

  it('raises after raiseAfter samples over the chi-square limit and clears after clearAfter below it', () => {
    const limit = chiSquareQuantile(0.99, 2);
    const big = [5, 0];
    expect(nis(big, S)).toBeGreaterThan(limit);
    const r = rule('nis', nisParams({ falseAlarmProbability: 0.01, raiseAfter: 2, clearAfter: 2 }));
    const result = evaluateRules(
      [r],
      {},
      context(2, inverse),
      readings([big, [0, 0], big, big, [0, 0], big, [0, 0], [0, 0]]),
    );
    expect(result.transitions.map((t) => `${t.event}:${t.k}`)).toEqual(['raise:103', 'clear:107']);
    expect(result.transitions[0].statistic).toMatchObject({ name: 'NIS', limit });
    expect(result.transitions[0].statistic.value).toBeCloseTo(nis(big, S), 12);
  });

  it('falls back to diag(sigma²) without a Kalman covariance, and does nothing with neither', () => {
    const withSigma = rule('nis', nisParams({ raiseAfter: 1, sigma: [1, 1] }));
    expect(evaluateRules([withSigma], {}, context(2), readings([[3.5, 0]])).transitions).toHaveLength(1);
    const without = rule('nis', nisParams({ raiseAfter: 1 }));
    expect(evaluateRules([without], {}, context(2), readings([[30, 0]])).transitions).toHaveLength(0);
  });
});

describe('stale rule', () => {
  const r = rule('stale', { afterSamples: 5 });
  const input = { lastReadingMs: 100_000, lastSlotMs: 100_000, samplePeriodS: 1 };

  it('raises once the newest reading is more than afterSamples periods old, once, at the first missing slot past it', () => {
    expect(evaluateStale(r, undefined, { ...input, nowMs: 105_000 }).transition).toBeNull();
    const raised = evaluateStale(r, undefined, { ...input, nowMs: 105_500 });
    expect(raised.transition).toMatchObject({
      event: 'raise',
      k: 105,
      slotMs: 105_000,
      statistic: { value: 5, limit: 5 },
    });
    expect(evaluateStale(r, raised.state, { ...input, nowMs: 120_000 }).transition).toBeNull();
  });

  it('does not raise for a loop that never had a reading', () => {
    const never = evaluateStale(r, undefined, { lastReadingMs: null, lastSlotMs: null, nowMs: 1e9, samplePeriodS: 1 });
    expect(never.transition).toBeNull();
    expect(never.state.raised).toBe(false);
  });

  it('any reading clears it, with or without a residual', () => {
    const raised = evaluateStale(r, undefined, { ...input, nowMs: 110_000 }).state;
    const result = evaluateRules([r], { [r.id]: raised }, context(), readings([null], 110));
    expect(result.transitions).toMatchObject([{ kind: 'stale', event: 'clear', k: 110 }]);
    expect(result.states[r.id].raised).toBe(false);
    expect(result.raised).toBe(false);
  });
});

describe('rule versions and switching off', () => {
  it('a new version restarts the counters and keeps raised', () => {
    const v1 = rule('band', band({ raiseAfter: 3, clearAfter: 3 }));
    const first = evaluateRules([v1], {}, context(), readings([2, 2, 2, 0, 0]));
    expect(first.states[v1.id]).toMatchObject({ raised: true, inside: 2 });
    const v2 = { ...v1, version: 2 };
    const next = evaluateRules([v2], first.states, context(), readings([0, 0], 105));
    expect(next.states[v1.id]).toMatchObject({ version: 2, raised: true, inside: 2 });
    expect(next.transitions).toEqual([]);
    expect(next.raised).toBe(true);
  });

  it('a raised CUSUM of a new version needs about h/k quiet samples to clear', () => {
    const v1 = rule('cusum', cusum({ k: 0.5, h: 4 }));
    const raised = evaluateRules([v1], {}, context(), readings(Array(5).fill(1.5))).states;
    const quiet = evaluateRules([{ ...v1, version: 2 }], raised, context(), readings(Array(10).fill(0), 105));
    expect(quiet.transitions.map((t) => `${t.event}:${t.k}`)).toEqual(['clear:112']);
  });

  it('a disabled rule clears once if it was raised, then rests', () => {
    const on = rule('band', band({ raiseAfter: 1 }));
    const raised = evaluateRules([on], {}, context(), readings([2])).states;
    const off = { ...on, enabled: false, version: 2 };
    const first = evaluateRules([off], raised, context(), readings([5, 5], 101));
    expect(first.transitions).toMatchObject([{ event: 'clear', k: 101, ruleVersion: 2 }]);
    expect(first.states[on.id]).toEqual(freshRuntime(2));
    expect(first.raised).toBe(false);
    expect(evaluateRules([off], first.states, context(), readings([5], 103)).transitions).toEqual([]);
  });

  it('keeps the states of rules it was not given', () => {
    const other = { 'gone-rule': freshRuntime(4) };
    expect(evaluateRules([rule('band', band())], other, context(), readings([0])).states['gone-rule']).toEqual(
      freshRuntime(4),
    );
  });
});

describe('batches', () => {
  const rules = [
    rule('band', band({ limits: [1.5, 1.5], raiseAfter: 2, clearAfter: 3 })),
    rule('cusum', cusum({ k: 0.25, h: 3, sigma: [1, 1] })),
    rule('nis', nisParams({ raiseAfter: 2, clearAfter: 2, sigma: [1, 1] })),
  ];
  const normal = seededNormal(42);
  // in-control noise with two shifted stretches, so that every rule raises and clears
  const residuals = Array.from({ length: 600 }, (_, i) => {
    const shift = (i > 150 && i < 220) || (i > 400 && i < 430) ? 1.8 : 0;
    return i % 37 === 0 ? null : [normal() + shift, normal()];
  });

  it('split anywhere give the same states and transitions as the readings one by one', () => {
    const all = readings(residuals);
    let states: RuleStates = {};
    const oneByOne: unknown[] = [];
    for (const reading of all) {
      const result = evaluateRules(rules, states, context(2), [reading]);
      states = result.states;
      oneByOne.push(...result.transitions);
    }
    expect(oneByOne.length).toBeGreaterThanOrEqual(6);
    const cut = seededNormal(7);
    for (let trial = 0; trial < 5; trial++) {
      let batchStates: RuleStates = {};
      const batched: unknown[] = [];
      for (let start = 0; start < all.length;) {
        const size = 1 + Math.floor(Math.abs(cut()) * 40);
        const result = evaluateRules(rules, batchStates, context(2), all.slice(start, start + size));
        // the states go through jsonb between batches
        batchStates = JSON.parse(JSON.stringify(result.states)) as RuleStates;
        batched.push(...result.transitions);
        start += size;
      }
      const text = (list: unknown[]) => list.map((t) => JSON.stringify(t)).sort();
      expect(text(batched)).toEqual(text(oneByOne));
      expect(batchStates).toEqual(states);
    }
  });
});
