import type { TrackingStatus, TwinSample } from '../events.js';
import { isStale, type LoopTwin } from './loop-twin.js';
import { slotAtMs } from './slot-clock.js';
import type { TwinRuntime } from './twin-runtime.js';

/** Statuses of the api's residual tracking that a sample repeats; the others are the twin's to say. */
const PASSED_THROUGH = new Set<string>(['drifting', 'diverged']);

/**
 * The twin's new prediction, for the slot after `k`. The api sends the measured side of a slot
 * when its reading arrives (with the residual against this very prediction), so the simulator's
 * sample carries no measurement: measured and residual are null, "not yet measured". Its status
 * says whether readings still come: stale after the loop's number of missing samples.
 */
export function twinSample(rt: TwinRuntime, twin: LoopTwin, k: number, tracking: string | undefined): TwinSample {
  const stale = isStale(twin, k);
  if (stale !== rt.stale.has(twin.loopId)) {
    if (stale) rt.stale.add(twin.loopId);
    else rt.stale.delete(twin.loopId);
    const what = stale ? `stale, no reading for ${twin.staleAfterSamples} samples` : 'readings again';
    rt.log(`${twin.active.loopTag}: ${what} (slot ${k})`);
  }
  let status: TrackingStatus = 'in_step';
  if (stale) status = 'stale';
  else if (tracking && PASSED_THROUGH.has(tracking)) status = tracking as TrackingStatus;
  return {
    loopId: twin.loopId,
    t: new Date(slotAtMs(twin.next, twin.periodMs)).toISOString(),
    k: twin.next,
    predicted: Array.from(twin.predicted),
    measured: null,
    residual: null,
    status,
  };
}
