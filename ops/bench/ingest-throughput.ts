import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type pg from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import { createPoster, readingsBody } from './http-post.js';

const BATCH = 1000;

/**
 * Posts batches of 1,000 readings for `seconds`, one stream per loop (each stream waits for its
 * previous batch, as a bridge would), and returns readings stored per second and in total.
 */
export async function httpIngestRate(url: string, token: string, loopIds: string[], fromK: number, seconds: number) {
  const poster = createPoster(url, token, loopIds.length);
  const deadline = performance.now() + seconds * 1000;
  let stored = 0;
  const start = performance.now();
  await Promise.all(
    loopIds.map(async (loopId) => {
      for (let k = fromK; performance.now() < deadline; k += BATCH) {
        const response = await poster.post(`/api/v1/loops/${loopId}/readings`, readingsBody(k, BATCH));
        if (response.status !== 200)
          throw new Error(`ingest answered ${response.status}: ${response.text.slice(0, 200)}`);
        stored += (JSON.parse(response.text) as { accepted: number }).accepted;
      }
    }),
  );
  const elapsed = (performance.now() - start) / 1000;
  poster.close();
  return { perSecond: stored / elapsed, stored, elapsed };
}

/** COPY text rows for loop slots fromK…fromK+count, like the HTTP batches. */
function* copyRows(loopId: string, fromK: number, count: number): Generator<string> {
  for (let start = 0; start < count; start += BATCH) {
    let chunk = '';
    for (let i = start; i < Math.min(count, start + BATCH); i++) {
      const k = fromK + i;
      const at = new Date(k * 1000).toISOString();
      chunk += `${loopId}\t${at}\t${k}\t${at}\t{${(k % 100) / 10}}\t{${0.5 + (k % 7) / 100}}\n`;
    }
    yield chunk;
  }
}

/** The reference: the same number of rows straight into readings with COPY, one stream per loop. */
export async function copyRate(pool: pg.Pool, loopIds: string[], fromK: number, perLoop: number) {
  const start = performance.now();
  await Promise.all(
    loopIds.map(async (loopId) => {
      const client = await pool.connect();
      try {
        await pipeline(
          Readable.from(copyRows(loopId, fromK, perLoop)),
          client.query(copyFrom('COPY readings (loop_id, slot_at, k, t, u, y) FROM STDIN')),
        );
      } finally {
        client.release();
      }
    }),
  );
  const elapsed = (performance.now() - start) / 1000;
  return { perSecond: (perLoop * loopIds.length) / elapsed, elapsed };
}
