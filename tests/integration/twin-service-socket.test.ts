import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { createAdapter } from '@socket.io/postgres-adapter';
import knexFactory, { type Knex } from 'knex';
import type pg from 'pg';
import { Server } from 'socket.io';
import { io as connect, type Socket } from 'socket.io-client';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import {
  loopRoom,
  type ClientToServerEvents,
  type ServerToClientEvents,
  type TwinSample,
} from '../../simulator/src/events.js';
import { createSampleEmitter } from '../../simulator/src/twin/index.js';
import { createArea, insertLoop, insertReadings, slotOf } from '../helpers/twin-service-fixtures.js';
import { eventually, startTwins, type RunningTwins } from '../helpers/twin-service-runner.js';
import { createPgPool } from '../../api/src/lib/pg-pool.js';

const stack = inject('stack');
const PERIOD_S = 0.5;
let db: Knex;
let serverPool: pg.Pool;
let simulatorPool: pg.Pool;
let httpServer: http.Server;
let io: Server<ClientToServerEvents, ServerToClientEvents>;
let client: Socket<ServerToClientEvents, ClientToServerEvents>;
let twins: RunningTwins | undefined;

beforeAll(async () => {
  db = knexFactory({ client: 'pg', connection: stack.databaseUrl, pool: { min: 0, max: 4 } });
  [serverPool, simulatorPool] = [createPgPool(stack.databaseUrl, 3), createPgPool(stack.databaseUrl, 3)];
  // a plain socket.io server, as the api runs it: same adapter, sockets join the rooms they watch
  httpServer = http.createServer();
  io = new Server(httpServer, { adapter: createAdapter(serverPool) });
  io.on('connection', (socket) => {
    socket.on('loop:watch', ({ loopId }, ack) => {
      void socket.join(loopRoom(loopId));
      ack?.({ ok: true });
    });
  });
  await new Promise<void>((resolve) => httpServer.listen(0, '127.0.0.1', resolve));
});

afterAll(async () => {
  client?.disconnect();
  await twins?.stop();
  await io.close();
  await Promise.all([serverPool.end(), simulatorPool.end(), db.destroy()]);
});

describe('twin samples reach socket clients through the PostgreSQL adapter', () => {
  it('delivers twin:sample emitted by the simulator’s headless server to a client watching the loop', async () => {
    const area = await createArea(db);
    const { loopId } = await insertLoop(db, area, { A: [[0.5]], B: [[1]] }, { samplePeriodS: PERIOD_S });
    const now = slotOf(Date.now(), PERIOD_S);
    await insertReadings(
      db,
      loopId,
      PERIOD_S,
      Array.from({ length: 40 }, (_, i) => ({ k: now - 2 + i, u: [1], y: [2] })),
    );

    client = connect(`http://127.0.0.1:${(httpServer.address() as AddressInfo).port}`, { transports: ['websocket'] });
    await new Promise<void>((resolve) => client.on('connect', resolve));
    expect(await client.emitWithAck('loop:watch', { loopId })).toEqual({ ok: true });
    const received = new Promise<TwinSample>((resolve) => client.on('twin:sample', resolve));

    twins = await startTwins(db, stack.databaseUrl, area, {}, createSampleEmitter(simulatorPool));
    const sample = await received;
    expect(sample).toMatchObject({ loopId, measured: null, residual: null, status: 'in_step' });
    // the sample goes out before the INSERT of its prediction completes
    const stored = await eventually(
      () => db('predictions').where({ loop_id: loopId, k: sample.k }).first(),
      'the stored prediction',
    );
    expect(sample.predicted).toEqual(stored.y);
    expect(sample.t).toBe(new Date(sample.k * PERIOD_S * 1000).toISOString());
  });
});
