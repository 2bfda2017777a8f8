import type { TwinSample } from '../events.js';
import { scheduleNext } from './lease-keeper.js';
import { createLoopTwin, hasFiniteState, type LoopTwin } from './loop-twin.js';
import { dueAtMs, slotAtMs } from './slot-clock.js';
import { prepareLoop, type TickWork } from './tick-prepare.js';
import { ensurePartitions, loadTickReadings, type TickReadings } from './twin-store.js';
import { twinSample } from './twin-sample.js';
import { stepSlot, type SlotReading } from './twin-step.js';
import { createPredictionBatch, saveTwins, type PredictionBatch } from './twin-writes.js';
import { graceMs, type TwinRuntime } from './twin-runtime.js';

const NO_PARTITION = '23514';

/**
 * One tick for every loop due now: one query for all their readings, the steps, the samples
 * emitted, one INSERT of all predictions, the states saved when due. Whatever fails, every loop
 * of the tick is scheduled again (after a pause when the database did not answer).
 */
export async function runTick(rt: TwinRuntime, loopIds: string[]): Promise<void> {
  const startedMs = rt.now();
  const work = loopIds.map((id) => prepareLoop(rt, id, startedMs)).filter((w): w is TickWork => w !== undefined);
  if (!work.length) return;
  let retryAtMs = 0;
  try {
    const loaded = await loadTickReadings(rt.db, work.map(rangeOf));
    const batch = createPredictionBatch();
    const samples: TwinSample[] = [];
    let slots = 0;
    for (const item of work) {
      if (rt.twins.get(item.twin.loopId) !== item.twin) continue; // dropped or swapped meanwhile
      slots += stepWork(rt, item, loaded, batch, samples);
    }
    // samples first: a watcher should not wait for the INSERT, and a sample never depends on it
    for (const sample of samples) rt.emitter.emit(sample);
    const written = await writePredictions(rt, batch);
    await persistWhenDue(rt, startedMs);
    report(rt, work, { slots, written, startedMs });
  } catch (error) {
    retryAtMs = startedMs + rt.options.leaseIntervalMs;
    rt.log(`a tick of ${work.length} loops failed (${(error as Error).message}); trying again shortly`);
  } finally {
    for (const { twin } of work) {
      const current = rt.twins.get(twin.loopId);
      if (current) scheduleNext(rt, current, retryAtMs);
    }
  }
}

const rangeOf = ({ twin, fromK, toK }: TickWork) => ({
  loopId: twin.loopId,
  fromMs: slotAtMs(fromK, twin.periodMs),
  toMs: slotAtMs(toK, twin.periodMs),
});

function readingOf(readings: SlotReading[] | undefined, k: number): SlotReading | undefined {
  if (readings) for (const reading of readings) if (reading.k === k) return reading;
  return undefined;
}

function stepWork(
  rt: TwinRuntime,
  item: TickWork,
  loaded: TickReadings,
  batch: PredictionBatch,
  samples: TwinSample[],
): number {
  let twin = item.twin;
  const readings = loaded.readings.get(twin.loopId);
  for (let k = item.fromK; k <= item.toK; k++) {
    stepSlot(twin, readingOf(readings, k));
    if (!hasFiniteState(twin)) twin = restart(rt, twin);
    batch.add(twin);
  }
  samples.push(twinSample(rt, twin, item.toK, loaded.tracking.get(twin.loopId)));
  return item.toK - item.fromK + 1;
}

/** A state that overflowed (a diverging model fed odd inputs) cannot go on: restart at the operating point. */
function restart(rt: TwinRuntime, twin: LoopTwin): LoopTwin {
  rt.log(
    `${twin.active.loopTag}: the state is no longer finite at slot ${twin.next}; restarting at the operating point`,
  );
  const fresh = createLoopTwin(twin.active, {
    next: twin.next,
    u: twin.u,
    lastMeasuredK: twin.lastMeasuredK,
    staleAfterSamples: twin.staleAfterSamples,
  });
  rt.twins.set(twin.loopId, fresh);
  return fresh;
}

async function writePredictions(rt: TwinRuntime, batch: PredictionBatch): Promise<number> {
  try {
    return await batch.write(rt.db, rt.holder);
  } catch (error) {
    if ((error as { code?: string }).code !== NO_PARTITION) throw error;
    await ensurePartitions(rt.db, rt.now(), 7);
    return batch.write(rt.db, rt.holder);
  }
}

async function persistWhenDue(rt: TwinRuntime, nowMs: number): Promise<void> {
  if (nowMs - rt.lastPersistMs < rt.options.persistIntervalMs) return;
  rt.lastPersistMs = nowMs;
  const dirty = [...rt.twins.values()].filter((t) => t.dirty);
  await saveTwins(rt.db, rt.holder, dirty).catch((error: Error) =>
    rt.log(`saving the twin states failed: ${error.message}`),
  );
}

function report(rt: TwinRuntime, work: TickWork[], done: { slots: number; written: number; startedMs: number }): void {
  const finishedMs = rt.now();
  let maxLagMs = 0;
  for (const { twin, toK } of work)
    maxLagMs = Math.max(maxLagMs, finishedMs - dueAtMs(toK, twin.periodMs, graceMs(rt, twin)));
  const tick = {
    loops: work.length,
    slots: done.slots,
    written: done.written,
    durationMs: finishedMs - done.startedMs,
    maxLagMs,
  };
  rt.counters.slots += done.slots;
  rt.counters.ticks += 1;
  rt.counters.lastTick = tick;
  rt.onTick?.(tick);
}
