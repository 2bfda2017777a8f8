import { z } from 'zod';
import { jsonField, MappingFieldSchema } from './ingest.js';

/**
 * Backtests: one or more model versions of a loop replayed over recorded readings (a range of the
 * stored readings, or an uploaded CSV kept apart from live data), as a background job. Model-fit
 * figures follow L. Ljung, System Identification: Theory for the User, 2nd ed., 1999, ch. 16.
 */
export const BACKTEST_LIMITS = {
  /** Versions compared in one backtest. */
  maxVersions: 4,
  /** Slots in one backtest (about 35 days at 1 s). */
  maxSamples: 3_000_000,
  /**
   * Values one backtest holds in memory as doubles: per slot the slot index, the inputs and
   * outputs, and for each version its two replays of the outputs (one step ahead and free run).
   * 40 million values (320 MB): 3,000,000 slots of a 1-input 1-output loop with 4 versions, or
   * about 650,000 slots of a loop with 10 inputs and 10 outputs and 2 versions.
   */
  maxValues: 40_000_000,
  /** Lags of the residual autocorrelation, τ = 0 … maxLag. */
  maxLag: 25,
  /** Points of the measured-against-predicted chart (min and max per bucket). */
  chartPoints: 2000,
  /** Replayed alerts listed one by one (the counts cover all of them). */
  listedAlerts: 200,
} as const;

export const BACKTEST_STATUSES = ['queued', 'running', 'succeeded', 'failed', 'cancelled'] as const;
export const BacktestStatusSchema = z.enum(BACKTEST_STATUSES);
export type BacktestStatus = z.infer<typeof BacktestStatusSchema>;

const Iso = z.iso.datetime({ offset: true });
const VersionIds = z
  .array(z.uuid())
  .min(1, 'pick at least one model version')
  .max(BACKTEST_LIMITS.maxVersions, `compare at most ${BACKTEST_LIMITS.maxVersions} versions at once`)
  .refine((ids) => new Set(ids).size === ids.length, 'each version only once');

/** JSON body of POST /api/v1/loops/{loopId}/backtests over stored readings: [from, to). */
export const BacktestRangeBodySchema = z
  .object({ versionIds: VersionIds, from: Iso, to: Iso })
  .refine((b) => Date.parse(b.to) > Date.parse(b.from), { path: ['to'], message: 'to must be after from' });
export type BacktestRangeBody = z.infer<typeof BacktestRangeBodySchema>;

/**
 * Text fields of the multipart form of the same route with an uploaded CSV (sent before the
 * "file" part): `versionIds` and `mapping` as JSON (the mapping as for a readings import).
 */
export const BacktestUploadFieldsSchema = z.object({
  versionIds: jsonField(VersionIds, 'versionIds must be a JSON array of version ids'),
  mapping: MappingFieldSchema,
});

/** The upload's tally, as a readings import reports it (lines count the header as line 1). */
export const BacktestUploadTallySchema = z.object({
  fileName: z.string(),
  rowsRead: z.number().int(),
  accepted: z.number().int(),
  duplicates: z.number().int(),
  rejected: z.number().int(),
  badRows: z.array(z.object({ line: z.number().int(), reason: z.string() })),
});

/** 202 answer of POST …/backtests. */
export const BacktestCreatedSchema = z.object({
  id: z.uuid(),
  status: BacktestStatusSchema,
  upload: BacktestUploadTallySchema.nullable(),
});

/** Sample autocorrelation r(τ) of a residual with the 95 % whiteness band ±1.96/√N. */
export const AutocorrelationSchema = z.object({
  /** r(0) … r(maxLag); r(0) = 1. */
  correlation: z.array(z.number()),
  band: z.number(),
  lagsOutside: z.array(z.number().int()),
  /** Ljung's portmanteau N Σ r(τ)², τ = 1 … maxLag, and its 95 % limit χ²₀.₉₅(maxLag). */
  statistic: z.number(),
  limit: z.number(),
  /** statistic ≤ limit: white at the 5 % level (a lag or two outside the band happen by chance). */
  white: z.boolean(),
  /** True when the residual is at rounding level (RMS ≤ 1e-9 × the signal's spread): white by definition. */
  negligible: z.boolean(),
});

