import type { Knex } from 'knex';
import type { SignedInUser } from '../../auth/user.js';
import type { Evidence } from '../../contracts/backtests.js';
import type { Db } from '../../db/knex.js';
import { AppError, conflict, forbidden, notFound } from '../../http/errors.js';
import { isUuid } from '../../http/params.js';
import { recordAudit } from '../audit/audit.repository.js';
import { lockLoop } from '../loops/loops.repository.js';
import { findVersion, type VersionRecord } from '../model-versions/model-versions.repository.js';
import { deleteEvidence, findEvidenceCandidate, insertEvidence, listEvidence } from './evidence.repository.js';

const describe = (v: VersionRecord) => `Version ${v.number} of ${v.loopTag}`;

async function requireVersion(db: Db, id: string): Promise<VersionRecord> {
  const version = isUuid(id) ? await findVersion(db, id) : undefined;
  if (!version) throw notFound(`Model version ${id}`);
  return version;
}

/** 409 unless the version is still a draft or in review: evidence belongs to the review. */
function requireOpenForEvidence(version: VersionRecord, action: string): void {
  if (version.status === 'draft' || version.status === 'in_review') return;
  throw conflict(
    `${describe(version)} is ${version.status.replace('_', ' ')}; evidence can only be ${action} while a version is a draft or in review.`,
  );
}

/**
 * 403 unless the actor wrote the version: the evidence is the author's case for it, and the
 * reviewer who weighs it must not be able to add to it or take from it (four eyes).
 */
function requireAuthor(version: VersionRecord, actor: SignedInUser, action: string): void {
  if (version.authorId === actor.id) return;
  throw forbidden(
    `Only the author of ${describe(version).toLowerCase()} can ${action} its evidence; ask them, or start a backtest of your own and share its link.`,
  );
}

/**
 * Attaches a backtest to the version inside the caller's transaction (the attach route, and submit
 * with backtestIds): only a succeeded backtest of the version's loop that replayed this version.
 * Returns false when it was attached already.
 */
export async function attachWithin(
  trx: Db,
  version: VersionRecord,
  backtestId: string,
  note: string | null,
  actorId: string,
): Promise<boolean> {
  const backtest = isUuid(backtestId) ? await findEvidenceCandidate(trx, backtestId) : undefined;
  if (!backtest) throw new AppError(422, 'backtest_not_found', `There is no backtest ${backtestId}.`, { backtestId });
  if (backtest.loopId !== version.loopId)
    throw new AppError(
      422,
      'backtest_of_another_loop',
      `Backtest ${backtestId} replayed loop ${backtest.loopTag}, not ${version.loopTag}; attach a backtest of ${version.loopTag}.`,
      { backtestId },
    );
  if (backtest.status !== 'succeeded')
    throw conflict(
      `Backtest ${backtestId} is ${backtest.status}; only a backtest that succeeded can be attached as evidence.`,
      { backtestId },
    );
  if (!backtest.versionIds.includes(version.id))
    throw new AppError(
      422,
      'version_not_in_backtest',
      `Backtest ${backtestId} did not replay version ${version.number}; run a backtest that includes it.`,
      { backtestId },
    );
  return insertEvidence(trx, { versionId: version.id, backtestId, note, attachedBy: actorId });
}

/** Runs `apply` in a transaction holding the loop's row lock (as the review steps do), with the version re-read under it. */
async function withLockedVersion<T>(
  db: Db,
  id: string,
  apply: (trx: Knex.Transaction, version: VersionRecord) => Promise<T>,
): Promise<T> {
  const unlocked = await requireVersion(db, id);
  return db.transaction(async (trx) => {
    await lockLoop(trx, unlocked.loopId);
    return apply(trx, (await findVersion(trx, id)) as VersionRecord);
  });
}

export async function listVersionEvidence(db: Db, versionId: string): Promise<Evidence[]> {
  const version = await requireVersion(db, versionId);
  return listEvidence(db, version.id);
}

/** POST …/evidence: the evidence, and whether it is new (201) or was attached already (200). */
export async function attachEvidence(
  db: Db,
  actor: SignedInUser,
  versionId: string,
  body: { backtestId: string; note?: string },
): Promise<{ evidence: Evidence; created: boolean }> {
  const created = await withLockedVersion(db, versionId, async (trx, version) => {
    requireOpenForEvidence(version, 'attached');
    requireAuthor(version, actor, 'attach');
    const inserted = await attachWithin(trx, version, body.backtestId, body.note || null, actor.id);
    if (inserted)
      await recordAudit(trx, {
        actor,
        action: 'model_version.evidence_attached',
        targetType: 'model_version',
        targetId: version.id,
        details: {
          loopId: version.loopId,
          loopTag: version.loopTag,
          versionNumber: version.number,
          backtestId: body.backtestId,
        },
      });
    return inserted;
  });
  const [evidence] = await listEvidence(db, versionId, body.backtestId);
  return { evidence, created };
}

export async function detachEvidence(
  db: Db,
  actor: SignedInUser,
  versionId: string,
  backtestId: string,
): Promise<void> {
  await withLockedVersion(db, versionId, async (trx, version) => {
    requireOpenForEvidence(version, 'removed');
    requireAuthor(version, actor, 'remove');
    if (!isUuid(backtestId) || !(await deleteEvidence(trx, version.id, backtestId)))
      throw notFound(`Backtest ${backtestId} attached to ${describe(version).toLowerCase()}`);
    await recordAudit(trx, {
      actor,
      action: 'model_version.evidence_detached',
      targetType: 'model_version',
      targetId: version.id,
      details: { loopId: version.loopId, loopTag: version.loopTag, versionNumber: version.number, backtestId },
    });
  });
}
