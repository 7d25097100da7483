import 'server-only';
import { createDb, type DB } from '@/db/connect';
import { getEnv } from '@/lib/env';

export type { DB };

const globalForDb = globalThis as unknown as { rigcallDb?: DB; rigcallStepDb?: DB };

/** The one database client of the app, kept across hot reloads outside production. */
export function getDb(): DB {
  if (!globalForDb.rigcallDb) globalForDb.rigcallDb = createDb(getEnv().DATABASE_URL, 20, { limits: 'app' });
  return globalForDb.rigcallDb;
}

/**
 * The client for an open walk's steps: its commits do not wait for the disk. The phone keeps
 * every step until the report is signed, and signing (on getDb, waiting for the disk) names them
 * all and is refused while one is missing; see lib/services/inspections/record-step.ts.
 */
export function getStepDb(): DB {
  if (!globalForDb.rigcallStepDb)
    globalForDb.rigcallStepDb = createDb(getEnv().DATABASE_URL, 10, { waitForDisk: false, limits: 'app' });
  return globalForDb.rigcallStepDb;
}
