import { modelAtOperatingPoint, validateModel, type Matrix, type StateSpaceModel } from '@shadowloop/simulator/engine';
import type { ModelVersion, ModelVersionStatus, Signal } from '../../contracts/registry.js';
import type { Db } from '../../db/knex.js';
import { AppError } from '../../http/errors.js';
import { innovationCovInverseOf } from '../drift-rules/innovation-covariance.js';

/** 422 unless every id names a model version of this loop; the first bad id is named. */
export async function requireLoopVersions(db: Db, loop: { id: string; tag: string }, ids: string[]): Promise<void> {
  const rows = (await db('model_versions').whereIn('id', ids).select('id', 'loop_id')) as {
    id: string;
    loop_id: string;
  }[];
  const owner = new Map(rows.map((r) => [r.id, r.loop_id]));
  for (const id of ids) {
    if (owner.get(id) === loop.id) continue;
    throw new AppError(
      422,
      'version_not_in_loop',
      owner.has(id)
        ? `Model version ${id} belongs to another loop, not to ${loop.tag}; pick versions of ${loop.tag}.`
        : `There is no model version ${id}; pick versions of ${loop.tag}.`,
      { versionId: id },
    );
  }
}

/** A version as the backtest replays it: its model at the loop's operating point and its correction. */
export interface ReplayVersion {
  id: string;
  number: number;
  status: ModelVersionStatus;
  model: StateSpaceModel;
  correction: { mode: ModelVersion['correction']['mode']; K: Matrix | null };
  /** S⁻¹ of the version's Kalman innovation covariance C P Cᵀ + R (for the nis rule), or null. */
  innovationCovInverse: number[][] | null;
}

/** What the job needs of the loop. */
export interface BacktestLoop {
  id: string;
  tag: string;
  samplePeriodS: number;
  inputs: Signal[];
  outputs: Signal[];
}

type Raw = {
  id: string;
  number: number;
  status: ModelVersionStatus;
  a: Matrix;
  b: Matrix;
  c: Matrix | null;
  d: Matrix | null;
  correction: ModelVersion['correction'];
  operating_point: { x0?: number[]; u0?: number[]; y0?: number[] };
};

/**
 * The loop and the versions in the order asked for, with the loop's operating point (x0, u0, y0) as
 * the simulator's registry puts them together (simulator/src/registry/active-models.ts). A version
 * the engine would refuse stops the job with its problems named.
 */
export async function loadReplayVersions(
  db: Db,
  loopId: string,
  versionIds: string[],
): Promise<{ loop: BacktestLoop; versions: ReplayVersion[] }> {
  const loop = (await db('loops').where({ id: loopId }).first('id', 'tag', 'sample_period_s', 'inputs', 'outputs')) as
    { id: string; tag: string; sample_period_s: number; inputs: Signal[]; outputs: Signal[] } | undefined;
  if (!loop) throw new AppError(422, 'loop_gone', `Loop ${loopId} no longer exists.`);
  const rows = (await db('model_versions as v')
    .join('loops as l', 'l.id', 'v.loop_id')
    .whereIn('v.id', versionIds)
    .where('v.loop_id', loopId)
    .select('v.id', 'v.number', 'v.status', 'v.a', 'v.b', 'v.c', 'v.d', 'v.correction', 'l.operating_point')) as Raw[];
  const versions = versionIds.map((id) => {
    const row = rows.find((r) => r.id === id);
    if (!row) throw new AppError(422, 'version_gone', `Model version ${id} is no longer a version of ${loop.tag}.`);
    return toReplayVersion(row, loop.tag);
  });
  return {
    loop: {
      id: loop.id,
      tag: loop.tag,
      samplePeriodS: loop.sample_period_s,
      inputs: loop.inputs,
      outputs: loop.outputs,
    },
    versions,
  };
}

function toReplayVersion(row: Raw, loopTag: string): ReplayVersion {
  const model = modelAtOperatingPoint(row, row.operating_point);
  const problems = validateModel(model);
  if (problems.length)
    throw new AppError(
      422,
      'version_unusable',
      `Version ${row.number} of ${loopTag} cannot be replayed: ${problems.map((p) => p.message).join('; ')}.`,
    );
  const outputs = row.c ? row.c.length : row.a.length;
  const inverse = innovationCovInverseOf(row.correction, row.c);
  return {
    id: row.id,
    number: row.number,
    status: row.status,
    model,
    correction: { mode: row.correction.mode, K: row.correction.K ?? null },
    innovationCovInverse: inverse && inverse.length === outputs ? inverse : null,
  };
}
