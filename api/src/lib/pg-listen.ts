import type pg from 'pg';
import type { Logger } from 'pino';

/**
 * LISTENs on one channel over one connection of the pool and hands each payload to `onPayload`;
 * reconnects after a lost connection (a notice sent meanwhile is missed, which callers allow for:
 * their caches also expire by time). stop() releases the connection.
 */
export function listenOnChannel(
  pool: pg.Pool,
  channel: string,
  onPayload: (payload: string) => void,
  logger: Logger,
): { stop(): Promise<void> } {
  let client: pg.PoolClient | null = null;
  let stopped = false;
  let retry: NodeJS.Timeout | null = null;
  const again = () => {
    if (!stopped) retry = setTimeout(() => void connect(), 1000);
  };
  const connect = async () => {
    try {
      const connection = await pool.connect();
      if (stopped) return connection.release();
      client = connection;
      connection.on('notification', (message) => {
        if (message.channel === channel && message.payload) onPayload(message.payload);
      });
      connection.on('error', (error) => {
        logger.warn({ err: error, channel }, 'a LISTEN connection was lost; reconnecting');
        connection.release(error);
        client = null;
        again();
      });
      await connection.query(`LISTEN ${channel}`);
    } catch (error) {
      logger.warn({ err: error, channel }, 'cannot LISTEN; retrying');
      again();
    }
  };
  void connect();
  return {
    async stop() {
      stopped = true;
      if (retry) clearTimeout(retry);
      const held = client;
      client = null;
      if (held) {
        await held.query(`UNLISTEN ${channel}`).catch(() => undefined);
        held.release();
      }
    },
  };
}
