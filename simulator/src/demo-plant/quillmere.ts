import type { FaultKind } from './fault-schedule.js';
import type { MoveHabit, ScriptedMove } from './operator-moves.js';
import type { Mismatch } from './true-model.js';

/** What a fault does to one loop of the plant, at its current level (0 to 1). */
export type FaultEffect =
  /** Fouled diffusers transfer less oxygen for the same blower speed: the effective input falls. */
  | { kind: Extract<FaultKind, 'diffuser_fouling'>; input: number; lostGain: number }
  /** A transmitter's reading walks away from the true value. */
  | { kind: Extract<FaultKind, 'transmitter_drift'>; output: number; offset: number }
  /** The valve stays where it was while its command moves on. */
  | { kind: Extract<FaultKind, 'sticking_valve'>; input: number }
  /** The analyser repeats its last value. */
  | { kind: Extract<FaultKind, 'frozen_analyser'>; output: number };

/** How the demo plays one loop of the invented Quillmere works. Noise σ are per sample, in the signals' units. */
export interface PlantProfile {
  tag: string;
  mismatch: Mismatch;
  processNoise: number[];
  sensorNoise: number[];
  habits: MoveHabit[];
  scripted: ScriptedMove[];
  fault: FaultEffect;
}

/** The demo loops by tag (seeded by seeds/02_registry_demo.ts); a loop whose tag is not here is left alone. */
export const QUILLMERE_PROFILES: PlantProfile[] = [
  {
    tag: 'AER-DO-101',
    mismatch: { gain: 0.97, timeScale: 1.05 },
    processNoise: [8, 0.004],
    sensorNoise: [0.02],
    habits: [{ input: 0, everyS: 300, amplitude: 4, step: 1 }],
    scripted: [],
    fault: { kind: 'diffuser_fouling', input: 0, lostGain: 0.25 },
  },
  {
    tag: 'STO-LT-201',
    mismatch: { gain: 1.03, timeScale: 0.97 },
    processNoise: [0.002, 0.002],
    sensorNoise: [0.004, 0.004],
    habits: [{ input: 0, everyS: 600, amplitude: 60, step: 10 }],
    scripted: [],
    fault: { kind: 'transmitter_drift', output: 1, offset: 0.8 },
  },
  {
    tag: 'DIG-TT-301',
    mismatch: { gain: 0.97, timeScale: 1.04 },
    processNoise: [0.003, 0.03, 0.01],
    sensorNoise: [0.08, 0.15, 0.15],
    habits: [{ input: 0, everyS: 900, amplitude: 5, step: 1 }],
    // the operator opens the valve further while it sticks: the command moves, the valve does not
    scripted: [{ input: 0, fromS: 660, untilS: 1080, delta: 15 }],
    fault: { kind: 'sticking_valve', input: 0 },
  },
  {
    tag: 'DIS-CL-401',
    mismatch: { gain: 1.04, timeScale: 0.97 },
    processNoise: [0.002, 0.001, 0.001, 0.0005],
    sensorNoise: [0.01],
    habits: [{ input: 0, everyS: 420, amplitude: 1.5, step: 0.5 }],
    // a dose increase the frozen analyser never shows
    scripted: [{ input: 0, fromS: 870, untilS: 1470, delta: 8 }],
    fault: { kind: 'frozen_analyser', output: 0 },
  },
];

export const profileFor = (tag: string) => QUILLMERE_PROFILES.find((p) => p.tag === tag);
