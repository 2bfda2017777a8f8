import { fitPercent, residualAutocorrelation, type ResidualAutocorrelation } from '../engine/index.js';

/**
 * Model-fit figures of a replay, per output, after L. Ljung, System Identification: Theory for the
 * User, 2nd ed., 1999, §16.6 (residual analysis): the normalised-RMSE fit, the residual's size and
 * bias, and its sample autocorrelation with the 95 % whiteness band.
 */

/** A residual whose RMS is at most this share of the measured signal's spread is rounding noise. */
export const NEGLIGIBLE_RESIDUAL = 1e-9;

/** Autocorrelation of one output's residual, with the whiteness verdict. */
export interface ReplayAutocorrelation extends ResidualAutocorrelation {
  /**
   * The residual is at rounding level (RMS ≤ {@link NEGLIGIBLE_RESIDUAL} × the signal's spread): the
   * correlation of rounding errors means nothing, so it is reported white, r(0) = 1 and 0 elsewhere.
   */
  negligible: boolean;
}

/** Figures of one output over its scored slots (measured and predicted both finite). */
export interface OutputFigures {
  scored: number;
  /** 100 · (1 − ‖y − ŷ‖ / ‖y − ȳ‖); null when y is constant or fewer than 2 slots are scored. */
  fitPercent: number | null;
  /** √(mean (y − ŷ)²), output unit; null when nothing is scored. */
  rmse: number | null;
  /** mean (y − ŷ), output unit; null when nothing is scored. */
  residualMean: number | null;
  /** Sample standard deviation of y − ŷ (divisor n − 1), output unit; null below 2 scored slots. */
  residualStd: number | null;
  /** r(0) … r(maxLag) of the residual; null when at most maxLag + 1 slots are scored. */
  autocorrelation: ReplayAutocorrelation | null;
}

/**
 * Figures of each output of a replay. A slot counts for an output when both its measurement and
 * its prediction are finite numbers (a missing reading or a diverged prediction is NaN); the
 * residual sequence is the scored slots in order.
 *
 * @param measured - y, N×p row-major (output units; NaN where there is no reading)
 * @param predicted - ŷ, N×p row-major (NaN where there is no prediction)
 * @param outputs - p, the number of outputs (≥ 1)
 * @param maxLag - largest autocorrelation lag, an integer ≥ 1
 */
export function outputFigures(
  measured: Float64Array,
  predicted: Float64Array,
  outputs: number,
  maxLag: number,
): OutputFigures[] {
  if (!Number.isInteger(outputs) || outputs < 1) {
    throw new RangeError(`outputFigures: outputs must be an integer ≥ 1, got ${outputs}`);
  }
  if (!Number.isInteger(maxLag) || maxLag < 1) {
    throw new RangeError(`outputFigures: maxLag must be an integer ≥ 1, got ${maxLag}`);
  }
  if (measured.length !== predicted.length || measured.length % outputs !== 0) {
    throw new RangeError(
      `outputFigures: measured (${measured.length} values) and predicted (${predicted.length}) must both be N×${outputs}`,
    );
  }
  const slots = measured.length / outputs;
  const y = new Float64Array(slots);
  const yHat = new Float64Array(slots);
  const residual = new Float64Array(slots);
  const figures: OutputFigures[] = [];
  for (let j = 0; j < outputs; j++) {
    let scored = 0;
    for (let t = 0; t < slots; t++) {
      const a = measured[t * outputs + j];
      const b = predicted[t * outputs + j];
      if (!Number.isFinite(a) || !Number.isFinite(b)) continue;
      y[scored] = a;
      yHat[scored] = b;
      residual[scored] = a - b;
      scored++;
    }
    figures.push(figuresOf(y.subarray(0, scored), yHat.subarray(0, scored), residual.subarray(0, scored), maxLag));
  }
  return figures;
}

function figuresOf(y: Float64Array, yHat: Float64Array, residual: Float64Array, maxLag: number): OutputFigures {
  const scored = y.length;
  if (scored === 0) {
    return { scored, fitPercent: null, rmse: null, residualMean: null, residualStd: null, autocorrelation: null };
  }
  let sum = 0;
  let squares = 0;
  for (let t = 0; t < scored; t++) {
    sum += residual[t];
    squares += residual[t] * residual[t];
  }
  const residualMean = sum / scored;
  let deviations = 0;
  for (let t = 0; t < scored; t++) deviations += (residual[t] - residualMean) ** 2;
  const rmse = Math.sqrt(squares / scored);
  // constant y: checked here, since ȳ of equal values can differ from them by rounding
  const constant = y.every((v) => v === y[0]);
  return {
    scored,
    fitPercent: constant || scored < 2 ? null : fitPercent(y, yHat),
    rmse,
    residualMean,
    residualStd: scored < 2 ? null : Math.sqrt(deviations / (scored - 1)),
    autocorrelation: scored <= maxLag + 1 ? null : autocorrelationOf(residual, maxLag, rmse, spreadOf(y, constant)),
  };
}

/** ‖y − ȳ‖/√N; |ȳ| when y is constant; 1 when that is 0 too. */
function spreadOf(y: Float64Array, constant: boolean): number {
  let sum = 0;
  for (let t = 0; t < y.length; t++) sum += y[t];
  const mean = sum / y.length;
  if (constant) return Math.abs(mean) || 1;
  let squares = 0;
  for (let t = 0; t < y.length; t++) squares += (y[t] - mean) ** 2;
  return Math.sqrt(squares / y.length);
}

function autocorrelationOf(residual: Float64Array, maxLag: number, rms: number, spread: number): ReplayAutocorrelation {
  const figures = residualAutocorrelation(residual, maxLag);
  if (rms > NEGLIGIBLE_RESIDUAL * spread) return { ...figures, negligible: false };
  return {
    correlation: figures.correlation.map((_, lag) => (lag === 0 ? 1 : 0)),
    band: figures.band,
    lagsOutside: [],
    statistic: 0,
    limit: figures.limit,
    white: true,
    negligible: true,
  };
}
