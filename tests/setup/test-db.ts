import { createDb, databaseUrlFromEnv, type DB } from '../../db/connect';

let shared: DB | undefined;

/** A Kysely client for a test file to set up and check rows directly. */
export function getTestDb(): DB {
  shared ??= createDb(databaseUrlFromEnv(), 4);
  return shared;
}
