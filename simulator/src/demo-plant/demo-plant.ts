import type { ActiveModel } from '../registry/hot-swap.js';
import { demoSeconds } from './fault-schedule.js';
import { createPlantLoop, type PlantLoop } from './plant-loop.js';
import { profileFor } from './quillmere.js';
import type { ReadingPoster } from './reading-poster.js';

export interface DemoPlantDeps {
  /** The demo loops with the model version that was active when the plant started. */
  loops: ActiveModel[];
  poster: ReadingPoster;
  speed: number;
  seed: number;
  log: (line: string) => void;
  now?: () => number;
}

interface Played {
  loopId: string;
  periodMs: number;
  plant: PlantLoop;
  /** The next slot to read. */
  k: number;
}

/** A plant reads a slot a moment after its boundary, as a historian bridge would forward it. */
const postDelayMs = (periodMs: number) => Math.min(0.05 * periodMs, 500);
/** After a long pause the plant jumps ahead rather than replaying more than this many slots. */
const MAX_REPLAY = 100;

/**
 * The demo plant: plays each demo loop on its sample grid (slot k at k·T), one timer for all, and
 * posts every reading through the ingest API. The plant's "truth" is fixed when it starts: later
 * model versions change the twins, not the plant.
 */
export function createDemoPlant(deps: DemoPlantDeps) {
  const now = deps.now ?? Date.now;
  const startedMs = now();
  const played: Played[] = deps.loops.flatMap((active, i) => {
    const profile = profileFor(active.loopTag);
    if (!profile) return [];
    const periodMs = Math.round(active.samplePeriodS * 1000);
    return [
      {
        loopId: active.loopId,
        periodMs,
        plant: createPlantLoop(active.model, profile, deps.seed + 101 * i),
        k: Math.ceil(startedMs / periodMs),
      },
    ];
  });
  let timer: NodeJS.Timeout | undefined;
  let stopped = false;

  const dueAt = (loop: Played) => loop.k * loop.periodMs + postDelayMs(loop.periodMs);

  function tick(): void {
    const nowMs = now();
    for (const loop of played) {
      if (nowMs - dueAt(loop) > MAX_REPLAY * loop.periodMs) loop.k = Math.floor(nowMs / loop.periodMs) - MAX_REPLAY;
      while (dueAt(loop) <= nowMs) {
        const slotMs = loop.k * loop.periodMs;
        const reading = loop.plant.sample(demoSeconds(slotMs - startedMs, deps.speed));
        deps.poster.enqueue(loop.loopId, { t: new Date(slotMs).toISOString(), ...reading });
        loop.k += 1;
      }
    }
    void deps.poster.flush();
    schedule();
  }

  function schedule(): void {
    if (stopped || !played.length) return;
    const next = Math.min(...played.map(dueAt));
    // while the api is away, wake for the retry too, not only for the next slot
    const retry = deps.poster.queued() && deps.poster.retryInMs() > 0 ? deps.poster.retryInMs() : Infinity;
    timer = setTimeout(tick, Math.max(0, Math.min(next - now(), retry)));
  }

  return {
    /** The tags this plant plays. */
    tags: deps.loops.filter((l) => profileFor(l.loopTag)).map((l) => l.loopTag),
    start(): void {
      deps.log(`playing ${played.length} loops at ${deps.speed}× demo speed`);
      schedule();
    },
    async stop(): Promise<void> {
      stopped = true;
      clearTimeout(timer);
      await deps.poster.flush();
    },
  };
}
