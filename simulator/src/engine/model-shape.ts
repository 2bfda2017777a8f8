import { assertColumns, assertRows, assertSquare, assertVector } from './shape.js';
import type { Matrix, StateSpaceModel } from './types.js';

/** Orders of a model: states n, inputs m, outputs p. */
export interface ModelShape {
  states: number;
  inputs: number;
  outputs: number;
}

/** Checks the model's matrices and operating point against each other; throws a RangeError naming the part. */
export function modelShape(where: string, model: StateSpaceModel): ModelShape {
  const states = assertSquare(where, 'A', model.A);
  const inputs = assertRows(where, 'B', model.B, states, 'the order of A');
  const outputs = model.C ? assertColumns(where, 'C', model.C, states, 'the order of A') : states;
  if (model.D) {
    assertRows(where, 'D', model.D, outputs, 'the rows of C');
    assertColumns(where, 'D', model.D, inputs, 'the columns of B');
  }
  if (model.x0) assertVector(where, 'x0', model.x0, states);
  if (model.u0) assertVector(where, 'u0', model.u0, inputs);
  if (model.y0) assertVector(where, 'y0', model.y0, outputs);
  return { states, inputs, outputs };
}

/**
 * A model as stored (matrices A, B and optional C, D, as the registry keeps them) at its loop's
 * operating point (x0, u0, y0; each optional): the StateSpaceModel the engine and the twin take.
 */
export function modelAtOperatingPoint(
  matrices: { a: Matrix; b: Matrix; c?: Matrix | null; d?: Matrix | null },
  operatingPoint: { x0?: number[]; u0?: number[]; y0?: number[] },
): StateSpaceModel {
  const { x0, u0, y0 } = operatingPoint;
  return {
    A: matrices.a,
    B: matrices.b,
    ...(matrices.c ? { C: matrices.c } : {}),
    ...(matrices.d ? { D: matrices.d } : {}),
    ...(x0 ? { x0 } : {}),
    ...(u0 ? { u0 } : {}),
    ...(y0 ? { y0 } : {}),
  };
}
