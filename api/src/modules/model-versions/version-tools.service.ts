import {
  analyzeModel,
  forecast,
  modalDecomposition,
  transitionMatrix,
  type Matrix,
  type ModelAnalysis,
} from '@shadowloop/simulator/engine';
import type { ExploreBody, ExploreResult } from '../../contracts/registry.js';
import type { Db } from '../../db/knex.js';
import { AppError, badRequest } from '../../http/errors.js';
import type { VersionRecord } from './model-versions.repository.js';
import { loadVersion } from './model-versions.service.js';
import { STEP_RESPONSE_VALUE_BUDGET, stepHorizon } from './step-horizon.js';

const modelOf = (v: VersionRecord) => ({
  A: v.A,
  B: v.B,
  C: v.C ?? undefined,
  D: v.D ?? undefined,
  samplePeriodS: v.samplePeriodS,
});
const finite = (M: Matrix) => M.every((row) => row.every(Number.isFinite));

/** The stored version's analysis recomputed for another step-response horizon. */
export async function versionAnalysis(db: Db, id: string, stepSamples: number | undefined): Promise<ModelAnalysis> {
  const version = await loadVersion(db, id);
  const horizon = stepHorizon(version.C?.length ?? version.A.length, version.B[0].length, stepSamples);
  return analyzeModel(modelOf(version), { stepSamples: horizon });
}

/** x(j) = A^j x0 for j = 0 … steps: the twin's forecast from x0 with every input at its operating point. */
function freeResponse(version: VersionRecord, x0: number[], steps: number): Matrix {
  const heldInputs = version.B[0].map(() => 0);
  return [x0, ...forecast({ A: version.A, B: version.B }, x0, heldInputs, steps).states];
}

/**
 * The state transition explorer: A^k, the free response x(j) = A^j x0 for j = 0 … steps, and its
 * split into modes. A defective A has no eigenvector basis: modal is null with the engine's reason.
 */
export async function exploreVersion(db: Db, id: string, body: ExploreBody): Promise<ExploreResult> {
  const version = await loadVersion(db, id);
  const n = version.A.length;
  if (body.x0.length !== n) {
    throw badRequest(
      `x0 has ${body.x0.length} entries; version ${version.number} of ${version.loopTag} has ${n} states.`,
      [{ path: 'body.x0', message: `expected ${n} entries, one per state` }],
    );
  }
  const Ak = transitionMatrix(version.A, body.k);
  const trajectory = freeResponse(version, body.x0, body.steps);
  if (!finite(Ak) || !finite(trajectory)) {
    throw new AppError(
      422,
      'not_finite',
      'The state grows beyond the range of double precision within this horizon; choose a smaller k or fewer steps.',
    );
  }
  const modal = modalSplit(version.A, body.x0, body.steps);
  return { k: body.k, Ak, trajectory, ...modal };
}

function modalSplit(A: Matrix, x0: number[], steps: number): Pick<ExploreResult, 'modal' | 'modalError'> {
  // every mode carries a full state trajectory: up to n·n·(steps + 1) values
  const values = A.length * A.length * (steps + 1);
  if (values > STEP_RESPONSE_VALUE_BUDGET) {
    const largest = Math.floor(STEP_RESPONSE_VALUE_BUDGET / (A.length * A.length)) - 1;
    return {
      modal: null,
      modalError: `the split into modes of ${A.length} states over ${steps} steps is too large to send; choose at most ${largest} steps`,
    };
  }
  try {
    return { modal: modalDecomposition(A, x0, steps), modalError: null };
  } catch (error) {
    return { modal: null, modalError: (error as Error).message.replace(/^modalDecomposition: /, '') };
  }
}
