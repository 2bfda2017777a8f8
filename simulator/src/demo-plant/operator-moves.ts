import { DEMO_CYCLE_S } from './fault-schedule.js';
import { uniformAt } from './random.js';

/** An operator's habit on one input: now and then a setpoint move of up to ± amplitude. */
export interface MoveHabit {
  input: number;
  /** Demo seconds between moves; the first interval has none, so a fresh start is calm. */
  everyS: number;
  amplitude: number;
  /** Moves are rounded to this step, as a person types them. */
  step: number;
}

/** A move the script makes at a set time of the cycle (to show a fault: a valve that does not follow). */
export interface ScriptedMove {
  input: number;
  fromS: number;
  untilS: number;
  delta: number;
}

/**
 * The offset from the operating point of input `input` at demo time t: the habit's current move
 * (fixed per interval by the seed, so a replay makes the same moves) plus any scripted move.
 */
export function inputOffset(
  input: number,
  tS: number,
  seed: number,
  habits: MoveHabit[],
  scripted: ScriptedMove[],
): number {
  let offset = 0;
  for (const habit of habits) {
    if (habit.input !== input) continue;
    const interval = Math.floor(tS / habit.everyS);
    if (interval <= 0) continue;
    const draw = 2 * uniformAt(seed + 31 * habit.input, interval) - 1;
    offset += Math.round((habit.amplitude * draw) / habit.step) * habit.step;
  }
  const inCycle = ((tS % DEMO_CYCLE_S) + DEMO_CYCLE_S) % DEMO_CYCLE_S;
  for (const move of scripted)
    if (move.input === input && inCycle >= move.fromS && inCycle < move.untilS) offset += move.delta;
  return offset;
}
