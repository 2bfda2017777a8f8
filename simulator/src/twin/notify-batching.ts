import type pg from 'pg';

/** The statement @socket.io/postgres-adapter 0.5.0 sends for every broadcast (lib/util.ts, publish). */
const ADAPTER_NOTIFY = 'SELECT pg_notify($1, $2)';

interface Pending {
  channel: string;
  payload: string;
  settle: { resolve: (value: unknown) => void; reject: (error: unknown) => void };
}

/**
 * Makes a pool send the adapter's notifications in batches: every `pg_notify` the adapter asks for
 * in one turn of the event loop goes out in one statement per channel, instead of one round trip
 * each. A tick emits thousands of samples at once, and per-query overhead was most of the
 * simulator's CPU. Notifications of one statement are delivered together at its commit, in order;
 * every other query passes through untouched. Meant for a pool dedicated to the adapter.
 */
export function batchNotifies(pool: pg.Pool): pg.Pool {
  const query = pool.query.bind(pool) as (text: string, values?: unknown[]) => Promise<unknown>;
  let queue: Pending[] = [];

  function flush(): void {
    const byChannel = new Map<string, Pending[]>();
    for (const item of queue) {
      const list = byChannel.get(item.channel);
      if (list) list.push(item);
      else byChannel.set(item.channel, [item]);
    }
    queue = [];
    for (const [channel, items] of byChannel) {
      query('SELECT pg_notify($1, p) FROM json_array_elements_text($2::json) AS p', [
        channel,
        JSON.stringify(items.map((i) => i.payload)),
      ]).then(
        (result) => items.forEach((i) => i.settle.resolve(result)),
        (error: unknown) => items.forEach((i) => i.settle.reject(error)),
      );
    }
  }

  const batching = (text: unknown, values?: unknown[]) => {
    if (text !== ADAPTER_NOTIFY || !values) return query(text as string, values);
    return new Promise((resolve, reject) => {
      if (!queue.length) setImmediate(flush);
      queue.push({ channel: String(values[0]), payload: String(values[1]), settle: { resolve, reject } });
    });
  };
  // one method replaced on this instance; the pool is otherwise the caller's own
  (pool as unknown as { query: typeof batching }).query = batching;
  return pool;
}
