import os from 'node:os';
import type { Knex } from 'knex';

/**
 * Records that this simulator process is alive; the api's health check reads it.
 * Returns a stop function.
 */
export function startHeartbeat(db: Knex, options: { intervalMs: number; details?: () => Record<string, unknown> }) {
  const instance = `${os.hostname()}:${process.pid}`;
  const startedAt = new Date();
  const beat = async () => {
    await db('service_heartbeats')
      .insert({
        service: 'simulator',
        instance,
        beat_at: db.fn.now(),
        started_at: startedAt,
        details: JSON.stringify(options.details?.() ?? {}),
      })
      .onConflict(['service', 'instance'])
      .merge(['beat_at', 'details']);
  };
  let failures = 0;
  const tick = () =>
    beat().then(
      () => {
        failures = 0;
      },
      (error: Error) => {
        failures += 1;
        if (failures === 1 || failures % 10 === 0)
          console.error(`simulator heartbeat failed (${failures}×): ${error.message}`);
      },
    );
  const timer = setInterval(() => void tick(), options.intervalMs);
  return { first: tick(), instance, stop: () => clearInterval(timer) };
}
