import { describe, expect, it } from 'vitest';
import { BacktestComparisonSchema, type VersionBacktest } from '../../../contracts/backtests.js';
import { compareVersions } from '../comparison.js';

const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const DO = { name: 'DO', unit: 'mg/L' };
const PH = { name: 'pH', unit: '' };

/** A version's backtest with these one-step (and free-run) fit % per output and this many replayed alerts. */
function version(
  number: number,
  fits: (number | null)[],
  alerts: number,
  extra: { wasActive?: boolean; diverged?: boolean; freeRun?: (number | null)[] } = {},
): VersionBacktest {
  const run = (mode: 'one_step' | 'free_run', values: (number | null)[]) => ({
    mode,
    correction: 'kalman' as const,
    outputs: values.map((fitPercent, i) => ({
      name: `y${i + 1}`,
      unit: '',
      scored: 1000,
      fitPercent,
      rmse: 1,
      residualMean: 0,
      residualStd: 1,
      autocorrelation: null,
    })),
  });
  return {
    versionId: id(number),
    versionNumber: number,
    versionStatus: extra.wasActive ? 'active' : 'draft',
    wasActive: extra.wasActive ?? false,
    oneStep: run('one_step', fits),
    freeRun: run('free_run', extra.freeRun ?? fits),
    replay: { rules: [], alerts: [], total: alerts, days: 7, perDay: alerts / 7, targetPerDay: 5 },
    suggestion: { sigma: null, band: null, cusum: null, sentence: '' },
    diverged: extra.diverged ?? false,
  };
}

const active = (fits: (number | null)[], alerts: number, extra = {}) =>
  version(3, fits, alerts, { wasActive: true, ...extra });

describe('compareVersions: who is compared', () => {
  it('the newest-numbered version that was not active against the active one', () => {
    const c = compareVersions([version(2, [50], 1), active([70], 9), version(5, [80], 4)], [DO]);
    expect(c?.candidateVersionId).toBe(id(5));
    expect(c?.activeVersionId).toBe(id(3));
    expect(c?.outputs).toEqual([{ name: 'DO', unit: 'mg/L', fitDelta: 10, freeRunFitDelta: 10 }]);
    expect([c?.alertsCandidate, c?.alertsActive]).toEqual([4, 9]);
    expect(BacktestComparisonSchema.parse(c)).toEqual(c);
  });

  it('is null without an active version or without a candidate', () => {
    expect(compareVersions([version(4, [80], 1), version(5, [80], 1)], [DO])).toBeNull();
    expect(compareVersions([active([80], 1)], [DO])).toBeNull();
  });

  it('the deltas are candidate − active per output, one-step and free-run apart; null when a fit is missing', () => {
    const c = compareVersions(
      [version(4, [90.5, null], 0, { freeRun: [60, 40] }), active([80.25, 70], 0, { freeRun: [75, 30] })],
      [DO, PH],
    );
    expect(c?.outputs).toEqual([
      { name: 'DO', unit: 'mg/L', fitDelta: 10.25, freeRunFitDelta: -15 },
      { name: 'pH', unit: '', fitDelta: null, freeRunFitDelta: 10 },
    ]);
  });
});

