import type { Matrix, StateSpaceModel } from '../engine/index.js';

/** A loop's active model version as the registry loads it. */
export interface ActiveModel {
  loopId: string;
  loopTag: string;
  samplePeriodS: number;
  version: { id: string; number: number };
  /** The matrices with the loop's operating point (x0, u0, y0). */
  model: StateSpaceModel;
  correction: { mode: 'free_run' | 'reset' | 'kalman'; K: Matrix | null };
}

/** The running twin of one loop: its model and its state x (engineering units) at sample k. */
export interface TwinSlot extends ActiveModel {
  x: number[];
  k: number;
}

export interface SwapResult {
  twin: TwinSlot;
  /** True when the previous twin's state was carried over. */
  carried: boolean;
  /** What happened to the state, in words for the log. */
  reason: string;
}

/** The activation message on the channel: the loop and its newly active version (null: none). */
export interface ActivationNotice {
  loopId: string;
  versionId: string | null;
}

const operatingState = (incoming: ActiveModel) => incoming.model.x0?.slice() ?? incoming.model.A.map(() => 0);

/**
 * Replaces a loop's twin at sample k. The state is physical (engineering units), so when the new
 * version has as many states it is carried across unchanged and the twin continues without a jump;
 * when the state dimension changes the old state means nothing to the new model, and the twin
 * restarts from the new version's operating point.
 */
export function swapTwin(current: TwinSlot | undefined, incoming: ActiveModel, k: number): SwapResult {
  const states = incoming.model.A.length;
  if (!current) {
    return {
      twin: { ...incoming, x: operatingState(incoming), k },
      carried: false,
      reason: 'no twin was running: starts from the operating point',
    };
  }
  if (current.x.length === states) {
    return {
      twin: { ...incoming, x: current.x.slice(), k },
      carried: true,
      reason: `state carried across (${states} states)`,
    };
  }
  return {
    twin: { ...incoming, x: operatingState(incoming), k },
    carried: false,
    reason: `re-initialised at the operating point: the state dimension changed from ${current.x.length} to ${states}`,
  };
}

/** The first sample boundary strictly after `nowMs` on the grid originMs + k·T. */
export function nextSampleBoundary(nowMs: number, samplePeriodS: number, originMs = 0): { k: number; atMs: number } {
  const periodMs = samplePeriodS * 1000;
  const k = Math.floor((nowMs - originMs) / periodMs) + 1;
  return { k, atMs: originMs + k * periodMs };
}

/** Reads a notification payload; undefined when it is not an activation notice. */
export function parseActivationNotice(payload: string | undefined): ActivationNotice | undefined {
  try {
    const value = JSON.parse(payload ?? '') as Partial<ActivationNotice>;
    if (typeof value.loopId !== 'string') return undefined;
    return { loopId: value.loopId, versionId: typeof value.versionId === 'string' ? value.versionId : null };
  } catch {
    return undefined;
  }
}
