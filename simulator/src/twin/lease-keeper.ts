import { claimLeases, leaseTtlMs, releaseLeases, type LeasedLoop } from './leases.js';
import { createLoopTwin, type LoopTwin } from './loop-twin.js';
import { dueAtMs, lastDueSlot, periodMsOf } from './slot-clock.js';
import { loadNewestReadings, loadSavedTwins, type SavedTwin } from './twin-store.js';
import { saveTwins } from './twin-writes.js';
import type { TwinRuntime } from './twin-runtime.js';

/**
 * One lease cycle: claim and renew in bulk, drop the loops that are no longer ours, and adopt the
 * new ones, resuming from their saved state when there is one.
 */
export async function runLeaseCycle(rt: TwinRuntime): Promise<void> {
  const startedMs = rt.now();
  const held = await claimLeases(rt.db, rt.holder, rt.options.lease);
  const heldIds = new Set(held.map((l) => l.loopId));
  const lost = [...rt.leases.keys()].filter((loopId) => !heldIds.has(loopId));
  for (const loopId of lost) drop(rt, loopId, 'its lease was not renewed (taken over, or no active version)');
  // a loop that lost its active version is not renewed but still leased: give it back now
  if (lost.length) await releaseLeases(rt.db, rt.holder, [...heldIds]);
  for (const loop of held) {
    rt.leases.set(loop.loopId, {
      loop,
      validUntilMs: startedMs + leaseTtlMs(rt.options.lease, loop.samplePeriodS) - rt.options.leaseIntervalMs,
    });
    const twin = rt.twins.get(loop.loopId);
    if (twin) twin.staleAfterSamples = loop.staleAfterSamples;
  }
  await adopt(
    rt,
    held.filter((l) => !rt.twins.has(l.loopId) && rt.models.get(l.loopId)),
  );
}

export function drop(rt: TwinRuntime, loopId: string, why: string): void {
  rt.leases.delete(loopId);
  rt.wheel.cancel(loopId);
  rt.stale.delete(loopId);
  if (rt.twins.delete(loopId)) rt.log(`stopped stepping loop ${loopId}: ${why}`);
}

async function adopt(rt: TwinRuntime, loops: LeasedLoop[]): Promise<void> {
  if (!loops.length) return;
  const ids = loops.map((l) => l.loopId);
  const now = rt.now();
  const [saved, newest] = await Promise.all([
    loadSavedTwins(rt.db, ids),
    loadNewestReadings(rt.db, ids, now - rt.options.resumeLookbackMs, now),
  ]);
  let resumed = 0;
  const adopted: LoopTwin[] = [];
  for (const loop of loops) {
    const active = rt.models.get(loop.loopId);
    if (!active || rt.twins.has(loop.loopId) || !rt.leases.has(loop.loopId)) continue;
    const periodMs = periodMsOf(active.samplePeriodS);
    const current = lastDueSlot(now, periodMs, rt.options.graceFraction * periodMs);
    const start = resumePoint(saved.get(loop.loopId), active.version.id, active.model.A.length, current);
    if (start.why) rt.log(`${active.loopTag}: ${start.why}`);
    if (start.x) resumed += 1;
    const reading = newest.get(loop.loopId);
    const twin = createLoopTwin(active, {
      next: start.next,
      x: start.x,
      u: reading?.u,
      staleAfterSamples: loop.staleAfterSamples,
      lastMeasuredK: saved.get(loop.loopId)?.lastMeasuredK ?? reading?.k ?? null,
    });
    if (twin.corrector.note) rt.log(`${active.loopTag}: ${twin.corrector.note}`);
    rt.twins.set(loop.loopId, twin);
    adopted.push(twin);
    schedule(rt, twin);
  }
  // saved at once: the api counts a loop as having a twin from its saved state on
  await saveTwins(rt.db, rt.holder, adopted);
  rt.log(`adopted ${loops.length} loop${loops.length === 1 ? '' : 's'} (${resumed} resumed from their saved state)`);
}

/**
 * A saved twin resumes at its own slot (the gap since is caught up on the next tick, bounded) with
 * its state when the version is the same or has as many states; otherwise the twin starts at the
 * operating point at the current slot. A saved slot ahead of the clock (the clock went back) is
 * not trusted.
 */
export function resumePoint(
  saved: SavedTwin | undefined,
  versionId: string,
  states: number,
  current: number,
): { next: number; x?: number[]; why?: string } {
  if (!saved) return { next: current };
  if (saved.k > current + 1)
    return { next: current, why: `the saved slot ${saved.k} is ahead of the clock (slot ${current}): starts afresh` };
  if (saved.x.length !== states)
    return {
      next: current,
      why: `the saved state has ${saved.x.length} states, the active version ${states}: starts afresh at the operating point`,
    };
  const why =
    saved.versionId === versionId ? undefined : 'resumes the state saved under another version (same number of states)';
  return { next: saved.k, x: saved.x, why };
}

export function schedule(rt: TwinRuntime, twin: LoopTwin): void {
  scheduleNext(rt, twin, 0);
}

/** Puts the twin's next slot on the wheel, not before `notBeforeMs` (a pause after a failure). */
export function scheduleNext(rt: TwinRuntime, twin: LoopTwin, notBeforeMs: number): void {
  const due = dueAtMs(twin.next, twin.periodMs, rt.options.graceFraction * twin.periodMs);
  rt.wheel.schedule(twin.loopId, Math.max(due, notBeforeMs));
}

/** At stop: every lease of this holder is given back, so another process takes the loops at once. */
export async function releaseAll(rt: TwinRuntime): Promise<void> {
  const released = await releaseLeases(rt.db, rt.holder);
  rt.leases.clear();
  rt.log(`released ${released} lease${released === 1 ? '' : 's'}`);
}
