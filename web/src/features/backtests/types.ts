import type {
  Backtest,
  BACKTEST_LIMITS,
  BacktestResults,
  BacktestStatus,
  BacktestSummary,
  Evidence,
  ImportMapping,
  VersionBacktest,
} from '@shadowloop/api/contracts';

export type { Backtest, BacktestResults, BacktestStatus, BacktestSummary, Evidence, VersionBacktest };

/** The 202 answer of POST …/backtests. */
export type BacktestCreated = Pick<Backtest, 'id' | 'status' | 'upload'>;
export type UploadTally = NonNullable<Backtest['upload']>;
export type Comparison = NonNullable<BacktestResults['comparison']>;
export type BacktestChart = BacktestResults['chart'];
export type ReplayRun = VersionBacktest['oneStep'];
export type OutputFit = ReplayRun['outputs'][number];
export type Autocorrelation = NonNullable<OutputFit['autocorrelation']>;
export type RuleReplay = VersionBacktest['replay'];

/** What a new backtest replays: a range of the stored readings, or an uploaded CSV. */
export type BacktestSource =
  { source: 'range'; from: string; to: string } | { source: 'upload'; mapping: ImportMapping; file: File };

export type BacktestRequest = BacktestSource & { versionIds: string[] };

type Limits = typeof BACKTEST_LIMITS;

/**
 * The contract's limits, typed as its literals so the compiler refuses a value that drifts from
 * it; the app does not load the contract's schemas at run time.
 */
export const LIMITS: Pick<Limits, 'maxVersions' | 'maxSamples' | 'maxLag'> = {
  maxVersions: 4,
  maxSamples: 3_000_000,
  maxLag: 25,
};
