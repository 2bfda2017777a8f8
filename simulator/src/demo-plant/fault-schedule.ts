/**
 * The scripted faults of the demo, in demo seconds (wall-clock seconds since the demo plant started,
 * times DEMO_SPEED). The script repeats every cycle, so a demo left running keeps showing loops that
 * drift away from their twins and come back.
 */
export type FaultKind = 'diffuser_fouling' | 'transmitter_drift' | 'sticking_valve' | 'frozen_analyser';

export interface ScheduledFault {
  kind: FaultKind;
  /** When it begins within the cycle. */
  startS: number;
  /** How long it takes to reach its full size (0: at once). */
  rampS: number;
  /** When it is repaired within the cycle. */
  endS: number;
}

export const DEMO_CYCLE_S = 1800;

/**
 * Three minutes of a healthy plant first, so that a fresh start shows every loop in step; then
 * a storage level transmitter drifts (the quickest to raise an alert, so a fresh start shows one
 * within five minutes), the aeration diffusers foul, the digester's hot-water valve sticks and the
 * chlorine analyser freezes, overlapping, each repaired after a while.
 */
export const FAULT_SCHEDULE: ScheduledFault[] = [
  { kind: 'transmitter_drift', startS: 180, rampS: 300, endS: 540 },
  { kind: 'diffuser_fouling', startS: 420, rampS: 240, endS: 1140 },
  { kind: 'sticking_valve', startS: 600, rampS: 0, endS: 1200 },
  { kind: 'frozen_analyser', startS: 840, rampS: 0, endS: 1500 },
];

/** Demo seconds after `elapsedMs` of wall-clock time at the given speed. */
export function demoSeconds(elapsedMs: number, speed: number): number {
  return (elapsedMs / 1000) * speed;
}

/** The size of one fault at demo time t: 0 before and after it, rising linearly to 1 over its ramp. */
export function faultLevel(fault: ScheduledFault, tS: number, cycleS = DEMO_CYCLE_S): number {
  const inCycle = ((tS % cycleS) + cycleS) % cycleS;
  if (inCycle < fault.startS || inCycle >= fault.endS) return 0;
  if (fault.rampS <= 0) return 1;
  return Math.min(1, (inCycle - fault.startS) / fault.rampS);
}

/** Every fault's level at demo time t. */
export function faultLevels(tS: number, schedule: ScheduledFault[] = FAULT_SCHEDULE): Record<FaultKind, number> {
  const levels: Record<FaultKind, number> = {
    diffuser_fouling: 0,
    transmitter_drift: 0,
    sticking_valve: 0,
    frozen_analyser: 0,
  };
  for (const fault of schedule) levels[fault.kind] = Math.max(levels[fault.kind], faultLevel(fault, tS));
  return levels;
}
