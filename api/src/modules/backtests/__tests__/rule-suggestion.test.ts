import { cusumArl, normalCdf, persistenceArl } from '@shadowloop/simulator/engine';
import { describe, expect, it } from 'vitest';
import { RuleSuggestionSchema } from '../../../contracts/backtests.js';
import { plainDuration } from '../../drift-rules/plain-duration.js';
import { expectationOf } from '../../drift-rules/rule-expectation.js';
import {
  CUSUM_H_GRID,
  BAND_K_GRID,
  MIN_SCORED_FOR_SUGGESTION,
  TARGET_INTERVAL_S,
  bandMultiple,
  suggestRules,
} from '../rule-suggestion.js';

const HOUR = 3600;

describe('suggestRules: sigma', () => {
  it('is null with a sentence naming the output when one has too few scored residuals', () => {
    const s = suggestRules(
      [
        { std: 0.2, scored: 5000 },
        { std: 0.1, scored: MIN_SCORED_FOR_SUGGESTION - 1 },
      ],
      1,
    );
    expect(s).toEqual({
      sigma: null,
      band: null,
      cusum: null,
      sentence: `Rule settings are suggested from at least 100 one-step residuals per output; output 2 has 99.`,
    });
    expect(suggestRules([{ std: null, scored: 500 }], 1).sigma).toBeNull();
    expect(suggestRules([{ std: 0, scored: 500 }], 1, ['Level']).sentence).toBe(
      'The one-step residual of Level has no spread over this recording (the version predicts it exactly), so no limit can be set from it.',
    );
  });

  it('is the residual standard deviation per output, to three figures, and the band limits k·sigma', () => {
    const s = suggestRules(
      [
        { std: 0.123456, scored: 100 },
        { std: 2.5, scored: 4000 },
      ],
      1,
    );
    expect(s.sigma).toEqual([0.123, 2.5]);
    const k = s.band!.k;
    expect(s.band?.limits).toEqual([Number((k * 0.123).toPrecision(3)), Number((k * 2.5).toPrecision(3))]);
    expect(RuleSuggestionSchema.parse(s)).toEqual(s);
  });
});

describe('suggestRules: band', () => {
  it('3 in a row at k·σ: Feller’s run length at the per-sample exceedance of normal residuals on all outputs', () => {
    for (const outputs of [1, 3]) {
      const s = suggestRules(
        Array.from({ length: outputs }, () => ({ std: 0.5, scored: 1000 })),
        10,
      );
      const k = s.band!.k;
      // p = 1 − (1 − 2Φ(−k))^outputs; ARL = (1 − p³) / ((1 − p) p³) (Feller, vol. 1, 3rd ed., §XIII.7)
      const p = 1 - (1 - 2 * normalCdf(-k)) ** outputs;
      expect(s.band?.persistence).toBe(3);
      expect(s.band!.falseAlertIntervalSamples / persistenceArl(p, 3)).toBeCloseTo(1, 9);
      expect(s.band!.falseAlertIntervalSamples / ((1 - p ** 3) / ((1 - p) * p ** 3))).toBeCloseTo(1, 9);
      // the Rules editor shows the same figure for the same rule
      const editor = expectationOf(
        'band',
        { mode: 'sigma', k, sigma: s.sigma!, raiseAfter: 3, clearAfter: 1, deadband: 0 },
        10,
        outputs,
      );
      expect(s.band?.falseAlertIntervalSamples).toBe(editor.falseAlertIntervalSamples);
    }
  });

  it('takes the k of the grid whose false-alert interval is nearest a week, no nearer on either side', () => {
    const week = (k: number, outputs: number, period: number) => {
      const p = 1 - (1 - 2 * normalCdf(-k)) ** outputs;
      return Math.abs(Math.log((persistenceArl(p, 3) * period) / TARGET_INTERVAL_S));
    };
    for (const [outputs, period] of [
      [1, 1],
      [2, 1],
      [1, 60],
      [4, 0.5],
    ]) {
      const k = bandMultiple(outputs, period);
      const i = BAND_K_GRID.indexOf(k);
      if (i > 0) expect(week(k, outputs, period)).toBeLessThanOrEqual(week(BAND_K_GRID[i - 1], outputs, period));
      if (i < BAND_K_GRID.length - 1)
        expect(week(k, outputs, period)).toBeLessThanOrEqual(week(BAND_K_GRID[i + 1], outputs, period));
    }
    // at 1 s and one output a week is 604,800 samples: (1 − p³)/((1 − p)p³) ≈ 1/p³ gives p ≈ 0.0118,
    // and 2Φ(−k) = 0.0118 at k ≈ 2.52, so 2.5 is the grid's nearest
    expect(bandMultiple(1, 1)).toBe(2.5);
  });
});

