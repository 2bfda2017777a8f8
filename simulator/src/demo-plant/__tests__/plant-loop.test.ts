import { describe, expect, it } from 'vitest';
import { FAULT_SCHEDULE } from '../fault-schedule.js';
import { createPlantLoop } from '../plant-loop.js';
import { QUILLMERE_PROFILES, profileFor, type PlantProfile } from '../quillmere.js';

const model = {
  A: [
    [0.8, 0],
    [0.1, 0.9],
  ],
  B: [[1], [0]],
  x0: [10, 5],
  u0: [50],
};
const quiet = (fault: PlantProfile['fault'], scripted: PlantProfile['scripted'] = []): PlantProfile => ({
  tag: 'TEST',
  mismatch: { gain: 1, timeScale: 1 },
  processNoise: [0, 0],
  sensorNoise: [0, 0],
  habits: [],
  scripted,
  fault,
});
const window = (kind: string) => FAULT_SCHEDULE.find((f) => f.kind === kind)!;
const run = (profile: PlantProfile, from: number, count: number) => {
  const plant = createPlantLoop(model, profile, 1);
  return Array.from({ length: count }, (_, i) => plant.sample(from + i));
};

describe('a demo plant loop', () => {
  it('rests at its operating point while nothing happens', () => {
    const readings = run(quiet({ kind: 'frozen_analyser', output: 0 }), 0, 50);
    for (const r of readings) {
      expect(r.u).toEqual([50]);
      r.y.forEach((v, i) => expect(v).toBeCloseTo(model.x0[i], 12));
    }
  });

  it('fouled diffusers: the same command moves the state less', () => {
    const fouling = window('diffuser_fouling');
    const healthy = run(quiet({ kind: 'transmitter_drift', output: 0, offset: 0 }), fouling.endS - 70, 60);
    const fouled = run(quiet({ kind: 'diffuser_fouling', input: 0, lostGain: 0.25 }), fouling.endS - 70, 60);
    expect(fouled.at(-1)!.u).toEqual(healthy.at(-1)!.u);
    // the effective input is 0.75 × 50 = 37.5: 12.5 below the operating point, with a steady gain of 5
    expect(fouled.at(-1)!.y[0]).toBeCloseTo(10 - 12.5 * 5, 1);
  });

  it('a drifting transmitter adds its offset to the reading only', () => {
    const drift = window('transmitter_drift');
    const [reading] = run(
      quiet({ kind: 'transmitter_drift', output: 1, offset: 0.8 }),
      drift.startS + drift.rampS / 2,
      1,
    );
    expect(reading.y[1]).toBeCloseTo(5 + 0.4, 12);
    expect(reading.y[0]).toBeCloseTo(10, 12);
  });

  it('a sticking valve ignores its command, a frozen analyser repeats its value', () => {
    const stuck = window('sticking_valve');
    const move = [{ input: 0, fromS: stuck.startS + 5, untilS: stuck.endS, delta: 15 }];
    const valve = run(quiet({ kind: 'sticking_valve', input: 0 }, move), stuck.startS, 30);
    expect(valve.at(-1)!.u).toEqual([65]);
    expect(valve.at(-1)!.y[0]).toBeCloseTo(10, 12); // the valve stayed at 50

    const frozen = window('frozen_analyser');
    const moved = [{ input: 0, fromS: frozen.startS + 2, untilS: frozen.endS, delta: 10 }];
    const analyser = run(quiet({ kind: 'frozen_analyser', output: 0 }, moved), frozen.startS, 20);
    expect(new Set(analyser.map((r) => r.y[0])).size).toBe(1);
    expect(analyser.at(-1)!.y[1]).toBeGreaterThan(5); // the plant itself moved
  });

  it('has a profile with noise for each of the signals of the seeded demo loops', () => {
    expect(QUILLMERE_PROFILES.map((p) => p.tag)).toEqual(['AER-DO-101', 'STO-LT-201', 'DIG-TT-301', 'DIS-CL-401']);
    expect(profileFor('DIS-CL-401')?.processNoise).toHaveLength(4);
    const noisy = createPlantLoop(
      { A: [[0.9]], B: [[1]], C: [[1]] },
      { ...quiet({ kind: 'frozen_analyser', output: 0 }), processNoise: [0.1], sensorNoise: [0.1] },
      3,
    );
    expect(new Set(Array.from({ length: 10 }, (_, i) => noisy.sample(i).y[0])).size).toBe(10);
  });
});
