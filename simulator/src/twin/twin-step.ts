import { refreshPrediction, type LoopTwin } from './loop-twin.js';

/** A reading of one slot as the store loads it. */
export interface SlotReading {
  k: number;
  u: number[];
  y: number[];
}

/**
 * Processes slot `twin.next` and predicts the next one:
 * 1. u(k) from the reading, else the held inputs;
 * 2. ŷ(k) = C x̂ + D u(k) and, with y(k) measured, the correction x̂ ← x̂ + G (y − ŷ);
 * 3. x̂(k+1) = A x̂ + B u(k), and ŷ(k+1) with u(k) held (u(k+1) is not known yet).
 * Returns true when the slot had a usable reading. Allocates nothing.
 */
export function stepSlot(twin: LoopTwin, reading: SlotReading | undefined): boolean {
  const k = twin.next;
  const measured = reading !== undefined && reading.u.length === twin.u.length && reading.y.length === twin.y.length;
  if (measured) {
    for (let j = 0; j < twin.u.length; j++) twin.u[j] = reading.u[j];
    for (let i = 0; i < twin.y.length; i++) twin.y[i] = reading.y[i];
    twin.lastMeasuredK = k;
  }
  twin.stepper(twin.x, twin.u, twin.scratch, twin.yHat);
  if (measured && twin.corrector.mode !== 'free_run') {
    twin.corrector.correct(twin.x, twin.y, twin.yHat);
    twin.stepper(twin.x, twin.u, twin.scratch, twin.yHat);
  }
  advance(twin);
  return measured;
}

/** Advances `count` slots on the held inputs with no correction (a gap with no readings). */
export function coast(twin: LoopTwin, count: number): void {
  for (let i = 0; i < count; i++) {
    twin.stepper(twin.x, twin.u, twin.scratch, twin.yHat);
    advance(twin, false);
  }
  if (count > 0) refreshPrediction(twin);
}

/** Moves k on without stepping (a gap too long to coast over): the state is kept. */
export function jump(twin: LoopTwin, count: number): void {
  if (count <= 0) return;
  twin.next += count;
  twin.dirty = true;
  refreshPrediction(twin);
}

function advance(twin: LoopTwin, predict = true): void {
  const previous = twin.x;
  twin.x = twin.scratch;
  twin.scratch = previous;
  twin.next += 1;
  twin.dirty = true;
  if (predict) refreshPrediction(twin);
}
