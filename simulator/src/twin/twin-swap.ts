import { swapTwin, type ActiveModel } from '../registry/hot-swap.js';
import { createLoopTwin, type LoopTwin } from './loop-twin.js';

export interface LoopTwinSwap {
  twin: LoopTwin;
  carried: boolean;
  /** In words, for the log. */
  reason: string;
}

/**
 * Replaces a running twin by the loop's newly active version at its next slot. The state rule is
 * the registry's ({@link swapTwin}): the state is physical, so it is carried across when the new
 * version has as many states, and re-initialised at the new operating point otherwise. The held
 * inputs, the slot counter and the staleness count carry over; new buffers, stepper and corrector
 * are built for the new matrices.
 */
export function swapLoopTwin(current: LoopTwin, incoming: ActiveModel): LoopTwinSwap {
  const running = { ...current.active, x: Array.from(current.x), k: current.next };
  const result = swapTwin(running, incoming, current.next);
  const twin = createLoopTwin(incoming, {
    next: current.next,
    x: result.twin.x,
    u: current.u,
    lastMeasuredK: current.lastMeasuredK,
    adoptedAt: current.adoptedAt,
    staleAfterSamples: current.staleAfterSamples,
  });
  const note = twin.corrector.note ? `; ${twin.corrector.note}` : '';
  return { twin, carried: result.carried, reason: `${result.reason}${note}` };
}
