import { describe, expect, it } from 'vitest';
import type { DriftRuleParams } from '../../../contracts/alerts.js';
import { RuleReplaySchema } from '../../../contracts/backtests.js';
import { band, context, cusum } from '../../drift-rules/__tests__/rule-fixtures.js';
import { CUSUM_HOLD } from '../../drift-rules/rule-detectors.js';
import type { RuleInForce } from '../../drift-rules/rule-runtime.js';
import { REPLAY_BATCH, replayRules, type RuleReplayInput } from '../rule-replay.js';

/** A realistic slot number (2023-11-14 at T = 1 s), so slot times are far from 0. */
const K0 = 1_700_000_000;
const BAND_ID = '00000000-0000-4000-8000-00000000000b';
const STALE_ID = '00000000-0000-4000-8000-00000000000c';
const CUSUM_ID = '00000000-0000-4000-8000-00000000000d';

function ruleOf(id: string, kind: RuleInForce['kind'], params: DriftRuleParams, enabled = true): RuleInForce {
  return { id, kind, enabled, priority: 2, version: 1, params };
}

/** One output: predictions on a wandering level, measurements = prediction + the residual given. */
function input(
  residuals: number[],
  rules: RuleInForce[],
  options: { k?: number[]; samplePeriodS?: number; noPrediction?: number[] } = {},
): RuleReplayInput {
  const predicted = Float64Array.from(residuals, (_, i) => 50 + Math.sin(i / 7));
  const measured = Float64Array.from(residuals, (r, i) => predicted[i] + r);
  for (const i of options.noPrediction ?? []) predicted[i] = NaN;
  return {
    rules,
    ctx: context(1),
    k: Float64Array.from(options.k ?? residuals.map((_, i) => K0 + i)),
    samplePeriodS: options.samplePeriodS ?? 1,
    measured,
    predicted,
    outputs: 1,
    targetPerDay: 3,
  };
}

/** Zeros with bursts of `value` at [start, start + length). */
function withBursts(n: number, bursts: [start: number, length: number][], value = 1.5): number[] {
  const residuals = new Array<number>(n).fill(0);
  for (const [start, length] of bursts) residuals.fill(value, start, start + length);
  return residuals;
}

const iso = (k: number, samplePeriodS = 1) => new Date(k * samplePeriodS * 1000).toISOString();

describe('replayRules: band', () => {
  // limit 1, 3 samples over to raise, 2 samples under 0.8 to clear
  const bandRule = ruleOf(BAND_ID, 'band', band({ limits: [1], raiseAfter: 3, clearAfter: 2, deadband: 0.2 }));
  // Counted by hand: bursts of 3 or more samples at 1.5 raise on their third sample and clear on
  // the second quiet sample after them; the burst of 2 at 3000 never raises. The burst at 4998
  // straddles the evaluator's batch boundary, so it raises only if the counts carry across.
  const bursts: [number, number][] = [
    [100, 3],
    [3000, 2],
    [REPLAY_BATCH - 2, 3],
    [7000, 3],
    [9000, 5],
    [11_990, 3],
  ];
  const raisedAt = [102, REPLAY_BATCH, 7002, 9002, 11_992];
  const clearedAt = [104, REPLAY_BATCH + 2, 7004, 9006, 11_994];

  it('raises once per burst long enough, at the slot the persistence is reached, and clears after it', () => {
    const replay = replayRules(input(withBursts(12_000, bursts), [bandRule]));
    expect(replay.rules).toEqual([{ ruleId: BAND_ID, kind: 'band', priority: 2, enabled: true, raises: 5 }]);
    expect(replay.total).toBe(5);
    expect(replay.alerts.map((a) => a.raisedAt)).toEqual(raisedAt.map((i) => iso(K0 + i)));
    expect(replay.alerts.map((a) => a.clearedAt)).toEqual(clearedAt.map((i) => iso(K0 + i)));
    expect(replay.alerts[0].statistic).toBe('largest |residual| / limit = 1.5 (limit 1)');
    expect(RuleReplaySchema.parse(replay)).toEqual(replay);
  });

  it('replays a disabled rule for its count but leaves it out of the total and the list', () => {
    const replay = replayRules(input(withBursts(12_000, bursts), [{ ...bandRule, enabled: false }]));
    expect(replay.rules[0]).toMatchObject({ enabled: false, raises: 5 });
    expect(replay.total).toBe(0);
    expect(replay.alerts).toEqual([]);
    expect(replay.perDay).toBe(0);
  });

  it('a slot without a prediction breaks the run, as a missing slot does', () => {
    const residuals = [0, 1.5, 1.5, 1.5, 1.5, 0, 0, 0];
    expect(replayRules(input(residuals, [bandRule])).total).toBe(1);
    expect(replayRules(input(residuals, [bandRule], { noPrediction: [3] })).total).toBe(0);
    expect(replayRules(input(residuals, [bandRule], { k: [0, 1, 2, 4, 5, 6, 7, 8].map((d) => K0 + d) })).total).toBe(0);
  });

  it('lists the first alerts only, counts them all, and leaves an alert still raised at the end uncleared', () => {
    const many = Array.from({ length: 300 }, (_, i): [number, number] => [10 * i, 3]);
    const residuals = withBursts(3000, many);
    residuals.push(1.5, 1.5, 1.5, 1.5);
    const replay = replayRules(input(residuals, [bandRule]));
    expect(replay.total).toBe(301);
    expect(replay.rules[0].raises).toBe(301);
    expect(replay.alerts).toHaveLength(200);
    expect(replay.alerts[199].raisedAt).toBe(iso(K0 + 10 * 199 + 2));
    expect(replay.alerts.every((a) => a.clearedAt !== null)).toBe(true);
    const tail = replayRules(input([0, 1.5, 1.5, 1.5, 1.5], [bandRule]));
    expect(tail.alerts).toEqual([expect.objectContaining({ raisedAt: iso(K0 + 3), clearedAt: null })]);
  });
});

