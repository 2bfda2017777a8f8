import pg from 'pg';

export interface ListenerOptions {
  databaseUrl: string;
  channel: string;
  onNotice: (payload: string | undefined) => void;
  /** Called after every (re)connection once LISTEN is in place; `first` only for the first one. */
  onListening: (first: boolean) => Promise<void>;
  log: (line: string) => void;
  /** First reconnection delay; doubles up to 30 s while the database stays away. */
  reconnectDelayMs?: number;
}

const MAX_DELAY_MS = 30_000;
export const LISTENER_APPLICATION_NAME = 'shadowloop-simulator-registry';

/**
 * A dedicated connection that LISTENs on one channel (a pooled connection would lose the LISTEN
 * when returned). On error or disconnection it reconnects with backoff and calls onListening
 * again, so that the caller can reload whatever it may have missed meanwhile.
 */
export function listenForNotices(options: ListenerOptions) {
  const baseDelay = options.reconnectDelayMs ?? 1000;
  let active: pg.Client | undefined;
  let stopped = false;
  let attempt = 0;
  let timer: NodeJS.Timeout | undefined;

  async function connect(first: boolean): Promise<void> {
    const client = new pg.Client({
      connectionString: options.databaseUrl,
      application_name: LISTENER_APPLICATION_NAME,
    });
    client.on('notification', (message) => {
      if (message.channel === options.channel) options.onNotice(message.payload);
    });
    client.on('error', (error) => lost(client, error.message));
    client.on('end', () => lost(client, 'connection closed'));
    try {
      await client.connect();
      await client.query(`LISTEN ${options.channel}`);
    } catch (error) {
      client.removeAllListeners();
      void client.end().catch(() => undefined);
      throw error;
    }
    if (stopped) return void (await client.end());
    active = client;
    attempt = 0;
    await options.onListening(first).catch((error: Error) => {
      if (first) throw error;
      lost(client, `reloading after reconnection failed: ${error.message}`);
    });
  }

  function lost(client: pg.Client, why: string): void {
    if (client !== active) return;
    active = undefined;
    client.removeAllListeners();
    void client.end().catch(() => undefined);
    if (stopped) return;
    options.log(`lost the ${options.channel} listener (${why}); reconnecting`);
    retry();
  }

  function retry(): void {
    const delay = Math.min(baseDelay * 2 ** attempt, MAX_DELAY_MS);
    attempt += 1;
    timer = setTimeout(() => {
      connect(false).catch((error: Error) => {
        if (stopped) return;
        options.log(
          `reconnecting the ${options.channel} listener failed (${error.message}); next try in ${Math.min(baseDelay * 2 ** attempt, MAX_DELAY_MS)} ms`,
        );
        retry();
      });
    }, delay);
  }

  return {
    /** Resolves once listening; rejects when the first connection fails (fail fast at start-up). */
    start: () => connect(true),
    isListening: () => active !== undefined,
    async stop(): Promise<void> {
      stopped = true;
      clearTimeout(timer);
      const client = active;
      active = undefined;
      client?.removeAllListeners();
      await client?.end().catch(() => undefined);
    },
  };
}
