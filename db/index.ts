import { Sequelize } from 'sequelize';
import pg from 'pg';
import { env } from '@/lib/env';

// DATE columns come back as JavaScript Dates; keep DATEONLY ('YYYY-MM-DD') as the string it is.
pg.types.setTypeParser(1082, (v: string) => v);

const globalForDb = globalThis as unknown as { __brixhouseSequelize?: Map<string, Sequelize> };

/** Connection errors worth one more try; a write retried this way must be idempotent. */
const RETRYABLE = [/ECONNRESET/, /ECONNREFUSED/, /57P01/, /57P03/, /terminating connection/, /Connection terminated/];

/** Refusals while the database restarts: nothing was sent, so waiting and asking again is safe. */
const NOT_UP_YET = /ECONNREFUSED|57P03|the database system is (starting up|shutting down)|Connection terminated/;
const CONNECT_WAIT_MS = 6_000;

/**
 * While the database restarts, a request waits (up to six seconds) for a connection instead of
 * failing at once: getting a connection sends no statement, so this is safe for every write.
 */
function waitForConnections(sequelize: Sequelize) {
  const manager = sequelize.connectionManager as unknown as { getConnection: (o?: object) => Promise<unknown> };
  const getConnection = manager.getConnection.bind(manager);
  manager.getConnection = async (options?: object) => {
    const until = Date.now() + CONNECT_WAIT_MS;
    for (let delay = 50; ; delay = Math.min(delay * 2, 150)) {
      try {
        return await getConnection(options);
      } catch (err) {
        const text = `${(err as Error)?.message} ${(err as { parent?: { code?: string } })?.parent?.code ?? ''}`;
        if (!NOT_UP_YET.test(text) || Date.now() + delay > until) throw err;
        await new Promise((r) => setTimeout(r, delay));
      }
    }
  };
  return sequelize;
}

function create(url: string, pool = { max: 20, min: 8 }): Sequelize {
  return waitForConnections(new Sequelize(url, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: false,
    // A warm pool: `min` connections stay open through idle spells, so the first request after
    // a quiet minute does not wait for a new connection, and a burst after a pause does not open
    // a dozen at once (each costs a SCRAM handshake); TCP keep-alive keeps them alive.
    pool: { ...pool, idle: 120_000, acquire: 30_000 },
    // Every session starts read committed, so a transaction at that level needs no
    // SET TRANSACTION of its own (one round trip fewer per write; lib/server/tx.ts).
    dialectOptions: { keepAlive: true, options: '-c default_transaction_isolation=read\\ committed' },
    retry: { max: 3, match: RETRYABLE },
    define: { underscored: true, timestamps: true },
  }));
}

/**
 * The one Sequelize instance per database URL, kept on globalThis so that the custom server,
 * the route handlers (bundled separately by Next) and the scripts share one pool.
 */
export function getSequelize(url: string = env().DATABASE_URL): Sequelize {
  globalForDb.__brixhouseSequelize ??= new Map();
  let s = globalForDb.__brixhouseSequelize.get(url);
  if (!s) {
    s = create(url);
    globalForDb.__brixhouseSequelize.set(url, s);
  }
  return s;
}

const globalForLive = globalThis as unknown as { __brixhouseLiveSequelize?: Sequelize };

/**
 * Two connections of their own for the live queue's snapshots (server.ts), so a snapshot after a
 * change does not queue for a connection behind every request a busy process is serving.
 */
export function getLiveSequelize(): Sequelize {
  return (globalForLive.__brixhouseLiveSequelize ??= create(env().DATABASE_URL, { max: 2, min: 1 }));
}
