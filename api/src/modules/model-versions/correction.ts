import { analyzeModes, steadyStateKalman, type Matrix } from '@shadowloop/simulator/engine';
import type { z } from 'zod';
import type { CorrectionInputSchema, ModelProblem, ModelVersion } from '../../contracts/registry.js';
import { AppError } from '../../http/errors.js';

type CorrectionInput = z.infer<typeof CorrectionInputSchema>;
export type StoredCorrection = ModelVersion['correction'];

/** Relative asymmetry accepted in a covariance (rounding in a spreadsheet or an export). */
const SYMMETRY_TOLERANCE = 1e-9;

/** Problems of the correction settings: kalman needs Q (n×n, ≥ 0) and R (p×p, > 0); reset needs every state measured. */
export function correctionProblems(input: CorrectionInput, states: number, outputs: number): ModelProblem[] {
  if (input.mode === 'reset' && outputs !== states) {
    return [
      {
        field: 'correction.mode',
        message: `reset restarts the twin from the measured state, so every state must be measured: there are ${states} states and ${outputs} outputs`,
      },
    ];
  }
  if (input.mode !== 'kalman') return [];
  return [
    ...covarianceProblems('Q', input.Q, states, 'state', false),
    ...covarianceProblems('R', input.R, outputs, 'output', true),
  ];
}

function covarianceProblems(
  name: string,
  value: unknown,
  order: number,
  per: string,
  definite: boolean,
): ModelProblem[] {
  const field = `correction.${name}`;
  if (value === undefined || value === null) {
    return [
      {
        field,
        message: `${name} is missing: kalman correction needs ${name}, ${order}×${order} (one row and column per ${per})`,
      },
    ];
  }
  const shape = squareMatrixProblems(name, value, order, per);
  if (shape.length) return shape;
  const M = value as Matrix;
  const asymmetric: ModelProblem[] = [];
  for (let i = 0; i < order; i++) {
    for (let j = i + 1; j < order; j++) {
      if (Math.abs(M[i][j] - M[j][i]) > SYMMETRY_TOLERANCE * Math.max(Math.abs(M[i][j]), Math.abs(M[j][i]))) {
        asymmetric.push({
          field: `${field}.${i}.${j}`,
          message: `${name} must be symmetric: ${name}[${i + 1}][${j + 1}] = ${M[i][j]} but ${name}[${j + 1}][${i + 1}] = ${M[j][i]}`,
        });
      }
    }
  }
  if (asymmetric.length) return asymmetric;
  const eigenvalues = analyzeModes(M, 1).modes.map((mode) => mode.eigenvalue.re);
  const smallest = Math.min(...eigenvalues);
  const scale = Math.max(...eigenvalues.map(Math.abs));
  if (definite && !(smallest > 1e-12 * scale)) {
    return [
      {
        field,
        message: `${name} must be positive definite (smallest eigenvalue ${smallest.toPrecision(3)}): every ${per} needs some measurement noise`,
      },
    ];
  }
  if (!definite && smallest < -1e-9 * scale) {
    return [
      {
        field,
        message: `${name} must be positive semidefinite (smallest eigenvalue ${smallest.toPrecision(3)}): a covariance has no negative variance`,
      },
    ];
  }
  return [];
}

function squareMatrixProblems(name: string, value: unknown, order: number, per: string): ModelProblem[] {
  const field = `correction.${name}`;
  if (!Array.isArray(value)) return [{ field, message: `${name} must be an array of rows` }];
  const problems: ModelProblem[] = [];
  if (value.length !== order)
    problems.push({ field, message: `${name} has ${value.length} rows, expected ${order} (one per ${per})` });
  value.forEach((row: unknown, i) => {
    if (!Array.isArray(row))
      return void problems.push({
        field: `${field}.${i}`,
        message: `${name} row ${i + 1} must be an array of numbers`,
      });
    if (row.length !== order) {
      problems.push({
        field: `${field}.${i}`,
        message: `${name} row ${i + 1} has ${row.length} column${row.length === 1 ? '' : 's'}, expected ${order}`,
      });
    }
    row.forEach((entry: unknown, j) => {
      if (typeof entry !== 'number' || !Number.isFinite(entry))
        problems.push({ field: `${field}.${i}.${j}`, message: `${name}[${i + 1}][${j + 1}] is not a finite number` });
    });
  });
  return problems;
}

/** The stored correction; for kalman the steady-state gain K and prior covariance P are computed here. */
export function buildCorrection(input: CorrectionInput, A: Matrix, C: Matrix): StoredCorrection {
  if (input.mode !== 'kalman') return { mode: input.mode, Q: null, R: null, K: null, P: null };
  const Q = input.Q as Matrix;
  const R = input.R as Matrix;
  try {
    return { mode: 'kalman', Q, R, ...steadyStateKalman(A, C, Q, R) };
  } catch (error) {
    const reason = (error as Error).message.replace(/^steadyStateKalman: /, '');
    throw new AppError(
      422,
      'kalman_not_converged',
      `The steady-state Kalman gain cannot be computed for these Q and R: ${reason}.`,
    );
  }
}
