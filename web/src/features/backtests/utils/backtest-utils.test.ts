import { BACKTEST_LIMITS, BacktestSchema, BacktestSummarySchema, EvidenceSchema } from '@shadowloop/api/contracts';
import { describe, expect, it } from 'vitest';
import {
  ACTIVE,
  ACTIVE_ID,
  CANDIDATE,
  CANDIDATE_ID,
  fakeBacktest,
  fakeEvidence,
  summaryOf,
} from '../testing/fake-backtests';
import { LIMITS } from '../types';
import { alertLoadVerdict } from './alert-load-words';
import { autocorrelationData } from './autocorrelation-chart';
import { pointsText, sourceText, versionNumbersText, whitenessText } from './backtest-words';
import { evidenceFitRows } from './evidence-rows';
import { predictionChartData, predictionLines } from './prediction-chart';
import { rangeProblem } from './range-problem';
import { defaultVersionIds, toggleVersion } from './version-defaults';

describe('the backtest fixtures and limits', () => {
  it('match the contract, so the screens are tested against what the api sends', () => {
    expect(() => BacktestSchema.parse(fakeBacktest())).not.toThrow();
    expect(() => BacktestSummarySchema.parse(summaryOf(fakeBacktest()))).not.toThrow();
    expect(() => EvidenceSchema.parse(fakeEvidence())).not.toThrow();
    expect(LIMITS).toEqual({
      maxVersions: BACKTEST_LIMITS.maxVersions,
      maxSamples: BACKTEST_LIMITS.maxSamples,
      maxLag: BACKTEST_LIMITS.maxLag,
    });
  });
});

describe('backtest words', () => {
  const correlation = () => Array.from({ length: 26 }, (_, lag) => (lag === 0 ? 1 : 0));

  it('reads Ljung’s whiteness check out against the band ±1.96/√N', () => {
    // N = 10,000 gives the band 1.96/√10,000 = 0.0196, shown to two significant figures.
    const band = 1.96 / Math.sqrt(10_000);
    // the limit is χ²₀.₉₅(25) = 37.652 (NIST/SEMATECH e-Handbook, upper critical values of chi-square)
    const base = { correlation: correlation(), band, negligible: false, limit: 37.652 };
    expect(whitenessText({ ...base, lagsOutside: [1, 2, 7], statistic: 61.2, white: false })).toBe(
      'not white: N·Σr² = 61.2, limit 37.7; 3 of 25 lags outside ±0.02',
    );
    expect(whitenessText({ ...base, lagsOutside: [], statistic: 20.4, white: true })).toBe(
      'white (N·Σr² = 20.4, limit 37.7)',
    );
    expect(whitenessText({ ...base, lagsOutside: [9], statistic: 30, white: true })).toBe(
      'white (N·Σr² = 30, limit 37.7; 1 of 25 lags outside ±0.02, within chance)',
    );
    expect(whitenessText({ ...base, lagsOutside: [], statistic: 0, white: true, negligible: true })).toBe(
      'white (the residual is at rounding level)',
    );
    expect(whitenessText(null)).toBe('too few samples to judge');
  });

  it('names versions, fit differences and the recording in plain words', () => {
    expect(versionNumbersText([4, 3])).toBe('versions 3 and 4');
    expect(versionNumbersText([2, 5, 1])).toBe('versions 1, 2 and 5');
    expect(versionNumbersText([7])).toBe('version 7');
    expect(pointsText(12.1)).toBe('+12 points');
    expect(pointsText(-0.44)).toBe('−0.4 points');
    expect(pointsText(1)).toBe('+1 point');
    expect(pointsText(null)).toBe('—');
    expect(sourceText(fakeBacktest(), 'Europe/London')).toBe('2025-06-01 01:00 BST to 2025-06-02 01:00 BST');
    const upload = {
      tally: { fileName: 'week-23.csv', rowsRead: 0, accepted: 0, duplicates: 0, rejected: 0, badRows: [] },
    };
    expect(sourceText({ source: 'upload', from: null, to: null, upload: upload.tally }, 'UTC')).toBe(
      'uploaded file week-23.csv',
    );
  });
});

describe('a range of stored readings', () => {
  const T = 10;
  const from = Date.parse('2025-06-01T00:00:00Z');

  it('takes up to the contract’s slot limit and refuses one slot more, saying how long the limit is', () => {
    // 3,000,000 slots × 10 s = 3 × 10⁷ s = 347.2 days, said to two significant figures.
    expect(rangeProblem(from, from + BACKTEST_LIMITS.maxSamples * T * 1000, T)).toBeNull();
    expect(rangeProblem(from, from + (BACKTEST_LIMITS.maxSamples + 1) * T * 1000, T)).toBe(
      'That range holds about 3,000,001 samples at 10 s a sample; a backtest takes at most 3,000,000 (350 d). Choose a shorter range.',
    );
  });

  it('needs both ends, the start first', () => {
    expect(rangeProblem(NaN, from, T)).toBe('Enter both a start and an end.');
    expect(rangeProblem(from, from, T)).toBe('The start must be before the end.');
  });
});

