import type { Backtest, BacktestSummary, Evidence, VersionBacktest } from '@shadowloop/api/contracts';
import { fakeLoop } from '../../../test/registry-fixtures';
import { SIGNED_IN_USER_ID } from '../../../test/fake-api';

export const LOOP_ID = '33333333-3333-4333-8333-333333333333';
export const ACTIVE_ID = '44444444-4444-4444-8444-000000000003';
export const CANDIDATE_ID = '44444444-4444-4444-8444-000000000004';
export const BACKTEST_ID = '66666666-6666-4666-8666-666666666666';
const BAND_RULE = '55555555-5555-4555-8555-000000000001';
const CUSUM_RULE = '55555555-5555-4555-8555-000000000002';

/** The aeration DO loop at 10 s a sample, on London time; version 3 active. */
export const DO_LOOP = fakeLoop({
  id: LOOP_ID,
  tag: 'AER-DO-101',
  name: 'Aeration basin dissolved oxygen',
  area: 'aeration',
  areaName: 'Aeration',
  samplePeriodS: 10,
  inputs: [{ name: 'blower speed', unit: '%' }],
  states: [
    { name: 'dissolved oxygen', unit: 'mg/L' },
    { name: 'uptake', unit: 'mg/L' },
  ],
  outputs: [{ name: 'dissolved oxygen', unit: 'mg/L' }],
  activeVersionId: ACTIVE_ID,
  activeVersionNumber: 3,
  status: 'in_step',
  timeZone: 'Europe/London',
});

/** One day of slots at 10 s, from 2025-06-01 00:00 UTC (01:00 BST). */
export const FROM = '2025-06-01T00:00:00Z';
export const TO = '2025-06-02T00:00:00Z';
const SLOTS = 8640;

/**
 * The whiteness figures of a residual with these correlations, as the contract defines them:
 * band ±1.96/√N, the lags τ ≥ 1 outside it; white when the portmanteau statistic stays under its limit.
 */
function whiteness(correlation: number[], scored: number) {
  const band = 1.96 / Math.sqrt(scored);
  const lagsOutside = correlation.flatMap((r, lag) => (lag > 0 && Math.abs(r) > band ? [lag] : []));
  // Ljung's portmanteau N Σ r(τ)² against χ²₀.₉₅(25) = 37.65 (NIST/SEMATECH e-Handbook, chi-square table)
  const statistic = scored * correlation.slice(1).reduce((sum, r) => sum + r * r, 0);
  const limit = 37.652;
  return { correlation, band, lagsOutside, statistic, limit, white: statistic <= limit, negligible: false };
}

const lags = (outside: Record<number, number>) =>
  Array.from({ length: 26 }, (_, lag) => (lag === 0 ? 1 : (outside[lag] ?? 0.004 * (lag % 3 === 0 ? -1 : 1))));

type FitFigures = { fit: number; rmse: number; mean: number; std: number; correlation: number[] };

function run(mode: 'one_step' | 'free_run', correction: 'free_run' | 'reset' | 'kalman', f: FitFigures) {
  return {
    mode,
    correction,
    outputs: [
      {
        name: 'dissolved oxygen',
        unit: 'mg/L',
        scored: SLOTS,
        fitPercent: f.fit,
        rmse: f.rmse,
        residualMean: f.mean,
        residualStd: f.std,
        autocorrelation: whiteness(f.correlation, SLOTS),
      },
    ],
  };
}

function raise(ruleId: string, kind: string, raisedAt: string, clearedAt: string | null, statistic: string) {
  return { ruleId, kind, raisedAt, clearedAt, statistic };
}

function replay(bandRaises: number, cusumRaises: number, alerts: ReturnType<typeof raise>[]) {
  const days = (SLOTS * 10) / 86_400;
  const total = bandRaises + cusumRaises;
  return {
    rules: [
      { ruleId: BAND_RULE, kind: 'band' as const, priority: 2, enabled: true, raises: bandRaises },
      { ruleId: CUSUM_RULE, kind: 'cusum' as const, priority: 3, enabled: true, raises: cusumRaises },
    ],
    alerts,
    total,
    days,
    perDay: total / days,
    targetPerDay: 6,
  };
}

const suggestion = (sentence: string, sigma: number) => ({
  sigma: [sigma],
  band: { k: 4, persistence: 3, limits: [4 * sigma], falseAlertIntervalSamples: 77_760 },
  cusum: { k: 0.5, h: 5, falseAlertIntervalSamples: 930, detectionDelaySamples: 10 },
  sentence,
});

/** The candidate, version 4, with a Kalman correction: white one-step residuals, two band raises. */
export const CANDIDATE: VersionBacktest = {
  versionId: CANDIDATE_ID,
  versionNumber: 4,
  versionStatus: 'draft',
  wasActive: false,
  oneStep: run('one_step', 'kalman', { fit: 91.2, rmse: 0.041, mean: 0.002, std: 0.041, correlation: lags({}) }),
  freeRun: run('free_run', 'free_run', {
    fit: 78.4,
    rmse: 0.1,
    mean: -0.01,
    std: 0.099,
    correlation: lags({ 1: 0.9, 2: 0.8, 3: 0.7 }),
  }),
  replay: replay(2, 0, [
    raise(BAND_RULE, 'band', '2025-06-01T09:15:00Z', '2025-06-01T09:20:00Z', 'residual 0.21/0.16 mg/L'),
    raise(BAND_RULE, 'band', '2025-06-01T17:42:10Z', null, 'residual 0.19/0.16 mg/L'),
  ]),
  suggestion: suggestion(
    'Band 4σ with 3 samples in a row: about one false alert every 9 days at this sample period.',
    0.041,
  ),
  diverged: false,
};

