import { step, type StateSpaceModel } from '@shadowloop/simulator/engine';
import type { Knex } from 'knex';
import type { Backtest } from '../../api/src/contracts/backtests.js';
import type { ApiResponse, SessionClient } from './session-client.js';
import { seededUniform } from '../../simulator/src/demo-plant/random.js';

/** One recorded slot: its number and the inputs and outputs read there. */
/** The two-tank plant the backtest tests record, at the operating point x0 = [25, 50], u0 = [50] (y0 = C x0 = 25). */
export const TANK_OPERATING_POINT = { x0: [25, 50], u0: [50] };
export const TANK_PLANT = {
  A: [
    [0.9, 0.05],
    [0, 0.7],
  ],
  B: [[0], [0.3]],
  C: [[1, 0]],
};

export interface RecordedSlot {
  k: number;
  u: number[];
  y: number[];
}

/**
 * A noise-free recording of `slots` slots from slot `firstK`, made by the engine's step with the
 * model (at its operating point): x(k+1) = x0 + A (x − x0) + B (u − u0), y(k) = y0 + C (x − x0),
 * from x = x0. The inputs step to a new value every `hold` slots (within u0 ± spread). Slots listed
 * in `missing` are left out; put them inside one input step, so the inputs held across the gap are
 * the inputs the plant had.
 */
export function recordModel(
  model: StateSpaceModel,
  options: { firstK: number; slots: number; hold: number; spread: number; missing?: Set<number>; seed?: number },
): RecordedSlot[] {
  const random = seededUniform(options.seed ?? 7);
  const u0 = model.u0 ?? model.B[0].map(() => 0);
  let x = (model.x0 ?? model.A.map(() => 0)).slice();
  let u = u0.slice();
  const recorded: RecordedSlot[] = [];
  for (let i = 0; i < options.slots; i++) {
    if (i % options.hold === 0) u = u0.map((v) => v + options.spread * (2 * random() - 1));
    const next = step(model, x, u);
    if (!options.missing?.has(i)) recorded.push({ k: options.firstK + i, u: u.slice(), y: next.y });
    x = next.x;
  }
  return recorded;
}

/** Stores the recording as readings of the loop (as the ingest would, without predictions). */
export async function insertReadings(db: Knex, loopId: string, samplePeriodS: number, rows: RecordedSlot[]) {
  for (let i = 0; i < rows.length; i += 1000) {
    await db('readings').insert(
      rows.slice(i, i + 1000).map((r) => {
        const at = new Date(r.k * samplePeriodS * 1000);
        return { loop_id: loopId, slot_at: at, k: r.k, t: at, u: r.u, y: r.y };
      }),
    );
  }
}

/** The recording as a CSV: time, then one column per input and output, named by the given headers. */
export function recordingCsv(rows: RecordedSlot[], samplePeriodS: number, header: string[]): string {
  const lines = rows.map((r) => [new Date(r.k * samplePeriodS * 1000).toISOString(), ...r.u, ...r.y].join(','));
  return `${[header.join(','), ...lines].join('\n')}\n`;
}

/** Multipart with the text fields first and the file last, as the backtest upload expects. */
export async function sendUpload<T>(
  client: SessionClient,
  path: string,
  csv: string,
  fields: Record<string, string>,
): Promise<ApiResponse<T>> {
  const form = new FormData();
  for (const [name, value] of Object.entries(fields)) form.append(name, value);
  form.append('file', new Blob([csv], { type: 'text/csv' }), 'recording.csv');
  return client.postForm<T>(path, form);
}

/** Polls GET /api/v1/backtests/{id} until its status is one of `statuses`. */
export async function waitForBacktest(
  client: SessionClient,
  id: string,
  statuses: Backtest['status'][],
  timeoutMs = 20_000,
): Promise<Backtest> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const response = await client.request<Backtest>('GET', `/api/v1/backtests/${id}`);
    if (response.status !== 200)
      throw new Error(`GET backtest ${id}: ${response.status} ${JSON.stringify(response.body)}`);
    if (statuses.includes(response.body.status)) return response.body;
    if (Date.now() > deadline)
      throw new Error(
        `backtest ${id} is still ${response.body.status} (${response.body.stage}); wanted ${statuses.join(' or ')}`,
      );
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}
