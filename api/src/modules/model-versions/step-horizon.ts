import { badRequest } from '../../http/errors.js';

/** Samples of the stored step response when nobody asks for another horizon. */
export const DEFAULT_STEP_SAMPLES = 200;

/**
 * Values a step-response chart (outputs × inputs × samples) or a mode split (modes × states ×
 * samples) may hold. Measured: a 50-output, 10-input model at 5000 samples gives 2.5 million
 * values, about 50 MB of JSON and 3 s of computing that stalls every other request; 500 000
 * values stay near 10 MB.
 */
export const STEP_RESPONSE_VALUE_BUDGET = 500_000;

/**
 * The step horizon to compute: the requested one when it fits the budget (else 400 naming the
 * largest that does), or the default, shortened for very wide models.
 */
export function stepHorizon(outputs: number, inputs: number, requested?: number): number {
  const largest = Math.floor(STEP_RESPONSE_VALUE_BUDGET / (outputs * inputs)) - 1;
  if (requested === undefined) return Math.max(1, Math.min(DEFAULT_STEP_SAMPLES, largest));
  if (requested > largest) {
    throw badRequest(
      `A step response of ${requested} samples for ${outputs} outputs × ${inputs} inputs is too large to send; ` +
        `choose stepSamples of at most ${Math.max(1, largest)}.`,
      [{ path: 'query.stepSamples', message: `at most ${Math.max(1, largest)} for this model` }],
    );
  }
  return requested;
}
