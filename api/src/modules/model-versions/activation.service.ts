import type { Knex } from 'knex';
import { announceCacheChange } from '../../lib/cache-notice.js';
import type { SignedInUser } from '../../auth/user.js';
import type { Db } from '../../db/knex.js';
import { conflict } from '../../http/errors.js';
import type { TwinPublisher } from '../../realtime/publisher.js';
import { recordAudit } from '../audit/audit.repository.js';
import { publishAlertChanges, type AlertChange } from '../alerts/alerts.service.js';
import { checkActiveModel } from '../alerts/model-alert.js';
import { findActiveVersionId, findVersion, updateVersion } from './model-versions.repository.js';
import { changeVersion, describeVersion, requireStatus } from './version-change.js';

/** The simulator LISTENs here (simulator/src/registry) and swaps the loop's twin. */
export const MODEL_ACTIVATED_CHANNEL = 'shadowloop_model_activated';

/** Tells the simulator, at commit, that the loop's active version changed (versionId null: none). */
export async function notifyActiveChanged(
  trx: Knex.Transaction,
  loopId: string,
  versionId: string | null,
): Promise<void> {
  await trx.raw('SELECT pg_notify(?, ?)', [MODEL_ACTIVATED_CHANNEL, JSON.stringify({ loopId, versionId })]);
  // the ingest's cached loop (twin or not) and rule set (the active model) change with it
  await announceCacheChange(trx, { loopId });
}

const rethrowSecondActive = (error: { code?: string; constraint?: string }): never => {
  if (error.code === '23505' && error.constraint === 'model_versions_one_active') {
    throw conflict('Another version of this loop became active at the same moment; reload the loop and try again.');
  }
  throw error;
};

/**
 * approved → active; the previous active version is retired in the same transaction. An approval
 * was given against the version active at that time: when that has changed since (another
 * activation won, or the active one was retired), activation is refused with 409 and the version
 * needs a fresh review. The loop row lock queues concurrent activations; the partial unique index
 * is the last guard.
 */
export async function activateVersion(db: Db, actor: SignedInUser, id: string, publisher?: TwinPublisher) {
  let modelAlert: AlertChange[] = [];
  const activated = await changeVersion(db, actor, id, 'activated', async (trx, version) => {
    requireStatus(version, ['approved'], 'activated');
    const activeId = await findActiveVersionId(trx, version.loopId);
    if (activeId !== version.approvedAgainstVersionId) {
      const now = activeId ? await findVersion(trx, activeId) : undefined;
      throw conflict(
        `${describeVersion(version)} was approved while ${await versionLabel(trx, version.approvedAgainstVersionId)} was active, ` +
          `but ${now ? `version ${now.number}` : 'no version'} is active now. Its review no longer matches the running model: ` +
          `retire version ${version.number} and submit its matrices again as a new draft.`,
      );
    }
    const previous = activeId ? await findVersion(trx, activeId) : undefined;
    if (previous) {
      await updateVersion(trx, previous.id, { status: 'retired', retired_at: trx.fn.now() });
      await recordAudit(trx, {
        actor,
        action: 'model_version.retired',
        targetType: 'model_version',
        targetId: previous.id,
        details: {
          loopId: version.loopId,
          loopTag: version.loopTag,
          versionNumber: previous.number,
          replacedBy: version.number,
        },
      });
    }
    await updateVersion(trx, id, { status: 'active', activated_by: actor.id, activated_at: trx.fn.now() }).catch(
      rethrowSecondActive,
    );
    await notifyActiveChanged(trx, version.loopId, id);
    // the model warning: an unstable active version raises the loop's `model` alert, a sound one clears it
    modelAlert = await checkActiveModel(trx, version.loopId, id);
    return { replacedVersionNumber: previous?.number ?? null, cautionsAcknowledged: true };
  });
  if (publisher) await publishAlertChanges(db, publisher, modelAlert);
  return activated;
}

async function versionLabel(trx: Knex.Transaction, versionId: string | null): Promise<string> {
  const version = versionId ? await findVersion(trx, versionId) : undefined;
  return version ? `version ${version.number}` : 'no version';
}
