import { queryOptions } from '@tanstack/react-query';
import { getSeries } from '../../twin/api/get-series';
import { alertKeys } from './alert-keys';

/** Samples shown before and after the raise. */
export const SNAPSHOT_BEFORE_SAMPLES = 60;
export const SNAPSHOT_AFTER_SAMPLES = 20;

export function snapshotWindow(raisedAt: string, samplePeriodS: number): { fromMs: number; toMs: number } {
  const raisedMs = Date.parse(raisedAt);
  const periodMs = samplePeriodS * 1000;
  return { fromMs: raisedMs - SNAPSHOT_BEFORE_SAMPLES * periodMs, toMs: raisedMs + SNAPSHOT_AFTER_SAMPLES * periodMs };
}

/** The slot the raise judged (a late reading's slot lies before the raise time); else the raise time. */
export const raiseSlotOf = (alert: { raisedAt: string; detail?: { slotAt?: string } }) =>
  alert.detail?.slotAt ?? alert.raisedAt;

/** The loop's stored series around the raise: measured and predicted, at full resolution. */
export function alertSnapshotQueryOptions(
  alert: { id: string; loopId: string; raisedAt: string; detail?: { slotAt?: string } },
  samplePeriodS: number,
) {
  const { fromMs, toMs } = snapshotWindow(raiseSlotOf(alert), samplePeriodS);
  return queryOptions({
    queryKey: alertKeys.snapshot(alert.id, fromMs, toMs),
    queryFn: ({ signal }) => getSeries({ loopId: alert.loopId, fromMs, toMs, maxPoints: 400 }, signal),
    staleTime: 60_000,
  });
}
