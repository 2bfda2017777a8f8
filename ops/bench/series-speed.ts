import type { Db } from '../../api/src/db/knex.js';
import { rawSeries } from '../../api/src/modules/series/series.repository.js';

const WEEK_S = 7 * 86_400;

/** A week of 1 s readings and predictions (604,800 rows each) for one loop, ending at the last whole second. */
export async function fillWeek(db: Db, loopId: string): Promise<{ fromMs: number; toMs: number }> {
  const toK = Math.floor(Date.now() / 1000) - 1;
  const fromK = toK - WEEK_S + 1;
  const days = [fromK, toK].map((k) => new Date(k * 1000).toISOString().slice(0, 10));
  await db.raw('SELECT shadowloop_ensure_day_partitions(?::date, ?::date)', days);
  await db.raw(
    `INSERT INTO readings (loop_id, slot_at, k, t, u, y)
    SELECT ?, to_timestamp(k), k, to_timestamp(k), ARRAY[50 + 10 * sin(k / 600.0)]::float8[], ARRAY[2 + sin(k / 300.0) + 0.01 * (k % 13)]::float8[]
    FROM generate_series(?::bigint, ?::bigint) AS k`,
    [loopId, fromK, toK],
  );
  await db.raw(
    `INSERT INTO predictions (loop_id, slot_at, k, version_id, x, y, residual)
    SELECT l.id, to_timestamp(k), k, v.id, ARRAY[0, 0]::float8[], ARRAY[2 + sin(k / 300.0)]::float8[], ARRAY[0.01 * (k % 13)]::float8[]
    FROM loops l JOIN model_versions v ON v.loop_id = l.id AND v.status = 'active', generate_series(?::bigint, ?::bigint) AS k
    WHERE l.id = ?`,
    [fromK, toK, loopId],
  );
  // A site's autovacuum would have passed over a week-old partition long ago.
  await db.raw('VACUUM (ANALYZE) readings');
  await db.raw('VACUUM (ANALYZE) predictions');
  await db.raw('CHECKPOINT');
  return { fromMs: fromK * 1000, toMs: toK * 1000 };
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];

async function timed(body: () => Promise<unknown>, runs: number): Promise<{ first: number; median: number }> {
  const start = performance.now();
  await body();
  const first = performance.now() - start;
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const start = performance.now();
    await body();
    times.push(performance.now() - start);
  }
  return { first, median: median(times) };
}

/**
 * GET …/series over the week downsampled to 2,000 points through HTTP: the first request (which
 * keeps the settled minutes' extremes) and the median of the next five; beside it the raw fetch of
 * every row of the week.
 */
export async function seriesSpeed(
  url: string,
  token: string,
  db: Db,
  loopId: string,
  week: { fromMs: number; toMs: number },
) {
  const query = `from=${new Date(week.fromMs).toISOString()}&to=${new Date(week.toMs).toISOString()}&maxPoints=2000`;
  let points = 0;
  const downsampled = await timed(async () => {
    const response = await fetch(`${url}/api/v1/loops/${loopId}/series?${query}`, {
      headers: { authorization: `Bearer ${token}` },
    });
    const body = (await response.json()) as { t: string[] };
    points = body.t.length;
  }, 5);
  let rows = 0;
  const window = { loopId, from: new Date(week.fromMs), to: new Date(week.toMs), inputs: 1, outputs: 1 };
  const raw = await timed(async () => {
    rows = (await rawSeries(db, window)).length;
  }, 2);
  return { downsampledMs: downsampled.median, firstMs: downsampled.first, points, rawMs: raw.median, rows };
}
