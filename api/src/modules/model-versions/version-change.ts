import type { Knex } from 'knex';
import type { SignedInUser } from '../../auth/user.js';
import type { ModelVersion, ModelVersionStatus } from '../../contracts/registry.js';
import type { Db } from '../../db/knex.js';
import { conflict, forbidden, notFound } from '../../http/errors.js';
import { isUuid } from '../../http/params.js';
import { recordAudit } from '../audit/audit.repository.js';
import { lockLoop } from '../loops/loops.repository.js';
import { findVersion, type VersionRecord } from './model-versions.repository.js';
import { getVersion } from './model-versions.service.js';

export const describeVersion = (v: VersionRecord) => `Version ${v.number} of ${v.loopTag}`;

/** 409 unless the version is in one of the given states. */
export function requireStatus(version: VersionRecord, allowed: ModelVersionStatus[], action: string): void {
  if (allowed.includes(version.status)) return;
  const wanted = allowed.map((s) => s.replace('_', ' ')).join(' or ');
  throw conflict(
    `${describeVersion(version)} is ${version.status.replace('_', ' ')}; only a version that is ${wanted} can be ${action}.`,
  );
}

/** The four-eyes rule: the author of a version never reviews it. */
export function requireSecondEngineer(version: VersionRecord, actor: SignedInUser, action: 'approve' | 'reject'): void {
  if (version.authorId !== actor.id) return;
  throw forbidden(
    `Four-eyes rule: a model change is reviewed by a second engineer. You wrote ${describeVersion(version).toLowerCase()}, ` +
      `so another engineer must ${action} it.`,
  );
}

/**
 * Runs one step of the review flow in a transaction that holds the loop's row lock (so steps on one
 * loop never interleave), re-reading the version under the lock, and audits it with the loop's tag
 * and the version number.
 */
export async function changeVersion(
  db: Db,
  actor: SignedInUser,
  id: string,
  action: string,
  apply: (trx: Knex.Transaction, version: VersionRecord) => Promise<Record<string, unknown> | void>,
): Promise<ModelVersion> {
  if (!isUuid(id)) throw notFound(`Model version ${id}`);
  await db.transaction(async (trx) => {
    const unlocked = await findVersion(trx, id);
    if (!unlocked) throw notFound(`Model version ${id}`);
    await lockLoop(trx, unlocked.loopId);
    const version = (await findVersion(trx, id)) as VersionRecord;
    const details = await apply(trx, version);
    await recordAudit(trx, {
      actor,
      action: `model_version.${action}`,
      targetType: 'model_version',
      targetId: id,
      details: { loopId: version.loopId, loopTag: version.loopTag, versionNumber: version.number, ...details },
    });
  });
  return getVersion(db, id);
}
