import type { z } from 'zod';
import { announceCacheChange } from '../../lib/cache-notice.js';
import type { SignedInUser } from '../../auth/user.js';
import type {
  CreateLoopBodySchema,
  Loop,
  LoopListQuerySchema,
  UpdateLoopBodySchema,
} from '../../contracts/registry.js';
import type { Db } from '../../db/knex.js';
import { conflict, notFound } from '../../http/errors.js';
import { isUuid } from '../../http/params.js';
import { recordAudit } from '../audit/audit.repository.js';
import { insertDefaultRules } from '../drift-rules/default-rules.js';
import { assertLoopConsistent, lockedFieldChanges } from './loop-checks.js';
import {
  countVersions,
  findLoop,
  insertLoop,
  listLoopRows,
  lockLoop,
  updateLoopRow,
  type LoopRecord,
} from './loops.repository.js';

export async function listLoops(db: Db, query: z.infer<typeof LoopListQuerySchema>): Promise<Loop[]> {
  const loops = await listLoopRows(db, { area: query.area });
  return query.status ? loops.filter((loop) => loop.status === query.status) : loops;
}

export async function getLoop(db: Db, id: string): Promise<Loop> {
  const loop = isUuid(id) ? await findLoop(db, id) : undefined;
  if (!loop) throw notFound(`Loop ${id}`);
  return loop;
}

export async function createLoop(
  db: Db,
  actor: SignedInUser,
  body: z.infer<typeof CreateLoopBodySchema>,
): Promise<Loop> {
  await assertLoopConsistent(db, body);
  const id = await db.transaction(async (trx) => {
    const loopId = await insertLoop(trx, body, actor.id);
    await insertDefaultRules(trx, loopId, actor.id);
    await recordAudit(trx, {
      actor,
      action: 'loop.created',
      targetType: 'loop',
      targetId: loopId,
      details: { loopId, loopTag: body.tag, name: body.name, area: body.area },
    });
    return loopId;
  });
  return getLoop(db, id);
}

const recordOf = (loop: Loop): LoopRecord => ({
  tag: loop.tag,
  name: loop.name,
  area: loop.area,
  description: loop.description,
  samplePeriodS: loop.samplePeriodS,
  inputs: loop.inputs,
  states: loop.states,
  outputs: loop.outputs,
  operatingPoint: loop.operatingPoint,
  timeZone: loop.timeZone,
});

/**
 * Changes the named fields. Once a model version exists the signal counts and the sample period are
 * locked: every stored matrix was built for them.
 */
export async function updateLoop(
  db: Db,
  actor: SignedInUser,
  id: string,
  body: z.infer<typeof UpdateLoopBodySchema>,
): Promise<Loop> {
  if (!isUuid(id)) throw notFound(`Loop ${id}`);
  await db.transaction(async (trx) => {
    if (!(await lockLoop(trx, id))) throw notFound(`Loop ${id}`);
    const current = recordOf((await findLoop(trx, id)) as Loop);
    const after: LoopRecord = { ...current, ...body };
    await assertLoopConsistent(trx, after);
    const locked = lockedFieldChanges(current, after);
    if (locked.length && (await countVersions(trx, id)) > 0) {
      throw conflict(
        `Loop ${current.tag} already has model versions, so ${locked.join(' and ')} cannot change. Register a new loop instead.`,
      );
    }
    await updateLoopRow(trx, id, body);
    await announceCacheChange(trx, { loopId: id });
    await recordAudit(trx, {
      actor,
      action: 'loop.updated',
      targetType: 'loop',
      targetId: id,
      details: {
        loopId: id,
        loopTag: after.tag,
        ...(after.tag === current.tag ? {} : { previousTag: current.tag }),
        changed: Object.keys(body).sort(),
      },
    });
  });
  return getLoop(db, id);
}