describe('the versions a backtest starts with', () => {
  const v = (number: number, status: 'draft' | 'in_review' | 'active' | 'retired' | 'approved') => ({
    id: `v${number}`,
    number,
    status,
  });

  it('are the newest draft or version in review and the active one', () => {
    expect(defaultVersionIds([v(1, 'retired'), v(2, 'active'), v(3, 'draft'), v(4, 'in_review')])).toEqual([
      'v4',
      'v2',
    ]);
    expect(defaultVersionIds([v(1, 'active'), v(2, 'approved')])).toEqual(['v1']);
    expect(defaultVersionIds([])).toEqual([]);
  });

  it('never ticks more than the contract allows', () => {
    const full = Array.from({ length: BACKTEST_LIMITS.maxVersions }, (_, i) => `v${i}`);
    expect(toggleVersion(full, 'extra', true)).toEqual(full);
    expect(toggleVersion(['a'], 'b', true)).toEqual(['a', 'b']);
    expect(toggleVersion(['a', 'b'], 'a', false)).toEqual(['b']);
  });
});

describe('chart data', () => {
  const results = fakeBacktest().results!;
  const versions = [
    { id: CANDIDATE_ID, number: 4 },
    { id: ACTIVE_ID, number: 3 },
  ];

  it('puts the slot times (ms) on the plant-time axis in seconds, measured first, then each version', () => {
    const data = predictionChartData(results.chart, 0, versions, false);
    expect(data[0]).toEqual(results.chart.t.map((ms) => ms / 1000));
    expect(data.slice(1)).toEqual([
      results.chart.measured[0],
      results.chart.predictions[0].oneStep[0],
      results.chart.predictions[1].oneStep[0],
    ]);
    const withFreeRuns = predictionChartData(results.chart, 0, versions, true);
    expect(withFreeRuns.slice(4)).toEqual([
      results.chart.predictions[0].freeRun[0],
      results.chart.predictions[1].freeRun[0],
    ]);
    expect(predictionLines(versions, true).map((l) => l.label)).toEqual([
      'version 4, one step ahead',
      'version 3, one step ahead',
      'version 4, free run',
      'version 3, free run',
    ]);
  });

  it('draws lags 1 … maxLag of the autocorrelation between ±band', () => {
    const a = CANDIDATE.oneStep.outputs[0].autocorrelation!;
    const [lags, r, upper, lower] = autocorrelationData(a);
    expect(lags).toEqual(Array.from({ length: BACKTEST_LIMITS.maxLag }, (_, i) => i + 1));
    expect(r).toEqual(a.correlation.slice(1));
    expect(upper).toEqual(lags.map(() => a.band));
    expect(lower).toEqual(lags.map(() => -a.band));
  });
});

describe('the alert load of a replay', () => {
  it('is over the target when the rate per day exceeds it', () => {
    expect(alertLoadVerdict({ total: 19, days: 1, perDay: 19, targetPerDay: 6 })).toEqual({
      word: 'over the target',
      tone: 'drifting',
      sentence: '19 alerts in 1 day: 19 a day against the target of 6 a day.',
    });
    expect(alertLoadVerdict({ total: 1, days: 0.5, perDay: 2, targetPerDay: 6 })).toMatchObject({
      word: 'within the target',
      sentence: '1 alert in 12 h: 2 a day (projected from a shorter range) against the target of 6 a day.',
    });
    // 3,000 slots at 1 s: 3000/86,400 of a day, said as 50 min
    expect(alertLoadVerdict({ total: 0, days: 3000 / 86_400, perDay: 0, targetPerDay: 144 }).sentence).toBe(
      '0 alerts in 50 min: 0 a day (projected from a shorter range) against the target of 144 a day.',
    );
  });
});

describe('evidence rows', () => {
  it('put the version’s figures beside the active version’s, output by output', () => {
    expect(evidenceFitRows(CANDIDATE, ACTIVE)).toEqual([
      {
        name: 'dissolved oxygen',
        unit: 'mg/L',
        oneStep: CANDIDATE.oneStep.outputs[0].fitPercent,
        activeOneStep: ACTIVE.oneStep.outputs[0].fitPercent,
        freeRun: CANDIDATE.freeRun.outputs[0].fitPercent,
        activeFreeRun: ACTIVE.freeRun.outputs[0].fitPercent,
        rmse: CANDIDATE.oneStep.outputs[0].rmse,
        activeRmse: ACTIVE.oneStep.outputs[0].rmse,
      },
    ]);
    expect(evidenceFitRows(CANDIDATE, null)[0]).toMatchObject({ activeOneStep: null, activeRmse: null });
  });
});
