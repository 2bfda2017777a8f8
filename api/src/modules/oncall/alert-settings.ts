import type { SignedInUser } from '../../auth/user.js';
import type { AlertSettings } from '../../contracts/alerts.js';
import type { Db } from '../../db/knex.js';
import { badRequest } from '../../http/errors.js';
import { recordAudit } from '../audit/audit.repository.js';

type Raw = {
  secondary_after_min: number;
  area_after_min: number;
  ack_link_ttl_min: number;
  shelve_max_hours: number;
  target_per_day: number;
  target_per_10min: number;
  flood_per_10min: number;
};

const toSettings = (r: Raw): AlertSettings => ({
  secondaryAfterMin: r.secondary_after_min,
  areaAfterMin: r.area_after_min,
  ackLinkTtlMin: r.ack_link_ttl_min,
  shelveMaxHours: r.shelve_max_hours,
  targetPerDay: r.target_per_day,
  targetPer10Min: r.target_per_10min,
  floodPer10Min: r.flood_per_10min,
});

const toRow = (s: AlertSettings): Raw => ({
  secondary_after_min: s.secondaryAfterMin,
  area_after_min: s.areaAfterMin,
  ack_link_ttl_min: s.ackLinkTtlMin,
  shelve_max_hours: s.shelveMaxHours,
  target_per_day: s.targetPerDay,
  target_per_10min: s.targetPer10Min,
  flood_per_10min: s.floodPer10Min,
});

/** The one settings row (the migration inserts it): escalation timings, link lifetime, load targets. */
export async function readAlertSettings(db: Db): Promise<AlertSettings> {
  return toSettings((await db('alert_settings').where({ id: 1 }).first()) as Raw);
}

/**
 * Replaces the settings. The body schema already refuses areaAfterMin ≤ secondaryAfterMin; the
 * check is repeated here so a caller that skips the schema gets the same 400 and not the CHECK.
 */
export async function saveAlertSettings(db: Db, actor: SignedInUser, next: AlertSettings): Promise<AlertSettings> {
  if (next.areaAfterMin <= next.secondaryAfterMin)
    throw badRequest('areaAfterMin must be greater than secondaryAfterMin.', [
      { path: 'body.areaAfterMin', message: `must be greater than secondaryAfterMin (${next.secondaryAfterMin})` },
    ]);
  await db.transaction(async (trx) => {
    const before = toSettings((await trx('alert_settings').where({ id: 1 }).forUpdate().first()) as Raw);
    await trx('alert_settings')
      .where({ id: 1 })
      .update({ ...toRow(next), updated_by: actor.id, updated_at: trx.fn.now() });
    await recordAudit(trx, {
      actor,
      action: 'alert_settings.changed',
      targetType: 'alert_settings',
      details: { before, after: next },
    });
  });
  return readAlertSettings(db);
}