describe('compareVersions: verdict', () => {
  it('better', () => {
    const c = compareVersions([version(4, [92.3], 2), active([80.1], 19)], [DO]);
    expect(c?.verdict).toBe(
      'Version 4 fits DO 12 points better than active version 3 (one step ahead) and would have raised 2 alerts instead of 19.',
    );
    expect(c?.better).toBe('candidate');
  });

  it('worse, with one decimal under 2 points', () => {
    const c = compareVersions([version(4, [78.66], 20), active([80.1], 1)], [DO]);
    expect(c?.verdict).toBe(
      'Version 4 fits DO 1.4 points worse than active version 3 (one step ahead) and would have raised 20 alerts instead of 1.',
    );
    expect(c?.better).toBe('active');
  });

  it('the same within 1 point, and the same alerts: nothing speaks for the change', () => {
    const c = compareVersions([version(4, [80.5], 7), active([80.1], 7)], [DO]);
    expect(c?.verdict).toBe(
      'Version 4 fits DO the same as active version 3 (within 1 point, one step ahead) and would have raised the same number of alerts (7).',
    );
    expect(c?.better).toBe('active');
    expect(compareVersions([version(4, [80.5], 1), active([80.1], 7)], [DO])?.better).toBe('candidate');
  });

  it('mixed when the fit and the alerts disagree', () => {
    const c = compareVersions([version(4, [95], 30), active([80], 1)], [DO]);
    expect(c?.verdict).toBe(
      'Version 4 fits DO 15 points better than active version 3 (one step ahead) and would have raised 30 alerts instead of 1.',
    );
    expect(c?.better).toBe('mixed');
  });

  it('mixed when the outputs disagree; two outputs are named each', () => {
    const c = compareVersions([version(4, [95, 60], 1), active([80, 70], 1)], [DO, PH]);
    expect(c?.verdict).toBe(
      'Version 4 fits DO 15 points better than active version 3 (one step ahead) and pH 10 points worse, and would have raised the same number of alerts (1).',
    );
    expect(c?.better).toBe('mixed');
    const same = compareVersions([version(4, [95, 70.2], 1), active([80, 70], 1)], [DO, PH]);
    expect(same?.verdict).toContain(
      'DO 15 points better than active version 3 (one step ahead) and pH the same (within 1 point), and',
    );
    expect(same?.better).toBe('candidate');
  });

  it('more than two outputs: the largest difference, and how many pull the other way', () => {
    const outputs = [DO, PH, { name: 'T', unit: '°C' }, { name: 'F', unit: 'm³/h' }];
    const c = compareVersions([version(4, [81, 60, 90, 75], 1), active([80, 70, 60, 70], 1)], outputs);
    expect(c?.verdict).toBe(
      'Version 4 fits T 30 points better than active version 3 (one step ahead; the largest difference of 4 outputs), while 1 other output fits worse, and would have raised the same number of alerts (1).',
    );
    expect(c?.better).toBe('mixed');
  });

  it('says which output has no fit, and when none has', () => {
    const c = compareVersions([version(4, [92, null], 2), active([80, 50], 19)], [DO, PH]);
    expect(c?.verdict).toBe(
      'Version 4 fits DO 12 points better than active version 3 (one step ahead) and has no fit for pH to compare, and would have raised 2 alerts instead of 19.',
    );
    expect(c?.better).toBe('candidate');
    const none = compareVersions([version(4, [null], 2), active([null], 19)], [DO]);
    expect(none?.verdict).toBe(
      'Version 4 and active version 3 have no fit to compare on this recording (each output is constant or has too few readings); version 4 would have raised 2 alerts instead of 19.',
    );
    expect(none?.better).toBe('candidate');
  });

  it('a diverged version', () => {
    const candidate = compareVersions([version(4, [10], 200, { diverged: true }), active([80], 19)], [DO]);
    expect(candidate?.verdict).toBe(
      'Version 4 diverges on this recording: its predicted state leaves the finite numbers, so its figures stop there. Active version 3 stays finite and would have raised 19 alerts.',
    );
    expect(candidate?.better).toBe('active');
    const theActive = compareVersions([version(4, [90], 1), active([10], 19, { diverged: true })], [DO]);
    expect(theActive?.verdict).toMatch(
      /^Active version 3 diverges on this recording: .* Version 4 stays finite and would have raised 1 alert\.$/,
    );
    expect(theActive?.better).toBe('candidate');
    const both = compareVersions([version(4, [9], 1, { diverged: true }), active([10], 19, { diverged: true })], [DO]);
    expect(both?.verdict).toMatch(/both diverge on this recording/);
    expect(both?.better).toBe('mixed');
  });
});
