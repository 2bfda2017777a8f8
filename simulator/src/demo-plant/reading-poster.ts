/** A reading as the ingest API takes it (API.md: POST /api/v1/loops/{loopId}/readings). */
export interface ApiReading {
  t: string;
  u: number[];
  y: number[];
}

export interface PosterOptions {
  apiUrl: string;
  token: string;
  log: (line: string) => void;
  fetch?: typeof fetch;
  now?: () => number;
  /** Readings kept per loop while the api is away; the oldest go first beyond this. */
  maxQueued?: number;
  maxBackoffMs?: number;
}

const BATCH = 500;
/** Statuses that say "try again later": the api is starting, busy or not yet serving the route. */
const RETRY = new Set([404, 408, 425, 429, 500, 502, 503, 504]);

/**
 * Posts the demo plant's readings through the real ingest API with the demo ingest token. While
 * the api is not up yet (or away), readings queue per loop and go out later in batches, with a
 * back-off that doubles up to `maxBackoffMs`.
 */
export function createReadingPoster(options: PosterOptions) {
  const send = options.fetch ?? fetch;
  const now = options.now ?? Date.now;
  const maxQueued = options.maxQueued ?? 2000;
  const maxBackoffMs = options.maxBackoffMs ?? 30_000;
  const queues = new Map<string, ApiReading[]>();
  const reported = new Set<string>();
  let failures = 0;
  let retryAt = 0;
  let flushing: Promise<void> | undefined;

  function failed(why: string): void {
    failures += 1;
    retryAt = now() + Math.min(maxBackoffMs, 1000 * 2 ** (failures - 1));
    if (failures === 1 || failures % 10 === 0)
      options.log(`posting readings failed (${why}, ${failures}×); keeping them and trying again with back-off`);
  }

  /** One batch of one loop; false when the api should be left alone for a while. */
  async function post(loopId: string, queue: ApiReading[]): Promise<boolean> {
    const batch = queue.slice(0, BATCH);
    let response: Response;
    try {
      response = await send(`${options.apiUrl}/api/v1/loops/${loopId}/readings`, {
        method: 'POST',
        headers: { authorization: `Bearer ${options.token}`, 'content-type': 'application/json' },
        body: JSON.stringify({ readings: batch }),
        signal: AbortSignal.timeout(10_000),
      });
    } catch (error) {
      failed((error as Error).message);
      return false;
    }
    const body = (await response.json().catch(() => ({}))) as {
      rejected?: { reason: string }[];
      error?: { message?: string };
    };
    if (RETRY.has(response.status) || response.status === 401 || response.status === 403) {
      failed(`${response.status} ${body.error?.message ?? ''}`.trim());
      return false;
    }
    queue.splice(0, batch.length); // posted, or refused for good: never send a bad batch twice
    const reasons = response.ok
      ? (body.rejected ?? []).map((r) => r.reason)
      : [`${response.status} ${body.error?.message ?? ''}`];
    for (const reason of reasons) {
      if (reported.has(`${loopId}:${reason}`)) continue;
      reported.add(`${loopId}:${reason}`);
      options.log(`the api refused readings of loop ${loopId}: ${reason}`);
    }
    if (failures) options.log(`posting readings again after ${failures} failed attempts`);
    failures = 0;
    return true;
  }

  async function flushAll(): Promise<void> {
    for (const [loopId, queue] of queues) {
      while (queue.length && now() >= retryAt) if (!(await post(loopId, queue))) return;
    }
  }

  return {
    enqueue(loopId: string, reading: ApiReading): void {
      const queue = queues.get(loopId) ?? [];
      queues.set(loopId, queue);
      queue.push(reading);
      if (queue.length > maxQueued) queue.splice(0, queue.length - maxQueued);
    },
    /** Sends what is queued unless a back-off is running; one flush at a time. */
    flush(): Promise<void> {
      flushing ??= flushAll().finally(() => {
        flushing = undefined;
      });
      return flushing;
    },
    queued: () => [...queues.values()].reduce((sum, q) => sum + q.length, 0),
    retryInMs: () => Math.max(0, retryAt - now()),
  };
}

export type ReadingPoster = ReturnType<typeof createReadingPoster>;
