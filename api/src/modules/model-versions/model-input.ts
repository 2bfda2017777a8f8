import { discretizeZoh, validateModel, type Matrix } from '@shadowloop/simulator/engine';
import type { z } from 'zod';
import type { CreateModelVersionBodySchema, Loop, ModelVersion } from '../../contracts/registry.js';
import { AppError } from '../../http/errors.js';
import { buildCorrection, correctionProblems, type StoredCorrection } from './correction.js';
import {
  CONTINUOUS_NAMES,
  DISCRETE_NAMES,
  fromEngineProblem,
  invalidModel,
  loopDimensionProblems,
} from './model-problems.js';

type CreateBody = z.infer<typeof CreateModelVersionBodySchema>;

/** A model ready to store: discrete matrices at the loop's sample period, and how it was obtained. */
export interface PreparedModel {
  A: Matrix;
  B: Matrix;
  C: Matrix | null;
  D: Matrix | null;
  continuous: ModelVersion['continuous'];
  correction: StoredCorrection;
}

const identity = (n: number): Matrix =>
  Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));
const allFinite = (...matrices: Matrix[]) => matrices.every((M) => M.every((row) => row.every(Number.isFinite)));

/**
 * Checks a submitted model against itself and the loop's signals, listing every problem (400
 * invalid_model); discretises a continuous model by zero-order hold at the loop's sample period;
 * computes the Kalman gain when asked. In a continuous body A and B are ignored: they are computed.
 */
export function prepareModel(loop: Loop, body: CreateBody): PreparedModel {
  const continuous = body.source === 'continuous';
  const names = continuous ? CONTINUOUS_NAMES : DISCRETE_NAMES;
  const given = { A: continuous ? body.Ac : body.A, B: continuous ? body.Bc : body.B, C: body.C, D: body.D };
  const problems = [
    ...validateModel(given).map((problem) => fromEngineProblem(problem, names)),
    ...loopDimensionProblems(given, loop, names),
    ...correctionProblems(body.correction, loop.states.length, loop.outputs.length),
  ];
  if (problems.length) throw invalidModel(problems);

  const model = given as { A: Matrix; B: Matrix; C?: Matrix; D?: Matrix };
  const { A, B } = continuous ? discretizeZoh(model.A, model.B, loop.samplePeriodS) : model;
  if (!allFinite(A, B)) {
    throw new AppError(
      422,
      'not_finite',
      `Discretising at ${loop.samplePeriodS} s overflows: the continuous model grows too fast for this sample period.`,
    );
  }
  return {
    A,
    B,
    C: model.C ?? null,
    D: model.D ?? null,
    continuous: continuous ? { Ac: model.A, Bc: model.B, samplePeriodS: loop.samplePeriodS } : null,
    correction: buildCorrection(body.correction, A, model.C ?? identity(A.length)),
  };
}
