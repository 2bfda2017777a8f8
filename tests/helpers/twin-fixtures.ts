import knexFactory, { type Knex } from 'knex';
import type { CreateLoopBody, Loop, ModelVersion } from '../../api/src/contracts/registry.js';
import type { IngestResult } from '../../api/src/contracts/ingest.js';
import { act, approvedVersion, createLoop, STABLE_MODEL } from './registry-fixtures.js';
import { tokenRequest, type ApiResponse, type SessionClient } from './session-client.js';

/** A direct connection to the run's database, for what the simulator would write. */
export const openDb = (databaseUrl: string): Knex =>
  knexFactory({ client: 'pg', connection: databaseUrl, pool: { min: 0, max: 2 } });

/** A loop (STABLE_MODEL's signals unless overridden) whose version is active: it has a twin. */
export async function loopWithTwin(
  engineer: SessionClient,
  reviewer: SessionClient,
  overrides: Partial<CreateLoopBody> = {},
  model: Record<string, unknown> = STABLE_MODEL,
): Promise<{ loop: Loop; version: ModelVersion }> {
  const loop = await createLoop(engineer, overrides);
  const version = await approvedVersion(engineer, reviewer, loop.id, model);
  const activated = await act(reviewer, version.id, 'activate', { acknowledgeCautions: true });
  if (activated.status !== 200)
    throw new Error(`activation failed: ${activated.status} ${JSON.stringify(activated.body)}`);
  return { loop, version };
}

/** The twin state the simulator persists once it runs the version: from then on the loop has a twin. */
export async function markTwinRunning(
  db: Knex,
  loop: Loop,
  version: ModelVersion,
  state: { k?: number; x?: number[] } = {},
): Promise<void> {
  const x = state.x ?? new Array<number>(version.A.length).fill(0);
  const k = state.k ?? Math.round(Date.now() / (loop.samplePeriodS * 1000));
  await db('twin_state').insert({ loop_id: loop.id, version_id: version.id, k, x }).onConflict('loop_id').merge();
}

/** A personal access token of the signed-in client. */
export async function personalToken(client: SessionClient, label = 'twin test'): Promise<string> {
  const response = await client.request<{ token: string }>('POST', '/api/v1/access-tokens', { label }, { csrf: true });
  if (response.status !== 201) throw new Error(`token creation failed: ${response.status}`);
  return response.body.token;
}

export interface PostedReading {
  t: string;
  u: unknown[];
  y: unknown[];
}

/** Grid-aligned epoch ms `samplesAgo` sample periods before now (T in seconds). */
export function slotMsAgo(samplesAgo: number, samplePeriodS = 1): number {
  const periodMs = samplePeriodS * 1000;
  return (Math.round(Date.now() / periodMs) - samplesAgo) * periodMs;
}

export const reading = (ms: number, u: unknown[], y: unknown[]): PostedReading => ({
  t: new Date(ms).toISOString(),
  u,
  y,
});

export function postReadings(
  baseUrl: string,
  token: string,
  loopId: string,
  readings: unknown[],
): Promise<ApiResponse<IngestResult>> {
  return tokenRequest<IngestResult>(baseUrl, token, 'POST', `/api/v1/loops/${loopId}/readings`, { readings });
}

/** A prediction row as the simulator's stepping service stores it. */
export async function insertPrediction(
  db: Knex,
  row: { loopId: string; versionId: string; slotMs: number; samplePeriodS?: number; x: number[]; y: number[] },
): Promise<void> {
  const k = Math.round(row.slotMs / ((row.samplePeriodS ?? 1) * 1000));
  await db('predictions').insert({
    loop_id: row.loopId,
    slot_at: new Date(row.slotMs),
    k,
    version_id: row.versionId,
    x: row.x,
    y: row.y,
  });
}

/** Polls until read() gives a value. */
export async function eventually<T>(
  read: () => T | undefined | Promise<T | undefined>,
  what: string,
  timeoutMs = 5000,
  intervalMs = 20,
): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await read();
    if (value !== undefined) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, intervalMs));
  }
}

/** A loop with two measured outputs and the stable two-state model the ingest and series suites share. */
export const TWO_OUTPUTS = {
  outputs: [
    { name: 'Level', unit: 'm' },
    { name: 'Flow', unit: 'm³/h' },
  ],
};
export const TWO_OUTPUT_MODEL = {
  A: [
    [0.9, 0.05],
    [0, 0.7],
  ],
  B: [[0], [0.3]],
  C: [
    [1, 0],
    [0, 1],
  ],
};
