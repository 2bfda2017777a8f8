import { identity, multiply, add } from './dense.js';
import { modelShape } from './model-shape.js';
import { analyzeModes, STABILITY_TOLERANCE, type Mode, type Stability } from './modes.js';
import { steadyStateGain, stepResponseSeries } from './step-response.js';
import { controllabilityRank, observabilityRank } from './structure.js';
import type { Matrix } from './types.js';

/** What an engineer submits for analysis: the sampled model and its sample period. */
export interface AnalysisInput {
  A: Matrix;
  B: Matrix;
  C?: Matrix;
  D?: Matrix;
  /** Sample period T in seconds. */
  samplePeriodS: number;
}

/** Options of {@link analyzeModel}. */
export interface AnalysisOptions {
  /** Last sample of the step-response chart (default 200). */
  stepSamples?: number;
  /** Distance from the unit circle treated as on it (default 1e-6). */
  stabilityTolerance?: number;
}

/** Output step response for charts: `series[i][j][n] = (C H(n) + D)_{ij}`, output i after a unit step in input j. */
export interface StepResponseChart {
  /**
   * Number of samples after the step, N; the series hold N + 1 values (n = 0 … N). Fewer than asked
   * when a strongly unstable response overflows the number range; the chart stops before it.
   */
  samples: number;
  /** Times n·T in seconds, n = 0 … N. */
  t: number[];
  /** [output][input][n], in output units per input unit. */
  series: number[][][];
}

/** The analysis object of the API (`POST /api/v1/analysis`, and stored with each model version). */
export interface ModelAnalysis {
  spectralRadius: number;
  stability: Stability;
  defective: boolean;
  eigenvectorCondition: number;
  modes: Mode[];
  /** `(I − A)^{-1} B` (state units per input unit), or null with an integrating mode. */
  steadyStateGain: Matrix | null;
  controllabilityRank: number;
  observabilityRank: number;
  stepResponse: StepResponseChart;
}

/**
 * Everything an engineer reads about a model in one call: modes and stability ({@link analyzeModes}),
 * steady-state gain, controllability and observability ranks, and the output step response.
 * The input must have passed `validateModel`; shape errors here are programmer errors and throw.
 */
export function analyzeModel(input: AnalysisInput, options: AnalysisOptions = {}): ModelAnalysis {
  const { states, inputs } = modelShape('analyzeModel', input);
  const samples = options.stepSamples ?? 200;
  const C = input.C ?? identity(states);
  const D = input.D ?? C.map(() => new Array<number>(inputs).fill(0));
  const modes = analyzeModes(input.A, input.samplePeriodS, options.stabilityTolerance ?? STABILITY_TOLERANCE);
  const outputs = finitePrefix(stepResponseSeries(input.A, input.B, samples).map((Hn) => add(multiply(C, Hn), D)));
  return {
    ...modes,
    steadyStateGain: steadyStateGain(input.A, input.B),
    controllabilityRank: controllabilityRank(input.A, input.B),
    observabilityRank: observabilityRank(input.A, C),
    stepResponse: {
      samples: outputs.length - 1,
      t: outputs.map((_, n) => n * input.samplePeriodS),
      series: C.map((_, i) => Array.from({ length: inputs }, (_, j) => outputs.map((Y) => Y[i][j]))),
    },
  };
}

/** The samples before the first one that overflows (a strongly unstable model), so that the chart stays JSON. */
function finitePrefix(series: Matrix[]): Matrix[] {
  const overflow = series.findIndex((Y) => !Y.every((row) => row.every(Number.isFinite)));
  return overflow === -1 ? series : series.slice(0, overflow);
}
