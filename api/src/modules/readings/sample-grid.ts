/**
 * The sample grid of a loop: slot k sits at k·T after the Unix epoch (T = sample period, taken in
 * whole milliseconds exactly as the simulator's clock takes it, so both name the same slots).
 * A reading at time t goes to the nearest slot, k = round(t / T): jitter up to T/2 is absorbed.
 */
export interface Slot {
  k: number;
  slotMs: number;
}

const periodMs = (samplePeriodS: number) => Math.max(1, Math.round(samplePeriodS * 1000));

export function slotOf(tMs: number, samplePeriodS: number): Slot {
  const k = Math.round(tMs / periodMs(samplePeriodS));
  return { k, slotMs: slotTimeMs(k, samplePeriodS) };
}

export function slotTimeMs(k: number, samplePeriodS: number): number {
  return k * periodMs(samplePeriodS);
}

/** The UTC day (YYYY-MM-DD) of a time: the readings and predictions partitions are per day. */
export const utcDay = (ms: number): string => new Date(ms).toISOString().slice(0, 10);
