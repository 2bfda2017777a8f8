import { forecast, movePreview, type Forecast as EngineForecast } from '@shadowloop/simulator/engine';
import type { z } from 'zod';
import type { Forecast, MovePreview, MovePreviewBodySchema } from '../../contracts/twin.js';
import type { Db } from '../../db/knex.js';
import { badRequest } from '../../http/errors.js';
import { slotTimeMs } from '../readings/sample-grid.js';
import { loadTwinStart, type TwinStart } from './twin-source.js';

/** Rows per sample → one array per signal. */
const bySignal = (rows: number[][]): number[][] =>
  rows.length ? rows[0].map((_, i) => rows.map((row) => row[i])) : [];

function trajectory(start: TwinStart, f: EngineForecast) {
  const t = f.outputs.map((_, j) => new Date(slotTimeMs(start.k + j + 1, start.samplePeriodS)).toISOString());
  return { t, y: bySignal(f.outputs), x: bySignal(f.states) };
}

const header = (start: TwinStart) => ({ loopId: start.loopId, versionId: start.versionId, k: start.k, u: start.u });

/** The twin's next n samples from its persisted state x(k), with the newest inputs held (A^j x + H(j) u). */
export async function loopForecast(db: Db, loopId: string, n: number): Promise<Forecast> {
  const start = await loadTwinStart(db, loopId);
  return { ...header(start), ...trajectory(start, forecast(start.model, start.x, start.u, n)) };
}

/** The forecast after a step of delta in one input, beside the forecast with the inputs held. */
export async function loopMovePreview(
  db: Db,
  loopId: string,
  body: z.infer<typeof MovePreviewBodySchema>,
): Promise<MovePreview> {
  const start = await loadTwinStart(db, loopId);
  if (body.inputIndex >= start.u.length) {
    throw badRequest(
      `inputIndex ${body.inputIndex} is out of range: ${start.tag} has ${start.u.length} input${start.u.length === 1 ? '' : 's'} (0 … ${start.u.length - 1}).`,
    );
  }
  const moved = movePreview(start.model, start.x, start.u, body.inputIndex, body.delta, body.n);
  const baseline = trajectory(start, forecast(start.model, start.x, start.u, body.n));
  return { ...header(start), ...trajectory(start, moved), inputIndex: body.inputIndex, delta: body.delta, baseline };
}
