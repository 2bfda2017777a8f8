import { analyzeModel } from '@shadowloop/simulator/engine';
import type { z } from 'zod';
import type { SignedInUser } from '../../auth/user.js';
import type { CreateModelVersionBodySchema, ModelVersion } from '../../contracts/registry.js';
import type { Db } from '../../db/knex.js';
import { notFound } from '../../http/errors.js';
import { isUuid } from '../../http/params.js';
import { recordAudit } from '../audit/audit.repository.js';
import { lockLoop } from '../loops/loops.repository.js';
import { getLoop } from '../loops/loops.service.js';
import { prepareModel } from './model-input.js';
import { stepHorizon } from './step-horizon.js';
import {
  findVersion,
  insertVersion,
  listLoopVersions,
  toPublicVersion,
  type VersionRecord,
} from './model-versions.repository.js';

/** The stored record of a version, or 404. */
export async function loadVersion(db: Db, id: string): Promise<VersionRecord> {
  const version = isUuid(id) ? await findVersion(db, id) : undefined;
  if (!version) throw notFound(`Model version ${id}`);
  return version;
}

export async function getVersion(db: Db, id: string): Promise<ModelVersion> {
  return toPublicVersion(await loadVersion(db, id));
}

export async function listVersions(db: Db, loopId: string): Promise<ModelVersion[]> {
  const loop = await getLoop(db, loopId);
  return (await listLoopVersions(db, loop.id)).map(toPublicVersion);
}

/** Saves a new draft with its analysis; a later change to a model is always a new draft. */
export async function createDraft(
  db: Db,
  actor: SignedInUser,
  loopId: string,
  body: z.infer<typeof CreateModelVersionBodySchema>,
): Promise<ModelVersion> {
  const loop = await getLoop(db, loopId);
  const model = prepareModel(loop, body);
  const stepSamples = stepHorizon(model.C?.length ?? model.A.length, model.B[0].length);
  const analysis = analyzeModel(
    { A: model.A, B: model.B, C: model.C ?? undefined, D: model.D ?? undefined, samplePeriodS: loop.samplePeriodS },
    { stepSamples },
  );
  const id = await db.transaction(async (trx) => {
    if (!(await lockLoop(trx, loop.id))) throw notFound(`Loop ${loopId}`);
    const versionId = await insertVersion(trx, {
      ...model,
      loopId: loop.id,
      samplePeriodS: loop.samplePeriodS,
      changeNote: body.changeNote,
      analysis,
      authorId: actor.id,
    });
    const created = (await findVersion(trx, versionId)) as VersionRecord;
    await recordAudit(trx, {
      actor,
      action: 'model_version.created',
      targetType: 'model_version',
      targetId: versionId,
      details: {
        loopId: loop.id,
        loopTag: loop.tag,
        versionNumber: created.number,
        source: body.source,
        correction: model.correction.mode,
        stability: analysis.stability,
      },
    });
    return versionId;
  });
  return getVersion(db, id);
}
