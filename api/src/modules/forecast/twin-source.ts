import { modelAtOperatingPoint, type Matrix, type StateSpaceModel } from '@shadowloop/simulator/engine';
import type { Db } from '../../db/knex.js';
import { conflict } from '../../http/errors.js';
import { requireLiveLoop } from '../readings/live-loop.js';

/** Where a forecast starts: the active model, the twin's persisted state x(k) and the inputs to hold. */
export interface TwinStart {
  loopId: string;
  tag: string;
  samplePeriodS: number;
  versionId: string;
  model: StateSpaceModel;
  k: number;
  x: number[];
  u: number[];
}

type Raw = {
  version_id: string | null;
  a: Matrix;
  b: Matrix;
  c: Matrix | null;
  d: Matrix | null;
  operating_point: { x0?: number[]; u0?: number[]; y0?: number[] };
  state_k: string | null;
  state_x: number[] | null;
  state_version_id: string | null;
  newest_u: number[] | null;
};

async function loadTwinRow(db: Db, loopId: string): Promise<Raw> {
  const { rows } = (await db.raw(
    `
    SELECT v.id AS version_id, v.a, v.b, v.c, v.d, l.operating_point,
      s.k AS state_k, s.x AS state_x, s.version_id AS state_version_id,
      (SELECT r.u FROM readings r WHERE r.loop_id = l.id ORDER BY r.slot_at DESC LIMIT 1) AS newest_u
    FROM loops l
    LEFT JOIN model_versions v ON v.loop_id = l.id AND v.status = 'active'
    LEFT JOIN twin_state s ON s.loop_id = l.id
    WHERE l.id = ?`,
    [loopId],
  )) as { rows: Raw[] };
  return rows[0];
}

const noTwin = (tag: string, why: string) => conflict(`${tag} has no twin to forecast from yet: ${why}.`);

/**
 * The active version's model with the loop's operating point, the twin state the simulator
 * persisted for that version, and the newest reading's inputs (else the operating point's).
 * 409 when the loop has no active version or its twin has not stepped yet.
 */
export async function loadTwinStart(db: Db, loopId: string): Promise<TwinStart> {
  const loop = await requireLiveLoop(db, loopId);
  const row = await loadTwinRow(db, loop.id);
  if (!row.version_id) throw noTwin(loop.tag, 'the loop has no active model version');
  if (row.state_version_id !== row.version_id || row.state_k === null || !row.state_x) {
    throw noTwin(loop.tag, 'the simulator has not stepped the active version yet; try again in a few sample periods');
  }
  const model = modelAtOperatingPoint(row, row.operating_point);
  if (row.state_x.length !== row.a.length)
    throw noTwin(loop.tag, 'the stored twin state does not fit the active version');
  const u = row.newest_u?.length === loop.inputs ? row.newest_u : (model.u0 ?? new Array<number>(loop.inputs).fill(0));
  return {
    loopId: loop.id,
    tag: loop.tag,
    samplePeriodS: loop.samplePeriodS,
    versionId: row.version_id,
    model,
    k: Number(row.state_k),
    x: row.state_x,
    u,
  };
}