/** Figures of one output over the scored slots (slots with a measurement and a prediction). */
export const OutputFitSchema = z.object({
  name: z.string(),
  unit: z.string(),
  scored: z.number().int(),
  /** 100 · (1 − ‖y − ŷ‖ / ‖y − ȳ‖); null when y is constant over the range. */
  fitPercent: z.number().nullable(),
  /** √(mean (y − ŷ)²), in the output's unit. */
  rmse: z.number().nullable(),
  residualMean: z.number().nullable(),
  residualStd: z.number().nullable(),
  autocorrelation: AutocorrelationSchema.nullable(),
});

/**
 * One replay of a version: `one_step` applies the version's own correction with each measurement
 * and predicts the next slot (what the live twin does); `free_run` sees only the inputs. Both start
 * from the initial state fitted by least squares to the first samples.
 */
export const ReplayRunSchema = z.object({
  mode: z.enum(['one_step', 'free_run']),
  /** The correction applied: free_run when the version has none (then both runs agree). */
  correction: z.enum(['free_run', 'reset', 'kalman']),
  /** Why the correction applied differs from the version's (e.g. a gain that cannot be used); null when it does not. */
  note: z.string().nullable().optional(),
  outputs: z.array(OutputFitSchema),
});

/** The loop's drift rules replayed on a version's one-step residuals. */
export const RuleReplaySchema = z.object({
  rules: z.array(
    z.object({
      ruleId: z.uuid(),
      kind: z.enum(['band', 'cusum', 'nis', 'stale']),
      priority: z.number().int(),
      enabled: z.boolean(),
      raises: z.number().int(),
    }),
  ),
  /** The first BACKTEST_LIMITS.listedAlerts raises in time order. */
  alerts: z.array(
    z.object({ ruleId: z.uuid(), kind: z.string(), raisedAt: Iso, clearedAt: Iso.nullable(), statistic: z.string() }),
  ),
  total: z.number().int(),
  /** The range's length in days (slots × period). */
  days: z.number(),
  perDay: z.number(),
  /** The alert-load report's target per day (alert settings), for comparison. */
  targetPerDay: z.number(),
});

/** Rule settings suggested from the one-step residual statistics, with their expected false-alert interval. */
export const RuleSuggestionSchema = z.object({
  /** Residual standard deviation per output (output units); null when an output had too few samples. */
  sigma: z.array(z.number()).nullable(),
  band: z
    .object({
      k: z.number(),
      persistence: z.number().int(),
      limits: z.array(z.number()),
      falseAlertIntervalSamples: z.number(),
    })
    .nullable(),
  cusum: z
    .object({ k: z.number(), h: z.number(), falseAlertIntervalSamples: z.number(), detectionDelaySamples: z.number() })
    .nullable(),
  /** The suggestion in words, with the intervals in plain time at the loop's sample period. */
  sentence: z.string(),
});

export const VersionBacktestSchema = z.object({
  versionId: z.uuid(),
  versionNumber: z.number().int(),
  /** The version's status when the backtest finished. */
  versionStatus: z.string(),
  /** The loop's active version at that time. */
  wasActive: z.boolean(),
  oneStep: ReplayRunSchema,
  freeRun: ReplayRunSchema,
  replay: RuleReplaySchema,
  suggestion: RuleSuggestionSchema,
  /** The version's predicted state left the finite numbers (an unstable free run): figures stop there. */
  diverged: z.boolean(),
});
export type VersionBacktest = z.infer<typeof VersionBacktestSchema>;

