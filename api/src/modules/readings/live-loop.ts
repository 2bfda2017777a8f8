import type { Db } from '../../db/knex.js';
import { notFound } from '../../http/errors.js';
import { isUuid } from '../../http/params.js';
import { createTtlCache } from '../../lib/ttl-cache.js';

/** What ingest, trends and forecasts need to know about a loop. */
export interface LiveLoop {
  id: string;
  tag: string;
  name: string;
  /** Alerts are recorded but nobody is called while the loop is in maintenance. */
  maintenance: boolean;
  outputSignals: { name: string; unit: string }[];
  area: string;
  samplePeriodS: number;
  inputs: number;
  outputs: number;
  staleAfterSamples: number;
  residualBand: (number | null)[] | null;
  hasTwin: boolean;
}

type Raw = {
  id: string;
  tag: string;
  name: string;
  maintenance: boolean;
  output_signals: { name: string; unit: string }[];
  area_id: string;
  sample_period_s: number;
  inputs: number;
  outputs: number;
  stale_after_samples: number;
  residual_band: unknown;
  has_twin: boolean;
};

/** loops.residual_band is read as one number (or null) per output; any other shape means "no band set". */
function bandOf(value: unknown): (number | null)[] | null {
  if (!Array.isArray(value)) return null;
  return value.map((v) => (typeof v === 'number' && Number.isFinite(v) && v > 0 ? v : null));
}

/**
 * The loop has a twin when its active version is running: the simulator has persisted a twin
 * state for that version. An active version the simulator has not started yet is no twin.
 */
export const TWIN_RUNNING_SQL = `EXISTS (SELECT 1 FROM twin_state s JOIN model_versions v ON v.id = s.version_id AND v.status = 'active' WHERE s.loop_id = l.id)`;

export async function findLiveLoop(db: Db, loopId: string): Promise<LiveLoop | undefined> {
  const row = (await db('loops as l')
    .where('l.id', loopId)
    .first(
      'l.id',
      'l.tag',
      'l.name',
      'l.maintenance',
      'l.outputs as output_signals',
      'l.area_id',
      'l.sample_period_s',
      'l.stale_after_samples',
      'l.residual_band',
      db.raw('jsonb_array_length(l.inputs) AS inputs'),
      db.raw('jsonb_array_length(l.outputs) AS outputs'),
      db.raw(`${TWIN_RUNNING_SQL} AS has_twin`),
    )) as Raw | undefined;
  return (
    row && {
      id: row.id,
      tag: row.tag,
      name: row.name,
      maintenance: row.maintenance,
      outputSignals: row.output_signals,
      area: row.area_id,
      samplePeriodS: row.sample_period_s,
      inputs: row.inputs,
      outputs: row.outputs,
      staleAfterSamples: row.stale_after_samples,
      residualBand: bandOf(row.residual_band),
      hasTwin: row.has_twin,
    }
  );
}

/** The loop, or 404 (also for an id that is not a UUID). */
export async function requireLiveLoop(db: Db, loopId: string): Promise<LiveLoop> {
  const loop = isUuid(loopId) ? await findLiveLoop(db, loopId) : undefined;
  if (!loop) throw notFound(`Loop ${loopId}`);
  return loop;
}

/**
 * For ingest, which may see a loop many times a second: the loop as read at most LIVE_LOOP_TTL_MS
 * ago. Loop edits, maintenance, stale-rule saves and activations clear it in every api process when
 * they commit (a cache notice, api/src/lib/cache-notice.ts); a twin the simulator starts is seen
 * within the time limit (until then the loop's status reads `no_twin` in the ingest's fold).
 */
export const LIVE_LOOP_TTL_MS = 60_000;
const recent = createTtlCache<string, LiveLoop>(LIVE_LOOP_TTL_MS);

/** After a change of the loop (maintenance, band, stale limit), so this process sees it at once. */
export function forgetLiveLoop(loopId: string): void {
  recent.delete(loopId);
}

export async function requireRecentLiveLoop(db: Db, loopId: string): Promise<LiveLoop> {
  const known = recent.get(loopId);
  if (known) return known;
  const loop = await requireLiveLoop(db, loopId);
  recent.set(loopId, loop);
  return loop;
}
