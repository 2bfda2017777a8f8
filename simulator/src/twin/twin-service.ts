import { randomBytes } from 'node:crypto';
import os from 'node:os';
import type { Knex } from 'knex';
import { releaseAll, runLeaseCycle } from './lease-keeper.js';
import { silentEmitter, type SampleEmitter } from './sample-emitter.js';
import { runTick } from './tick.js';
import { createTimerWheel } from './timer-wheel.js';
import { ensurePartitions } from './twin-store.js';
import { saveTwins } from './twin-writes.js';
import {
  twinOptions,
  type ActiveModelSource,
  type TickReport,
  type TwinOptionsInput,
  type TwinRuntime,
} from './twin-runtime.js';

export interface TwinServiceDeps {
  db: Knex;
  models: ActiveModelSource;
  emitter?: SampleEmitter;
  log?: (line: string) => void;
  /** The name on this process's leases; unique per process by default. */
  holder?: string;
  now?: () => number;
  options?: TwinOptionsInput;
  onTick?: (report: TickReport) => void;
}

const PARTITION_CHECK_MS = 3_600_000;

/**
 * The stepping service: leases loops, and steps every leased loop with an active version at each
 * of its slots, all on one timer wheel. Nothing runs until start().
 */
export function createTwinService(deps: TwinServiceDeps) {
  const options = twinOptions(deps.options);
  const now = deps.now ?? Date.now;
  const rt: TwinRuntime = {
    db: deps.db,
    models: deps.models,
    emitter: deps.emitter ?? silentEmitter,
    options,
    now,
    onTick: deps.onTick,
    holder: deps.holder ?? `${os.hostname()}:${process.pid}:${randomBytes(3).toString('hex')}`,
    log: deps.log ?? ((line) => console.log(`twin: ${line}`)),
    twins: new Map(),
    leases: new Map(),
    stale: new Set(),
    wheel: createTimerWheel({ resolutionMs: options.wheelResolutionMs, buckets: options.wheelBuckets, startMs: now() }),
    counters: { slots: 0, ticks: 0, lastTick: null },
    lastPersistMs: now(),
    partitionsEnsuredMs: 0,
  };
  const due = new Set<string>();
  let ticking: Promise<void> | undefined;
  let leasing: Promise<void> | undefined;
  let timers: NodeJS.Timeout[] = [];

  function kick(): void {
    if (ticking || !due.size) return;
    const batch = [...due];
    due.clear();
    ticking = runTick(rt, batch)
      .catch((error: Error) => rt.log(`a tick failed: ${error.message}`))
      .finally(() => {
        ticking = undefined;
        if (timers.length) kick();
      });
  }

  function leaseCycle(): void {
    if (leasing) return;
    leasing = maintainPartitions()
      .then(() => runLeaseCycle(rt))
      .catch((error: Error) => rt.log(`the lease cycle failed: ${error.message}`))
      .finally(() => {
        leasing = undefined;
      });
  }

  async function maintainPartitions(): Promise<void> {
    if (now() - rt.partitionsEnsuredMs < PARTITION_CHECK_MS) return;
    await ensurePartitions(rt.db, now(), 7);
    rt.partitionsEnsuredMs = now();
  }

  return {
    holder: rt.holder,
    /** Claims the first loops before it returns; fails when the database cannot be reached. */
    async start(): Promise<void> {
      await maintainPartitions();
      await runLeaseCycle(rt);
      timers = [
        setInterval(() => {
          for (const id of rt.wheel.advance(now())) due.add(id);
          kick();
        }, options.wheelResolutionMs),
        setInterval(leaseCycle, options.leaseIntervalMs),
      ];
    },
    /**
     * Graceful: waits for the tick in progress, saves every twin and releases the leases. With
     * graceful false it only stops, as if the process had died (tests of the takeover use this).
     */
    async stop({ graceful = true }: { graceful?: boolean } = {}): Promise<void> {
      for (const timer of timers) clearInterval(timer);
      timers = [];
      await Promise.all([ticking, leasing]);
      if (graceful) {
        await saveTwins(rt.db, rt.holder, [...rt.twins.values()]);
        await releaseAll(rt);
      }
      rt.twins.clear();
      rt.leases.clear();
    },
    stats() {
      return {
        leased: rt.leases.size,
        stepping: rt.twins.size,
        stale: rt.stale.size,
        slotsStepped: rt.counters.slots,
        ticks: rt.counters.ticks,
        lastTick: rt.counters.lastTick,
      };
    },
  };
}

export type TwinService = ReturnType<typeof createTwinService>;
