import type { Knex } from 'knex';
import { loadActiveModel, loadActiveModels } from './active-models.js';
import { listenForNotices } from './activation-listener.js';
import { nextSampleBoundary, parseActivationNotice, swapTwin, type ActiveModel, type TwinSlot } from './hot-swap.js';

/** The api NOTIFYs here when a loop's active version changes (api/src/modules/model-versions). */
export const MODEL_ACTIVATED_CHANNEL = 'shadowloop_model_activated';

export interface SwapEvent {
  loopId: string;
  loopTag: string;
  fromVersion: number | null;
  toVersion: number | null;
  /** The sample at which the new version took over. */
  k: number;
  carried: boolean;
  reason: string;
}

export interface TwinRegistryDeps {
  db: Knex;
  databaseUrl: string;
  log: (line: string) => void;
  onSwap?: (event: SwapEvent) => void;
  now?: () => number;
  reconnectDelayMs?: number;
}

/**
 * Keeps every loop's active model version in memory (loopId → twin). It loads them all at start,
 * then follows activations announced on {@link MODEL_ACTIVATED_CHANNEL}: each change is loaded at
 * once and takes over at the loop's next sample boundary, carrying the state when it can.
 */
export function createTwinRegistry(deps: TwinRegistryDeps) {
  const now = deps.now ?? Date.now;
  const twins = new Map<string, TwinSlot>();
  const pending = new Map<string, NodeJS.Timeout>();

  function apply(loopId: string, incoming: ActiveModel | undefined, k: number): void {
    pending.delete(loopId);
    const current = twins.get(loopId);
    if (current?.version.id === incoming?.version.id) return;
    const from = current ? current.version.number : null;
    if (!incoming) {
      twins.delete(loopId);
      return deps.onSwap?.({
        loopId,
        loopTag: current?.loopTag ?? loopId,
        fromVersion: from,
        toVersion: null,
        k,
        carried: false,
        reason: 'no active version: the twin stops',
      });
    }
    const result = swapTwin(current, incoming, k);
    twins.set(loopId, result.twin);
    deps.onSwap?.({
      loopId,
      loopTag: incoming.loopTag,
      fromVersion: from,
      toVersion: incoming.version.number,
      k,
      carried: result.carried,
      reason: result.reason,
    });
  }

  function schedule(loopId: string, incoming: ActiveModel | undefined): void {
    clearTimeout(pending.get(loopId));
    const samplePeriodS = incoming?.samplePeriodS ?? twins.get(loopId)?.samplePeriodS ?? 1;
    const boundary = nextSampleBoundary(now(), samplePeriodS);
    pending.set(
      loopId,
      setTimeout(() => apply(loopId, incoming, boundary.k), Math.max(0, boundary.atMs - now())),
    );
  }

  async function refreshLoop(loopId: string): Promise<void> {
    schedule(loopId, await loadActiveModel(deps.db, loopId, deps.log));
  }

  /** After a reconnection: whatever changed while nobody listened is swapped like a notice. */
  async function refreshAll(first: boolean): Promise<void> {
    const loaded = await loadActiveModels(deps.db, deps.log);
    const seen = new Set(loaded.map((active) => active.loopId));
    for (const active of loaded) {
      if (first) apply(active.loopId, active, nextSampleBoundary(now(), active.samplePeriodS).k - 1);
      else if (twins.get(active.loopId)?.version.id !== active.version.id) schedule(active.loopId, active);
    }
    for (const loopId of twins.keys()) if (!seen.has(loopId)) schedule(loopId, undefined);
  }

  const listener = listenForNotices({
    databaseUrl: deps.databaseUrl,
    channel: MODEL_ACTIVATED_CHANNEL,
    log: deps.log,
    reconnectDelayMs: deps.reconnectDelayMs,
    onListening: refreshAll,
    onNotice: (payload) => {
      const notice = parseActivationNotice(payload);
      if (!notice) return deps.log(`ignored a malformed ${MODEL_ACTIVATED_CHANNEL} notice: ${payload ?? '(empty)'}`);
      refreshLoop(notice.loopId).catch((error: Error) =>
        deps.log(`loading the active version of loop ${notice.loopId} failed: ${error.message}`),
      );
    },
  });

  return {
    /** Listens first, then loads, so no activation can slip between the two. */
    async start(): Promise<void> {
      await listener.start().catch(async (error: unknown) => {
        await listener.stop();
        throw error;
      });
    },
    async stop(): Promise<void> {
      for (const timer of pending.values()) clearTimeout(timer);
      pending.clear();
      await listener.stop();
    },
    get: (loopId: string): TwinSlot | undefined => twins.get(loopId),
    size: () => twins.size,
    isListening: () => listener.isListening(),
  };
}

export type TwinRegistry = ReturnType<typeof createTwinRegistry>;
