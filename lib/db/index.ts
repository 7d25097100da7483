import 'server-only';
import { createDb, type DB } from '@/db/connect';
import { getEnv } from '@/lib/env';

export type { DB };

const globalForDb = globalThis as unknown as { rigcallDb?: DB };

/** The one database client of the app, kept across hot reloads outside production. */
export function getDb(): DB {
  if (!globalForDb.rigcallDb) globalForDb.rigcallDb = createDb(getEnv().DATABASE_URL, 20);
  return globalForDb.rigcallDb;
}
