import { Sequelize } from 'sequelize';
import pg from 'pg';
import { env } from '@/lib/env';

// DATE columns come back as JavaScript Dates; keep DATEONLY ('YYYY-MM-DD') as the string it is.
pg.types.setTypeParser(1082, (v: string) => v);

const globalForDb = globalThis as unknown as { __brixhouseSequelize?: Map<string, Sequelize> };

/** Connection errors worth one more try; a write retried this way must be idempotent. */
const RETRYABLE = [/ECONNRESET/, /ECONNREFUSED/, /57P01/, /57P03/, /terminating connection/, /Connection terminated/];

function create(url: string): Sequelize {
  return new Sequelize(url, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: false,
    pool: { max: 20, min: 0, idle: 10_000, acquire: 30_000 },
    retry: { max: 3, match: RETRYABLE },
    define: { underscored: true, timestamps: true },
  });
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