describe('suggestRules: cusum', () => {
  it('at one sample an hour, h = 4: the two-sided ARL 168 is one week (Lucas & Crosier 1982, Table 1)', () => {
    const s = suggestRules([{ std: 1, scored: 500 }], HOUR);
    expect(s.cusum?.k).toBe(0.5);
    expect(s.cusum?.h).toBe(4);
    // J. M. Lucas and R. B. Crosier, Technometrics 24(3), 1982, Table 1: k = 0.5, h = 4, ARL 168
    expect(Math.round(s.cusum!.falseAlertIntervalSamples)).toBe(168);
    // D. C. Montgomery, Introduction to Statistical Quality Control, 6th ed., §9.1.3: k = ½, h = 4, 1σ shift: ARL 8.38
    expect(s.cusum?.detectionDelaySamples).toBeCloseTo(8.38, 2);
    expect(s.sentence).toContain(
      `CUSUM k 0.5, h 4 (chosen for about one false alert a week): about one false alert every ${plainDuration(s.cusum!.falseAlertIntervalSamples * HOUR)}`,
    );
  });

  it('h is the grid value whose interval for all outputs is nearest one week on a log scale', () => {
    for (const [samplePeriodS, outputs] of [
      [1, 1],
      [1, 2],
      [60, 1],
      [0.1, 3],
    ] as const) {
      const s = suggestRules(
        Array.from({ length: outputs }, () => ({ std: 1, scored: 500 })),
        samplePeriodS,
      );
      const h = s.cusum!.h;
      const target = TARGET_INTERVAL_S / samplePeriodS;
      const miss = (hh: number) =>
        Math.abs(Math.log(cusumArl({ k: 0.5, h: hh, shift: 0, twoSided: true }) / outputs / target));
      const i = CUSUM_H_GRID.indexOf(h);
      expect(i).toBeGreaterThan(0);
      expect(i).toBeLessThan(CUSUM_H_GRID.length - 1);
      expect(miss(h)).toBeLessThanOrEqual(miss(CUSUM_H_GRID[i - 1]));
      expect(miss(h)).toBeLessThanOrEqual(miss(CUSUM_H_GRID[i + 1]));
      // the figures are the Rules editor's for that rule: in-control ARL / outputs, delay at 1σ
      const editor = expectationOf('cusum', { k: 0.5, h, sigma: s.sigma!, shift: 1 }, samplePeriodS, outputs);
      expect(s.cusum?.falseAlertIntervalSamples).toBeCloseTo(editor.falseAlertIntervalSamples!, 6);
      expect(s.cusum?.detectionDelaySamples).toBeCloseTo(editor.detectionDelaySamples!, 9);
    }
  });

  it('stays on the grid at either end, and says so', () => {
    const slow = suggestRules([{ std: 1, scored: 500 }], 86_400);
    expect(slow.cusum?.h).toBe(CUSUM_H_GRID[0]);
    expect(slow.sentence).toContain('h 4 (the smallest h suggested)');
    const fast = suggestRules([{ std: 1, scored: 500 }], 1e-4);
    expect(fast.cusum?.h).toBe(CUSUM_H_GRID[CUSUM_H_GRID.length - 1]);
    expect(fast.sentence).toContain('h 20 (the largest h suggested)');
  });

  it('says both intervals in plain time at the sample period', () => {
    const s = suggestRules([{ std: 0.3, scored: 10_000 }], 60);
    expect(s.sentence).toMatch(
      new RegExp(
        `^Band ${s.band!.k}σ with 3 samples in a row \\(so that a single bad reading does not raise; chosen for about one false alert a week\\): about one false alert every ${plainDuration(s.band!.falseAlertIntervalSamples * 60)} at this sample period\\. CUSUM k 0\\.5, h ${s.cusum!.h} `,
      ),
    );
    expect(s.sentence).toContain('a 1σ shift raises it after about');
  });
});
