import { io, type Socket } from 'socket.io-client';
import type { ClientToServerEvents, ServerToClientEvents } from '@shadowloop/simulator/events';
import { createPoster, readingsBody } from './http-post.js';

/** Seconds posted before counting: new pool connections, caches and the first plans of each backend. */
const WARM_UP_S = 5;
const percentile = (sorted: number[], p: number) =>
  sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];

/** One socket.io client (a signed-in person's token) watching every loop; calls `seen` per twin sample. */
async function watchAll(url: string, token: string, loopIds: string[], seen: (key: string) => void) {
  const socket: Socket<ServerToClientEvents, ClientToServerEvents> = io(url, {
    transports: ['websocket'],
    auth: { token },
    reconnection: false,
    forceNew: true,
  });
  await new Promise<void>((resolve, reject) => {
    socket.once('connect', resolve);
    socket.once('connect_error', reject);
  });
  for (const loopId of loopIds) await socket.emitWithAck('loop:watch', { loopId });
  socket.on('twin:sample', (sample) => seen(`${sample.loopId}:${sample.k}`));
  return socket;
}

/**
 * Every loop posts one reading per sample period (1 s unless told), the posts spread evenly over
 * the period, with a bridge's ingest token; one client watches every loop. Latency: from just
 * before the POST to the arrival of that reading's twin:sample at the client, counted after a
 * warm-up of WARM_UP_S seconds (at least one period).
 */
export async function sampleLatency(
  url: string,
  tokens: { bridge: string; watcher: string },
  loopIds: string[],
  seconds: number,
  samplePeriodS = 1,
) {
  const sentAt = new Map<string, { at: number; counted: boolean }>();
  const latencies: number[] = [];
  const socket = await watchAll(url, tokens.watcher, loopIds, (key) => {
    const sent = sentAt.get(key);
    if (sent?.counted) latencies.push(performance.now() - sent.at);
    sentAt.delete(key);
  });
  const poster = createPoster(url, tokens.bridge, 64);
  const periodMs = samplePeriodS * 1000;
  const startK = Math.ceil(Date.now() / periodMs) + 1;
  const pending: Promise<unknown>[] = [];
  let failures = 0;
  // the first slot's time, on the performance clock: readings are never posted before their slot
  const begin = performance.now() + (startK * periodMs - Date.now());
  const warmUp = Math.max(1, Math.ceil(WARM_UP_S / samplePeriodS));
  const periods = warmUp + Math.ceil(seconds / samplePeriodS);
  for (let p = 0; p < periods; p++) {
    for (let i = 0; i < loopIds.length; i++) {
      const wait = begin + p * periodMs + (i * periodMs) / loopIds.length - performance.now();
      if (wait > 1) await new Promise((resolve) => setTimeout(resolve, wait));
      sentAt.set(`${loopIds[i]}:${startK + p}`, { at: performance.now(), counted: p >= warmUp });
      pending.push(
        poster.post(`/api/v1/loops/${loopIds[i]}/readings`, readingsBody(startK + p, 1, samplePeriodS)).then((r) => {
          if (r.status !== 200) failures += 1;
        }),
      );
    }
  }
  await Promise.all(pending);
  await new Promise((resolve) => setTimeout(resolve, 1000));
  socket.disconnect();
  poster.close();
  const sorted = [...latencies].sort((a, b) => a - b);
  return {
    sent: (periods - warmUp) * loopIds.length,
    received: latencies.length,
    failures,
    p50: percentile(sorted, 50),
    p99: percentile(sorted, 99),
  };
}
