import type { Knex } from 'knex';
import type { ActiveModel } from '../registry/hot-swap.js';
import type { LeasedLoop, LeaseTerms } from './leases.js';
import type { LoopTwin } from './loop-twin.js';
import type { SampleEmitter } from './sample-emitter.js';
import type { CatchUpLimits } from './slot-clock.js';
import type { TimerWheel } from './timer-wheel.js';

/** Where the twins get their models: the registry (simulator/src/registry) or anything shaped like it. */
export interface ActiveModelSource {
  get(loopId: string): ActiveModel | undefined;
}

export interface TwinOptions {
  /** A slot is processed this fraction of a sample period after its boundary. */
  graceFraction: number;
  wheelResolutionMs: number;
  wheelBuckets: number;
  leaseIntervalMs: number;
  lease: LeaseTerms;
  catchUp: CatchUpLimits;
  persistIntervalMs: number;
  /** How far back the newest reading is looked for when a loop is adopted (its inputs are held). */
  resumeLookbackMs: number;
}

/** Options as callers give them: any part, the lease terms and catch-up limits also in part. */
export type TwinOptionsInput = Partial<Omit<TwinOptions, 'lease' | 'catchUp'>> & {
  lease?: Partial<LeaseTerms>;
  catchUp?: Partial<CatchUpLimits>;
};

export function twinOptions(input: TwinOptionsInput = {}): TwinOptions {
  const base = DEFAULT_TWIN_OPTIONS;
  return {
    ...base,
    ...input,
    lease: { ...base.lease, ...input.lease },
    catchUp: { ...base.catchUp, ...input.catchUp },
  };
}

export const DEFAULT_TWIN_OPTIONS: TwinOptions = {
  graceFraction: 0.3,
  wheelResolutionMs: 50,
  wheelBuckets: 4096,
  leaseIntervalMs: 1000,
  lease: { ttlSamples: 4, minTtlMs: 3000, maxLoops: 20_000, areas: null },
  catchUp: { maxStepped: 30, maxCoasted: 3600 },
  persistIntervalMs: 5000,
  resumeLookbackMs: 86_400_000,
};

/** What one tick did; `maxLagMs` is how long after its processing time the latest slot was done. */
export interface TickReport {
  loops: number;
  slots: number;
  written: number;
  durationMs: number;
  maxLagMs: number;
}

export interface TwinRuntime {
  db: Knex;
  models: ActiveModelSource;
  emitter: SampleEmitter;
  holder: string;
  options: TwinOptions;
  now: () => number;
  log: (line: string) => void;
  onTick?: (report: TickReport) => void;
  twins: Map<string, LoopTwin>;
  leases: Map<string, { loop: LeasedLoop; validUntilMs: number }>;
  stale: Set<string>;
  wheel: TimerWheel;
  counters: { slots: number; ticks: number; lastTick: TickReport | null };
  lastPersistMs: number;
  partitionsEnsuredMs: number;
}

export const graceMs = (rt: TwinRuntime, twin: LoopTwin) => rt.options.graceFraction * twin.periodMs;
