import { describeMode, residualDirection, type Complex, type Matrix } from '@shadowloop/simulator/engine';
import type { ResidualDirection } from '../../contracts/alerts.js';
import type { Signal } from './alert-summary.js';
import { duration, eigenvalueText } from './plain-words.js';

export interface DirectionInput {
  A: Matrix;
  C: Matrix | null;
  samplePeriodS: number;
  outputs: Signal[];
  /** Recent residual vectors, oldest first (rows of the wrong length are left out). */
  residuals: number[][];
  sigma: number[];
}

const magnitude = (z: Complex) => Math.hypot(z.re, z.im);

/** "(time constant about 3.7 min)", "(oscillating every about 52 s)", or how it fails to decay. */
function modeTiming(eigenvalue: Complex, samplePeriodS: number): string {
  const mode = describeMode(eigenvalue, samplePeriodS);
  if (mode.magnitude >= 1) return mode.magnitude > 1 ? 'it grows' : 'it does not decay';
  if (mode.periodSamples !== null && eigenvalue.im !== 0)
    return `oscillating every about ${duration(mode.periodSamples * samplePeriodS)}`;
  return mode.timeConstantS !== null ? `time constant about ${duration(mode.timeConstantS)}` : 'gone after one sample';
}

/** "slow", "fast" or "" by where the mode sits among the model's modes. */
function modeRank(eigenvalue: Complex, all: Complex[]): string {
  if (all.length < 2) return '';
  const m = magnitude(eigenvalue);
  if (all.every((z) => magnitude(z) <= m + 1e-12)) return 'slow ';
  if (all.every((z) => magnitude(z) >= m - 1e-12)) return 'fast ';
  return '';
}

/**
 * Which outputs carry the residual and how it projects on the modes (engine residualDirection), with
 * the sentence shown to people. Null when the window holds no usable residual.
 */
export function directionOf(input: DirectionInput): ResidualDirection | null {
  const p = input.outputs.length;
  const residuals = input.residuals.filter((r) => r.length === p && r.every(Number.isFinite));
  const modelOutputs = input.C ? input.C.length : input.A.length;
  if (!residuals.length || input.sigma.length !== p || modelOutputs !== p) return null;
  const result = residualDirection({ A: input.A, C: input.C, residuals, sigma: input.sigma });
  const signals = result.signals.map(({ index, share }) => ({
    index,
    name: input.outputs[index].name,
    unit: input.outputs[index].unit,
    share,
    residual: result.meanResidual[index],
  }));
  const modes = result.modes.map((m) => ({ eigenvalue: m.eigenvalue, share: m.share }));
  let hint: string;
  if (p === 1) {
    hint = 'One output only: the direction cannot tell a sensor from the process; compare with the inputs.';
  } else if (result.points === 'sensor') {
    const top = signals[0];
    hint = `Only ${top.name} carries the residual (${Math.round(top.share * 100)} % of it): check its transmitter first.`;
  } else if (result.points === 'process') {
    const { eigenvalue } = modes[0];
    const rank = modeRank(
      eigenvalue,
      modes.map((m) => m.eigenvalue),
    );
    hint =
      `The residual lies along the ${rank}mode λ = ${eigenvalueText(eigenvalue)} ` +
      `(${modeTiming(eigenvalue, input.samplePeriodS)}): the process itself changed.`;
  } else if (signals[0].share === 0) {
    hint = 'The residual averages out over the recent samples: no direction stands out; compare with the inputs.';
  } else {
    hint =
      'The residual is spread over several outputs without following one mode: it points to neither one sensor ' +
      'nor one process change; compare with the inputs.';
  }
  return { signals, modes, points: result.points, hint };
}
