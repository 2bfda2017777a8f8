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
 * Every loop posts one reading per second, the posts spread evenly over the second, with a bridge's
 * ingest token; one client watches every loop. Latency: from just before the POST to the arrival of
 * that reading's twin:sample at the client, counted after a warm-up of WARM_UP_S seconds.
 */
export async function sampleLatency(
  url: string,
  tokens: { bridge: string; watcher: string },
  loopIds: string[],
  seconds: number,
) {
  const sentAt = new Map<string, { at: number; counted: boolean }>();
  const latencies: number[] = [];
  const socket = await watchAll(url, tokens.watcher, loopIds, (key) => {
    const sent = sentAt.get(key);
    if (sent?.counted) latencies.push(performance.now() - sent.at);
    sentAt.delete(key);
  });
  const poster = createPoster(url, tokens.bridge, 64);
  const startK = Math.floor(Date.now() / 1000) + 2;
  const pending: Promise<unknown>[] = [];
  let failures = 0;
  const begin = performance.now();
  for (let second = 0; second < WARM_UP_S + seconds; second++) {
    for (let i = 0; i < loopIds.length; i++) {
      const wait = begin + second * 1000 + (i * 1000) / loopIds.length - performance.now();
      if (wait > 1) await new Promise((resolve) => setTimeout(resolve, wait));
      sentAt.set(`${loopIds[i]}:${startK + second}`, { at: performance.now(), counted: second >= WARM_UP_S });
      pending.push(
        poster.post(`/api/v1/loops/${loopIds[i]}/readings`, readingsBody(startK + second, 1)).then((r) => {
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
    sent: seconds * loopIds.length,
    received: latencies.length,
    failures,
    p50: percentile(sorted, 50),
    p99: percentile(sorted, 99),
  };
}
