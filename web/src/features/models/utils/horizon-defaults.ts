import type { ModelAnalysis } from '../types';

const MIN_STEPS = 20;
const MAX_STEPS = 2000;

export const STEP_HORIZONS = [50, 100, 200, 500, 1000, 2000];

/** Samples for the slowest decaying mode to settle (4 τ) with a quarter to spare; null when nothing decays. */
function settlingSamples(analysis: ModelAnalysis, samplePeriodS: number): number | null {
  const slowest = analysis.modes[0];
  if (!slowest || slowest.timeConstantS === null) return null;
  return ((4 * slowest.timeConstantS) / samplePeriodS) * 1.25;
}

/** Enough samples to watch the slowest decaying mode settle, within what the server allows. */
export function defaultExplorerSteps(analysis: ModelAnalysis, samplePeriodS: number): number {
  const samples = settlingSamples(analysis, samplePeriodS);
  if (samples === null) return 50;
  return Math.min(MAX_STEPS, Math.max(MIN_STEPS, Math.ceil(samples)));
}

/** The shortest listed horizon in which the step responses settle; the stored one when nothing settles. */
export function suggestedStepHorizon(analysis: ModelAnalysis, samplePeriodS: number): number {
  const samples = settlingSamples(analysis, samplePeriodS);
  if (samples === null) return analysis.stepResponse.samples;
  return STEP_HORIZONS.find((horizon) => horizon >= samples) ?? STEP_HORIZONS[STEP_HORIZONS.length - 1];
}

/** x0 = one unit in the first state, nothing in the others. */
export function defaultInitialState(states: number): string[] {
  return Array.from({ length: states }, (_, i) => (i === 0 ? '1' : '0'));
}

export const EXPLORER_STEP_LIMIT = MAX_STEPS;
