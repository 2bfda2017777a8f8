import type { SignedInUser } from '../../auth/user.js';
import type { Db } from '../../db/knex.js';
import { AppError, forbidden } from '../../http/errors.js';
import { findActiveVersionId, updateVersion } from './model-versions.repository.js';
import { clearAlert } from '../alerts/alert-raise.js';
import { attachWithin } from '../backtests/evidence.service.js';
import { notifyActiveChanged } from './activation.service.js';
import { changeVersion, describeVersion, requireSecondEngineer, requireStatus } from './version-change.js';

/**
 * draft → in_review, by its author; an unstable or marginal model needs a written justification.
 * Backtests named in `backtestIds` are attached as evidence in the same transaction (same checks as
 * POST …/evidence; one refused backtest refuses the submission).
 */
export function submitVersion(
  db: Db,
  actor: SignedInUser,
  id: string,
  justification: string | undefined,
  backtestIds: string[] = [],
) {
  return changeVersion(db, actor, id, 'submitted', async (trx, version) => {
    requireStatus(version, ['draft'], 'submitted');
    if (version.authorId !== actor.id)
      throw forbidden(`Only the author of ${describeVersion(version).toLowerCase()} can submit it for review.`);
    const stability = version.analysis.stability;
    if (stability !== 'stable' && !justification) {
      throw new AppError(
        422,
        'justification_required',
        `${describeVersion(version)} is ${stability} (spectral radius ` +
          `${version.analysis.spectralRadius.toPrecision(6)}): say in a justification why the twin may run it.`,
      );
    }
    for (const backtestId of new Set(backtestIds)) await attachWithin(trx, version, backtestId, null, actor.id);
    await updateVersion(trx, id, {
      status: 'in_review',
      submitted_at: trx.fn.now(),
      justification: justification || null,
    });
    return {
      stability,
      justification: justification || undefined,
      ...(backtestIds.length ? { backtestIds: [...new Set(backtestIds)] } : {}),
    };
  });
}

/** in_review → approved by a second engineer; remembers which version was active at the time. */
export function approveVersion(db: Db, actor: SignedInUser, id: string, note: string | undefined) {
  return changeVersion(db, actor, id, 'approved', async (trx, version) => {
    requireStatus(version, ['in_review'], 'approved');
    requireSecondEngineer(version, actor, 'approve');
    const activeId = await findActiveVersionId(trx, version.loopId);
    await updateVersion(trx, id, {
      status: 'approved',
      reviewer_id: actor.id,
      reviewed_at: trx.fn.now(),
      review_note: note || null,
      approved_against_version_id: activeId,
    });
    return { note: note || undefined };
  });
}

/** in_review → rejected by a second engineer, with the reason the author reads. */
export function rejectVersion(db: Db, actor: SignedInUser, id: string, reason: string) {
  return changeVersion(db, actor, id, 'rejected', async (trx, version) => {
    requireStatus(version, ['in_review'], 'rejected');
    requireSecondEngineer(version, actor, 'reject');
    await updateVersion(trx, id, {
      status: 'rejected',
      reviewer_id: actor.id,
      reviewed_at: trx.fn.now(),
      reject_reason: reason,
    });
    return { reason };
  });
}

/** active or approved → retired; retiring the active version leaves the loop without a twin. */
export function retireVersion(db: Db, actor: SignedInUser, id: string, note: string | undefined) {
  return changeVersion(db, actor, id, 'retired', async (trx, version) => {
    requireStatus(version, ['active', 'approved'], 'retired');
    await updateVersion(trx, id, { status: 'retired', retired_at: trx.fn.now() });
    if (version.status === 'active') {
      await notifyActiveChanged(trx, version.loopId, null);
      // no version runs any more: a warning that the running one was unstable no longer holds
      await clearAlert(trx, version.loopId, 'model', new Date(), { versionId: id, retired: true });
    }
    return { previousStatus: version.status, note: note || undefined };
  });
}
