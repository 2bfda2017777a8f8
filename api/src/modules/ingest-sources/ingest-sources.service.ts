import type { z } from 'zod';
import { announceCacheChange } from '../../lib/cache-notice.js';
import type { SignedInUser } from '../../auth/user.js';
import type { CreateIngestSourceBodySchema } from '../../contracts/ingest.js';
import type { Db } from '../../db/knex.js';
import { badRequest, conflict, notFound } from '../../http/errors.js';
import { isUuid } from '../../http/params.js';
import { recordAudit } from '../audit/audit.repository.js';
import { newTokenSecret } from '../access-tokens/token-secret.js';
import {
  findSourceRow,
  forgetIngestLookups,
  insertSource,
  listSourceRows,
  replaceSourceLoops,
  revokeSource,
  unknownLoopIds,
  type IngestSourceRow,
} from './ingest-sources.repository.js';

/** Ingest tokens start with this, so the bearer check knows where to look them up. */
export const INGEST_TOKEN_PREFIX = 'sli_';

export const listIngestSources = (db: Db) => listSourceRows(db);

async function assertLoopsExist(db: Db, loopIds: string[]): Promise<void> {
  const unknown = await unknownLoopIds(db, loopIds);
  if (unknown.length) {
    throw badRequest(
      `There is no loop with id ${unknown.join(', ')}; pick the loops from GET /api/v1/loops.`,
      unknown.map((id) => ({ path: 'body.loopIds', message: `unknown loop ${id}` })),
    );
  }
}

async function requireSource(db: Db, id: string): Promise<IngestSourceRow> {
  const source = isUuid(id) ? await findSourceRow(db, id) : undefined;
  if (!source) throw notFound(`Ingest source ${id}`);
  return source;
}

const rethrowDuplicateName =
  (name: string) =>
  (error: { code?: string }): never => {
    if (error.code === '23505') throw conflict(`An ingest source named "${name}" already exists; choose another name.`);
    throw error;
  };

/** A plant bridge's identity: its token is returned once and stored as a hash. */
export async function createIngestSource(
  db: Db,
  actor: SignedInUser,
  body: z.infer<typeof CreateIngestSourceBodySchema>,
) {
  await assertLoopsExist(db, body.loopIds);
  const secret = newTokenSecret(INGEST_TOKEN_PREFIX);
  const id = await db.transaction(async (trx) => {
    const sourceId = await insertSource(trx, {
      ...body,
      prefix: secret.prefix,
      hash: secret.hash,
      createdBy: actor.id,
    }).catch(rethrowDuplicateName(body.name));
    await replaceSourceLoops(trx, sourceId, body.loopIds);
    await recordAudit(trx, {
      actor,
      action: 'ingest_source.created',
      targetType: 'ingest_source',
      targetId: sourceId,
      details: { name: body.name, loopIds: body.loopIds },
    });
    return sourceId;
  });
  return { ...(await requireSource(db, id)), token: secret.token };
}

/**
 * Replaces the loops a source may post for. The source row is locked so that two edits at once
 * queue instead of colliding, and the audit's "before" is read under that lock.
 */
export async function setIngestSourceLoops(db: Db, actor: SignedInUser, id: string, loopIds: string[]) {
  await requireSource(db, id);
  await assertLoopsExist(db, loopIds);
  await db.transaction(async (trx) => {
    await trx('ingest_sources').where({ id }).forUpdate().first('id');
    const before = await requireSource(trx, id);
    if (before.revokedAt) throw conflict(`The ingest source "${before.name}" is revoked; create a new source instead.`);
    await replaceSourceLoops(trx, id, loopIds);
    await announceCacheChange(trx, { ingestSources: true });
    await recordAudit(trx, {
      actor,
      action: 'ingest_source.loops_changed',
      targetType: 'ingest_source',
      targetId: id,
      details: { name: before.name, before: before.loops.map((l) => l.id), after: loopIds },
    });
  });
  forgetIngestLookups();
  return requireSource(db, id);
}

export async function revokeIngestSource(db: Db, actor: SignedInUser, id: string): Promise<void> {
  const source = await requireSource(db, id);
  if (source.revokedAt) return;
  await db.transaction(async (trx) => {
    await revokeSource(trx, id);
    await announceCacheChange(trx, { ingestSources: true });
    await recordAudit(trx, {
      actor,
      action: 'ingest_source.revoked',
      targetType: 'ingest_source',
      targetId: id,
      details: { name: source.name },
    });
  });
  forgetIngestLookups();
}