/** Candidate (the newest version in the backtest that is not active) against the active version. */
export const BacktestComparisonSchema = z.object({
  candidateVersionId: z.uuid(),
  activeVersionId: z.uuid(),
  outputs: z.array(
    z.object({
      name: z.string(),
      unit: z.string(),
      /** One-step fit points: candidate − active (positive: the candidate fits better). */
      fitDelta: z.number().nullable(),
      freeRunFitDelta: z.number().nullable(),
    }),
  ),
  alertsCandidate: z.number().int(),
  alertsActive: z.number().int(),
  /** e.g. "Version 4 fits DO 12 points better than active version 3 and would have raised 2 alerts instead of 19." */
  verdict: z.string(),
  /** Which way the evidence points. */
  better: z.enum(['candidate', 'active', 'mixed']),
});

/**
 * Min/max-decimated series for the chart: per bucket the smallest and the largest value of each
 * series, at the bucket's first and last slot times (null where a slot had no value).
 */
export const BacktestChartSchema = z.object({
  t: z.array(z.number()),
  measured: z.array(z.array(z.number().nullable())),
  predictions: z.array(
    z.object({
      versionId: z.uuid(),
      oneStep: z.array(z.array(z.number().nullable())),
      freeRun: z.array(z.array(z.number().nullable())),
    }),
  ),
});

export const BacktestResultsSchema = z.object({
  versions: z.array(VersionBacktestSchema),
  comparison: BacktestComparisonSchema.nullable(),
  chart: BacktestChartSchema,
  /** Slots from the first to the last reading; measured: slots with a reading. */
  samples: z.object({ slots: z.number().int(), measured: z.number().int(), missing: z.number().int() }),
  /** Seconds of computation, for the record. */
  elapsedS: z.number(),
});
export type BacktestResults = z.infer<typeof BacktestResultsSchema>;

const Person = z.object({ id: z.uuid(), name: z.string() }).nullable();

export const BacktestSchema = z.object({
  id: z.uuid(),
  loopId: z.uuid(),
  loopTag: z.string(),
  status: BacktestStatusSchema,
  /** 0 … 1. */
  progress: z.number(),
  /** What the job does now, in words ("reading the recording", "replaying version 4"…). */
  stage: z.string(),
  source: z.enum(['range', 'upload']),
  from: Iso.nullable(),
  to: Iso.nullable(),
  upload: BacktestUploadTallySchema.nullable(),
  /** Who wrote each version: only its author may attach evidence to it. */
  versions: z.array(
    z.object({ id: z.uuid(), number: z.number().int(), status: z.string(), authorId: z.uuid().nullable() }),
  ),
  createdBy: Person,
  createdAt: Iso,
  startedAt: Iso.nullable(),
  finishedAt: Iso.nullable(),
  cancelRequested: z.boolean(),
  error: z.string().nullable(),
  /** Null until the job succeeded. */
  results: BacktestResultsSchema.nullable(),
  /** Versions this backtest is attached to as evidence. */
  attachedTo: z.array(z.object({ versionId: z.uuid(), versionNumber: z.number().int() })),
});
export type Backtest = z.infer<typeof BacktestSchema>;

/** GET /api/v1/loops/{loopId}/backtests: newest first, without results. */
export const BacktestSummarySchema = BacktestSchema.omit({ results: true }).extend({
  verdict: z.string().nullable(),
});
export type BacktestSummary = z.infer<typeof BacktestSummarySchema>;

/** POST /api/v1/model-versions/{id}/evidence. */
export const AttachEvidenceBodySchema = z.object({
  backtestId: z.uuid(),
  note: z.string().trim().max(2000).optional(),
});

/** A backtest attached to a version (shown on the review page). */
export const EvidenceSchema = z.object({
  backtestId: z.uuid(),
  versionId: z.uuid(),
  note: z.string().nullable(),
  attachedBy: Person,
  attachedAt: Iso,
  /** The backtest's comparison verdict, or a sentence of the version's own figures when it had no comparison. */
  verdict: z.string(),
  source: z.enum(['range', 'upload']),
  from: Iso.nullable(),
  to: Iso.nullable(),
  fileName: z.string().nullable(),
  /** This version's figures in that backtest. */
  version: VersionBacktestSchema,
  /** The active version's figures in that backtest, when it took part. */
  active: VersionBacktestSchema.nullable(),
});
export type Evidence = z.infer<typeof EvidenceSchema>;
