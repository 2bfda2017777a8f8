import { createStepper, type StateSpaceModel } from '../engine/index.js';
import { faultLevels } from './fault-schedule.js';
import { inputOffset } from './operator-moves.js';
import type { PlantProfile } from './quillmere.js';
import { seededNormal } from './random.js';
import { perturbModel } from './true-model.js';

export interface PlantReading {
  /** The commanded inputs (what the plant's historian records). */
  u: number[];
  /** The measured outputs. */
  y: number[];
}

/**
 * One loop of the demo plant: its "true" dynamics (the registered model slightly off), driven by
 * the operator's commands, with process and sensor noise and its scripted fault. Every call of
 * `sample` reads slot k and moves the true state on to slot k+1.
 */
export function createPlantLoop(model: StateSpaceModel, profile: PlantProfile, seed: number) {
  const truth = perturbModel(model, profile.mismatch);
  const step = createStepper(truth);
  const n = model.A.length;
  const m = model.B[0].length;
  const p = model.C ? model.C.length : n;
  const u0 = model.u0 ?? new Array<number>(m).fill(0);
  let x = Float64Array.from(model.x0 ?? new Array<number>(n).fill(0));
  let xNext = new Float64Array(n);
  const command = new Float64Array(m);
  const actual = new Float64Array(m);
  const yTrue = new Float64Array(p);
  const noise = seededNormal(seed);
  const fault = profile.fault;
  let held: number | null = null;

  /** The value a sticking valve or a frozen analyser keeps: caught when the fault begins. */
  function hold(level: number, current: number): number {
    if (level <= 0) {
      held = null;
      return current;
    }
    held ??= current;
    return held;
  }

  return {
    sample(tS: number): PlantReading {
      const level = faultLevels(tS)[fault.kind];
      for (let j = 0; j < m; j++) command[j] = u0[j] + inputOffset(j, tS, seed, profile.habits, profile.scripted);
      actual.set(command);
      if (fault.kind === 'diffuser_fouling') actual[fault.input] *= 1 - fault.lostGain * level;
      if (fault.kind === 'sticking_valve') actual[fault.input] = hold(level, command[fault.input]);
      step(x, actual, xNext, yTrue);
      const y = Array.from(yTrue, (v, i) => v + (profile.sensorNoise[i] ?? 0) * noise());
      if (fault.kind === 'transmitter_drift') y[fault.output] += fault.offset * level;
      if (fault.kind === 'frozen_analyser') y[fault.output] = hold(level, y[fault.output]);
      for (let i = 0; i < n; i++) xNext[i] += (profile.processNoise[i] ?? 0) * noise();
      [x, xNext] = [xNext, x];
      return { u: Array.from(command), y };
    },
    /** The true state (for tests). */
    state: () => Array.from(x),
  };
}

export type PlantLoop = ReturnType<typeof createPlantLoop>;
