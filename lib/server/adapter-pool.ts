import pg from 'pg';

type Log = (message: string) => void;

/**
 * The pg pool behind socket.io's PostgreSQL adapter, made to survive a database restart.
 *
 * The adapter (0.5.0) keeps one client out of the pool for LISTEN and waits for its `end` event
 * to take another and LISTEN again; but it sets no `error` listener on that client, so a restart
 * (the server sends 57P01 and closes) throws an unhandled `error` and the listener never comes
 * back. Here every client the pool lends gets an error listener that hands it back to the pool
 * as broken (so the pool drops it instead of counting it lent for ever); its `end` then follows
 * and the adapter reconnects — every 1–3 s until the database answers — and re-LISTENs.
 */
export function createAdapterPool(connectionString: string, log: Log = (m) => console.error(m)): pg.Pool {
  const pool = new pg.Pool({ connectionString, max: 3, keepAlive: true, connectionTimeoutMillis: 5_000 });
  // Idle clients that die are dropped by the pool itself; it reports them here.
  pool.on('error', (err) => log(`realtime adapter: idle connection lost (${err.message})`));
  const connect = pool.connect.bind(pool) as (cb?: unknown) => Promise<pg.PoolClient> | void;
  // pool.query() borrows with a callback and guards its client itself; the adapter's LISTEN
  // client is borrowed with a promise.
  pool.connect = ((callback?: unknown) => {
    if (callback) return connect(callback);
    return (connect() as Promise<pg.PoolClient>).then((client) => {
      const release = client.release.bind(client);
      let released = false;
      client.release = (err?: Error | boolean) => {
        if (released) return;
        released = true;
        release(err);
      };
      client.on('error', (err) => {
        log(`realtime adapter: listening connection lost (${err.message}); reconnecting`);
        client.release(err);
      });
      return client;
    });
  }) as typeof pool.connect;
  return pool;
}