/** The active version 3, free run only: its residual is correlated and its rules raise 19 times. */
export const ACTIVE: VersionBacktest = {
  versionId: ACTIVE_ID,
  versionNumber: 3,
  versionStatus: 'active',
  wasActive: true,
  oneStep: run('one_step', 'free_run', {
    fit: 79.1,
    rmse: 0.098,
    mean: 0.03,
    std: 0.093,
    correlation: lags({ 1: 0.3, 2: 0.1, 5: -0.05 }),
  }),
  freeRun: run('free_run', 'free_run', {
    fit: 79.1,
    rmse: 0.098,
    mean: 0.03,
    std: 0.093,
    correlation: lags({ 1: 0.3, 2: 0.1, 5: -0.05 }),
  }),
  replay: replay(12, 7, [raise(BAND_RULE, 'band', '2025-06-01T02:00:00Z', '2025-06-01T02:05:00Z', 'r 0.4/0.37')]),
  suggestion: suggestion('Band 4σ with 3 samples in a row: about one false alert every 8 days.', 0.093),
  diverged: false,
};

export const VERDICT =
  'Version 4 fits dissolved oxygen 12 points better than active version 3 (one step ahead) and would have raised 2 alerts instead of 19.';

const person = { id: '77777777-7777-4777-8777-777777777777', name: 'Tobias Renner' };

/** A backtest of versions 4 and 3 over a day of stored readings, in the state asked for. */
export function fakeBacktest(overrides: Partial<Backtest> = {}): Backtest {
  const t = Array.from({ length: 4 }, (_, i) => Date.parse(FROM) + i * 10_000);
  return {
    id: BACKTEST_ID,
    loopId: LOOP_ID,
    loopTag: 'AER-DO-101',
    status: 'succeeded',
    progress: 1,
    stage: 'done',
    source: 'range',
    from: FROM,
    to: TO,
    upload: null,
    versions: [
      // the signed-in test user wrote the candidate, someone else the active version
      { id: CANDIDATE_ID, number: 4, status: 'draft', authorId: SIGNED_IN_USER_ID },
      { id: ACTIVE_ID, number: 3, status: 'active', authorId: person.id },
    ],
    createdBy: person,
    createdAt: '2025-06-02T08:00:00Z',
    startedAt: '2025-06-02T08:00:01Z',
    finishedAt: '2025-06-02T08:00:04Z',
    cancelRequested: false,
    error: null,
    results: {
      versions: [CANDIDATE, ACTIVE],
      comparison: {
        candidateVersionId: CANDIDATE_ID,
        activeVersionId: ACTIVE_ID,
        outputs: [
          {
            name: 'dissolved oxygen',
            unit: 'mg/L',
            fitDelta: 91.2 - 79.1,
            freeRunFitDelta: 78.4 - 79.1,
          },
        ],
        alertsCandidate: 2,
        alertsActive: 19,
        verdict: VERDICT,
        better: 'candidate',
      },
      chart: {
        t,
        measured: [[2.0, 2.1, null, 2.05]],
        predictions: [
          { versionId: CANDIDATE_ID, oneStep: [[2.01, 2.08, 2.1, 2.04]], freeRun: [[1.9, 2.0, 2.0, 2.0]] },
          { versionId: ACTIVE_ID, oneStep: [[1.9, 1.95, 2.0, 2.0]], freeRun: [[1.9, 1.95, 2.0, 2.0]] },
        ],
      },
      samples: { slots: SLOTS, measured: SLOTS - 1, missing: 1 },
      elapsedS: 2.4,
    },
    attachedTo: [],
    ...overrides,
  };
}

/** The same job while it runs: no results yet. */
export const runningBacktest = (progress: number, stage: string): Backtest =>
  fakeBacktest({ status: 'running', progress, stage, finishedAt: null, results: null });

/** As GET /api/v1/loops/{id}/backtests lists it. */
export function summaryOf(backtest: Backtest): BacktestSummary {
  const { results, ...rest } = backtest;
  return { ...rest, verdict: results?.comparison?.verdict ?? null };
}

/** The backtest attached to the candidate, as GET …/model-versions/{id}/evidence answers. */
export function fakeEvidence(note: string | null = 'The week after the diffuser cleaning.'): Evidence {
  return {
    backtestId: BACKTEST_ID,
    versionId: CANDIDATE_ID,
    note,
    attachedBy: person,
    attachedAt: '2025-06-02T08:10:00Z',
    verdict: VERDICT,
    source: 'range',
    from: FROM,
    to: TO,
    fileName: null,
    version: CANDIDATE,
    active: ACTIVE,
  };
}
