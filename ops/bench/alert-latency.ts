import { io, type Socket } from 'socket.io-client';
import type { ClientToServerEvents, ServerToClientEvents } from '@shadowloop/simulator/events';
import type { Db } from '../../api/src/db/knex.js';
import { createPoster } from './http-post.js';
import { seededUniform } from '@shadowloop/simulator/seeded-random';

/** A band rule every bench loop gets: |r| > 0.3 for 3 samples raises. */
const LIMIT = 0.3;
const RAISE_AFTER = 3;
const NOISE_SD = 0.05;
const FAULT = 0.6;
const percentile = (sorted: number[], p: number) =>
  sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];

/** Box–Muller on a small seeded generator (mulberry32): the same noise every run. */
function seededNormal(seed: number) {
  const uniform = seededUniform(seed);
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

/** The bench loops' band rules, and the twin's prediction 0.5 for every slot of the run. */
export async function prepareAlertLoops(
  db: Db,
  loopIds: string[],
  samplePeriodS: number,
  fromK: number,
  slots: number,
) {
  const rules = await db('drift_rules')
    .insert(
      loopIds.map((loopId) => ({
        loop_id: loopId,
        kind: 'band',
        priority: 2,
        params: JSON.stringify({
          mode: 'absolute',
          limits: [LIMIT],
          raiseAfter: RAISE_AFTER,
          clearAfter: 5,
          deadband: 0.2,
        }),
      })),
    )
    .returning<{ id: string; priority: number; params: unknown }[]>(['id', 'priority', 'params']);
  await db('drift_rule_versions').insert(
    rules.map((r) => ({
      rule_id: r.id,
      version: 1,
      enabled: true,
      priority: r.priority,
      params: JSON.stringify(r.params),
    })),
  );
  const days = [fromK, fromK + slots].map((k) => new Date(k * samplePeriodS * 1000).toISOString().slice(0, 10));
  await db.raw('SELECT shadowloop_ensure_day_partitions(?::date, ?::date)', days);
  await db.raw(
    `INSERT INTO predictions (loop_id, slot_at, k, version_id, x, y)
    SELECT l.id, to_timestamp(k * ?), k, v.id, ARRAY[0.5, 0]::float8[], ARRAY[0.5]::float8[]
    FROM loops l JOIN model_versions v ON v.loop_id = l.id AND v.status = 'active',
      generate_series(?::bigint, ?::bigint) AS k
    WHERE l.id = ANY(?::uuid[])`,
    [samplePeriodS, fromK, fromK + slots - 1, loopIds],
  );
}

/**
 * Every loop posts one reading per sample period, the posts spread evenly over the period, with a
 * bridge's ingest token; readings follow the prediction with noise (sd 0.05) until the loop's fault
 * adds 0.6, so its band rule (limit 0.3, 3 samples) raises on the third faulty reading. The loops'
 * faults begin in turn over `periods.spread` sample periods (loop i in period healthy + i mod
 * spread), as faults of independent loops would, not all in the same second. One client (a
 * signed-in person's token) is in the alerts room. Latency: from just before the POST of that third
 * faulty reading to the arrival of the loop's alert:raised.
 */
export async function alertLatency(
  url: string,
  tokens: { bridge: string; watcher: string },
  loopIds: string[],
  samplePeriodS: number,
  fromK: number,
  periods: { healthy: number; spread: number },
) {
  const raisingPostAt = new Map<string, number>();
  const latencies: number[] = [];
  const falseAlerts: string[] = [];
  const socket: Socket<ServerToClientEvents, ClientToServerEvents> = io(url, {
    transports: ['websocket'],
    auth: { token: tokens.watcher },
    reconnection: false,
    forceNew: true,
  });
  await new Promise<void>((resolve, reject) => {
    socket.once('connect', resolve);
    socket.once('connect_error', reject);
  });
  socket.on('alert:raised', (alert) => {
    const sent = raisingPostAt.get(alert.loopId);
    if (sent === undefined) falseAlerts.push(alert.loopId);
    else latencies.push(performance.now() - sent);
  });
  const poster = createPoster(url, tokens.bridge, 64);
  const noise = seededNormal(11);
  const pending: Promise<unknown>[] = [];
  let failures = 0;
  const periodMs = samplePeriodS * 1000;
  // the first slot starts at the next period boundary after fromK's slot time
  const begin = performance.now() + Math.max(0, fromK * periodMs - Date.now());
  const total = periods.healthy + periods.spread + RAISE_AFTER;
  for (let p = 0; p < total; p++) {
    const k = fromK + p;
    for (let i = 0; i < loopIds.length; i++) {
      const wait = begin + p * periodMs + (i * periodMs) / loopIds.length - performance.now();
      if (wait > 1) await new Promise((resolve) => setTimeout(resolve, wait));
      const onset = periods.healthy + (i % periods.spread);
      const y = 0.5 + NOISE_SD * noise() + (p >= onset ? FAULT : 0);
      if (p === onset + RAISE_AFTER - 1) raisingPostAt.set(loopIds[i], performance.now());
      const body = `{"readings":[{"t":"${new Date(k * periodMs).toISOString()}","u":[1],"y":[${y}]}]}`;
      pending.push(
        poster.post(`/api/v1/loops/${loopIds[i]}/readings`, body).then((r) => {
          if (r.status !== 200) failures += 1;
        }),
      );
    }
  }
  await Promise.all(pending);
  await new Promise((resolve) => setTimeout(resolve, 2000));
  socket.disconnect();
  poster.close();
  const sorted = [...latencies].sort((a, b) => a - b);
  return {
    expected: loopIds.length,
    received: latencies.length,
    falseAlerts: falseAlerts.length,
    failures,
    p50: percentile(sorted, 50),
    p99: percentile(sorted, 99),
  };
}
