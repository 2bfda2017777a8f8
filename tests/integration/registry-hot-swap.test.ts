import knexFactory, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Loop } from '../../api/src/contracts/registry.js';
import { LISTENER_APPLICATION_NAME } from '../../simulator/src/registry/activation-listener.js';
import { createTwinRegistry, type SwapEvent, type TwinRegistry } from '../../simulator/src/registry/twin-registry.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { act, approvedVersion, createLoop, ENGINEER, REVIEWER, signedIn } from '../helpers/registry-fixtures.js';
import type { SessionClient } from '../helpers/session-client.js';

const stack = inject('stack');
let api: RunningApi;
let db: Knex;
let registry: TwinRegistry;
let engineer: SessionClient;
let reviewer: SessionClient;
const swaps: (SwapEvent & { atMs: number })[] = [];
const logged: string[] = [];

beforeAll(async () => {
  api = await startApi(stack);
  db = knexFactory({ client: 'pg', connection: stack.databaseUrl, pool: { min: 0, max: 2 } });
  registry = createTwinRegistry({
    db,
    databaseUrl: stack.databaseUrl,
    reconnectDelayMs: 200,
    log: (line) => logged.push(line),
    onSwap: (event) => swaps.push({ ...event, atMs: Date.now() }),
  });
  await registry.start();
  [engineer, reviewer] = await Promise.all([ENGINEER, REVIEWER].map((email) => signedIn(api.url, email)));
});
afterAll(async () => {
  await registry.stop();
  await db.destroy();
  await api.close();
});

async function eventually<T>(read: () => T | undefined, what: string, timeoutMs = 8000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = read();
    if (value) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}; log: ${logged.join(' | ')}`);
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
}

const activate = async (loop: Loop) => {
  const version = await approvedVersion(engineer, reviewer, loop.id);
  expect((await act(reviewer, version.id, 'activate', { acknowledgeCautions: true })).status).toBe(200);
  return version;
};
const swapTo = (loop: Loop, versionNumber: number | null) =>
  eventually(
    () => swaps.find((s) => s.loopId === loop.id && s.toVersion === versionNumber),
    `loop ${loop.tag} → version ${versionNumber}`,
  );

describe('the simulator registry follows activations', () => {
  it('loads every active version at start, with the loop operating point as the state', async () => {
    const [{ id }] = await db('loops').where({ tag: 'AER-DO-101' }).select('id');
    expect(registry.size()).toBeGreaterThanOrEqual(4);
    expect(registry.get(id)).toMatchObject({
      loopTag: 'AER-DO-101',
      version: { number: 1 },
      x: [3720, 2],
      model: { u0: [62] },
    });
  });

  it('swaps in an activated version through NOTIFY at the next sample boundary, carrying the state', async () => {
    const loop = await createLoop(engineer, { samplePeriodS: 1 });
    const first = await activate(loop);
    const started = await swapTo(loop, 1);
    expect(started).toMatchObject({ fromVersion: null, carried: false });
    expect(registry.get(loop.id)?.version.id).toBe(first.id);
    const second = await activate(loop);
    const swapped = await swapTo(loop, 2);
    expect(swapped).toMatchObject({ fromVersion: 1, carried: true, reason: 'state carried across (2 states)' });
    expect(swapped.k).toBeGreaterThan(started.k);
    // the swap waits for the boundary k·T and happens before the next one
    expect(swapped.atMs).toBeGreaterThanOrEqual(swapped.k * 1000);
    expect(swapped.atMs).toBeLessThan((swapped.k + 1) * 1000);
    expect(registry.get(loop.id)?.version.id).toBe(second.id);
  });

  it('drops the twin when its active version is retired', async () => {
    const loop = await createLoop(engineer, { samplePeriodS: 0.5 });
    const version = await activate(loop);
    await swapTo(loop, 1);
    await act(engineer, version.id, 'retire', { note: 'test' });
    await swapTo(loop, null);
    expect(registry.get(loop.id)).toBeUndefined();
  });

  it('reconnects after losing its connection and catches up on what it missed', async () => {
    await db.raw(
      'SELECT pg_terminate_backend(pid) FROM pg_stat_activity WHERE application_name = ? AND datname = current_database()',
      [LISTENER_APPLICATION_NAME],
    );
    const loop = await createLoop(engineer, { samplePeriodS: 0.5 });
    await activate(loop);
    await swapTo(loop, 1);
    await eventually(
      () => logged.find((line) => line.startsWith(`lost the shadowloop_model_activated listener`)),
      'the lost connection to be noticed',
    );
    expect(registry.isListening()).toBe(true);
  });
});