describe('replayRules: stale', () => {
  const staleRule = ruleOf(STALE_ID, 'stale', { afterSamples: 5 });

  it('a gap of at least afterSamples missing slots raises once at k_before + afterSamples and clears at the next reading', () => {
    // readings at 0…9, 14…19 (4 missing: no raise), 25…29 (5 missing: raise at 24), 42 (12 missing: raise at 34)
    const offsets = [...range(0, 10), ...range(14, 20), ...range(25, 30), 42];
    const T = 2.5;
    const replay = replayRules(
      input(
        offsets.map(() => 0),
        [staleRule],
        { k: offsets.map((d) => K0 + d), samplePeriodS: T },
      ),
    );
    expect(replay.total).toBe(2);
    expect(replay.alerts).toEqual([
      {
        ruleId: STALE_ID,
        kind: 'stale',
        raisedAt: iso(K0 + 24, T),
        clearedAt: iso(K0 + 25, T),
        statistic: 'samples without a reading = 5 (limit 5)',
      },
      {
        ruleId: STALE_ID,
        kind: 'stale',
        raisedAt: iso(K0 + 34, T),
        clearedAt: iso(K0 + 42, T),
        statistic: 'samples without a reading = 12 (limit 5)',
      },
    ]);
  });

  it('merges stale and band alerts in time order across a batch boundary', () => {
    const bandRule = ruleOf(BAND_ID, 'band', band({ limits: [1], raiseAfter: 3, clearAfter: 2, deadband: 0.2 }));
    const n = REPLAY_BATCH + 1000;
    // a gap of 7 missing slots just before the first reading of the second batch
    const k = range(0, n).map((i) => K0 + i + (i >= REPLAY_BATCH ? 7 : 0));
    const residuals = withBursts(n, [
      [REPLAY_BATCH - 20, 3],
      [REPLAY_BATCH + 10, 3],
    ]);
    const replay = replayRules(input(residuals, [bandRule, staleRule], { k }));
    expect(replay.alerts.map((a) => [a.kind, a.raisedAt])).toEqual([
      ['band', iso(K0 + REPLAY_BATCH - 18)],
      ['stale', iso(K0 + REPLAY_BATCH - 1 + 5)],
      ['band', iso(K0 + REPLAY_BATCH + 7 + 12)],
    ]);
    expect(replay.alerts[1].clearedAt).toBe(iso(K0 + REPLAY_BATCH + 7));
  });
});

describe('replayRules: cusum', () => {
  it('raises and clears where the Page recursion puts it on a step of 1.5σ', () => {
    // Page (Biometrika 41, 1954): upper(n) = max(0, upper(n−1) + z − k). With z = 1.5, k = 0.5 the
    // sum is n after n samples and first exceeds h = 4 at n = 5 (index 4). Held at CUSUM_HOLD·h
    // while raised, it falls by k per zero residual and reaches 0 after CUSUM_HOLD·h/k of them.
    const h = 4;
    const residuals = [...new Array<number>(20).fill(1.5), ...new Array<number>(40).fill(0)];
    const rule = ruleOf(CUSUM_ID, 'cusum', cusum({ k: 0.5, h, sigma: [1] }));
    const replay = replayRules(input(residuals, [rule]));
    expect(replay.total).toBe(1);
    expect(replay.alerts[0].raisedAt).toBe(iso(K0 + 4));
    expect(replay.alerts[0].clearedAt).toBe(iso(K0 + 20 + (CUSUM_HOLD * h) / 0.5 - 1));
    expect(replay.alerts[0].statistic).toBe('largest CUSUM sum (σ) = 5 (limit 4)');
  });
});

describe('replayRules: days and checks', () => {
  it('days = slots × T / 86,400 with the missing slots counted; perDay = total / days', () => {
    const bandRule = ruleOf(BAND_ID, 'band', band({ limits: [1], raiseAfter: 1, clearAfter: 1, deadband: 0 }));
    // 10 s period, slots 0 … 8639: exactly one day, of which only 4 readings are present
    const replay = replayRules(
      input([2, 0, 2, 0], [bandRule], { k: [0, 1, 5000, 8639].map((d) => K0 + d), samplePeriodS: 10 }),
    );
    expect(replay.days).toBe(1);
    expect(replay.total).toBe(2);
    expect(replay.perDay).toBe(2);
    expect(replay.targetPerDay).toBe(3);
    const empty = replayRules(input([], [bandRule]));
    expect([empty.days, empty.perDay, empty.total]).toEqual([0, 0, 0]);
  });

  it('names what does not fit', () => {
    const base = input([0, 0, 0], []);
    expect(() => replayRules({ ...base, predicted: new Float64Array(2) })).toThrow(
      /predicted holds 2 values, expected 3×1/,
    );
    expect(() => replayRules({ ...base, ctx: context(2) })).toThrow(/rule context has 2 outputs, the recording 1/);
    expect(() => replayRules({ ...base, k: Float64Array.from([3, 2, 4]) })).toThrow(/k\[1\] = 2 after 3/);
  });
});

function range(from: number, to: number): number[] {
  return Array.from({ length: to - from }, (_, i) => from + i);
}
