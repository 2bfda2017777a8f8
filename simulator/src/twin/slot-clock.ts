/**
 * The sample grid of a loop: slot k sits at k·T after the Unix epoch. The twin processes slot k a
 * little after its boundary (the grace), so that the reading of slot k has usually arrived.
 */

/** The period in whole milliseconds as the grid uses it (slot times are then exact integers). */
export const periodMsOf = (samplePeriodS: number) => Math.round(samplePeriodS * 1000);

/** Time of slot k in milliseconds since the epoch. */
export const slotAtMs = (k: number, periodMs: number) => k * periodMs;

/** When slot k is processed: its boundary plus the grace. */
export const dueAtMs = (k: number, periodMs: number, graceMs: number) => k * periodMs + graceMs;

/** The newest slot whose processing time has come at `nowMs`. */
export const lastDueSlot = (nowMs: number, periodMs: number, graceMs: number) =>
  Math.floor((nowMs - graceMs) / periodMs);

export interface CatchUpLimits {
  /** Slots stepped with their readings in one go; older missed slots are coasted. */
  maxStepped: number;
  /** Slots coasted on held inputs in one go; a longer gap is jumped over with the state kept. */
  maxCoasted: number;
}

/** How a loop whose next slot is `next` reaches slot `last` (inclusive). */
export interface CatchUpPlan {
  /** Slots advanced on held inputs with no reading and no prediction written. */
  coast: number;
  /** Slots jumped over entirely (the state is kept, k moves on). */
  jump: number;
  /** First and last slot stepped normally: readings applied, predictions written. */
  stepFrom: number;
  stepTo: number;
}

/**
 * After a pause (a blocked event loop, a restart, a lease taken over) the newest `maxStepped`
 * slots are stepped with their readings; the part of the gap before them is coasted on held
 * inputs up to `maxCoasted` slots, and whatever is older still is jumped. The work of one catch-up
 * is therefore bounded whatever the length of the gap.
 */
export function catchUpPlan(next: number, last: number, limits: CatchUpLimits): CatchUpPlan {
  if (last < next) return { coast: 0, jump: 0, stepFrom: next, stepTo: next - 1 };
  const stepFrom = Math.max(next, last - limits.maxStepped + 1);
  const gap = stepFrom - next;
  const coast = Math.min(gap, limits.maxCoasted);
  return { coast, jump: gap - coast, stepFrom, stepTo: last };
}
