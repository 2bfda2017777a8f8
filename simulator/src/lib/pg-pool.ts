import pg from 'pg';

/** How long a holder has to release a connection that ended. */
const RELEASE_ENDED_AFTER_MS = 3000;

/**
 * A node-postgres pool that survives the server closing its connections (a database restart, an
 * administrator's terminate, a dropped test database). node-postgres emits such an error on the
 * pool for an idle client and on the client itself for one that is checked out (a LISTEN
 * connection held by a library, such as the socket.io adapter's); an `error` event nobody listens
 * to ends the whole process. Here every client gets a listener when it connects, so the error is
 * reported instead; the pool discards the broken client and its holder sees the connection end.
 */
export function createPgPool(
  connectionString: string,
  max: number,
  onConnectionError: (error: Error) => void = () => undefined,
): pg.Pool {
  const pool = new pg.Pool({ connectionString, max });
  pool.on('error', onConnectionError);
  pool.on('connect', (client) => {
    client.on('error', onConnectionError);
    // A holder may drop a connection the server closed without releasing it (the socket.io
    // adapter does, then takes a new one); the pool would count it as checked out for ever and
    // pool.end() would never finish. A few seconds after the end, release it on the holder's
    // behalf; one that its holder released already refuses a second release, which is ignored.
    client.once('end', () => {
      setTimeout(() => {
        try {
          client.release(new Error('the database server closed this connection'));
        } catch {
          // released by its holder
        }
      }, RELEASE_ENDED_AFTER_MS).unref();
    });
  });
  return pool;
}
