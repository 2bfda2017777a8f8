/** One hierarchy for backtest queries; a version's evidence hangs off the version it is attached to. */
export const backtestKeys = {
  all: ['backtests'] as const,
  forLoop: (loopId: string) => [...backtestKeys.all, 'loop', loopId] as const,
  detail: (backtestId: string) => [...backtestKeys.all, 'detail', backtestId] as const,
  evidence: (versionId: string) => [...backtestKeys.all, 'evidence', versionId] as const,
};

/** The job still changes: its page and the loop's list ask again every second. */
export const isUnfinished = (status: string): boolean => status === 'queued' || status === 'running';

export const POLL_MS = 1000;
