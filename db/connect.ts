import { CamelCasePlugin, Kysely, PostgresDialect } from 'kysely';
import pg from 'pg';
import type { DB as Database } from './schema';

// int8 (counts, sums) and numeric come back from pg as strings; the app wants numbers.
pg.types.setTypeParser(pg.types.builtins.INT8, (v) => Number(v));
pg.types.setTypeParser(pg.types.builtins.NUMERIC, (v) => Number(v));

export type DB = Kysely<Database>;

/**
 * Build a Kysely instance over a pg pool. The app has exactly one (lib/db); the command-line
 * tools (migrate, seed, benchmarks) and the tests make their own, one per process.
 */
export function createDb(connectionString: string, max = 10, opts: { waitForDisk?: boolean } = {}): DB {
  // waitForDisk: false gives connections whose commits do not wait for the WAL to reach the disk
  // (synchronous_commit off): only for writes that the client keeps and checks again later.
  const pool = new pg.Pool({
    connectionString,
    max,
    ...(opts.waitForDisk === false ? { options: '-c synchronous_commit=off' } : {}),
  });
  // An idle connection dropped by the server (a restart) must not crash the process; the next
  // query opens a new one.
  pool.on('error', (err) => console.error('[rigcall] database connection lost:', err.message));
  return new Kysely<Database>({
    dialect: new PostgresDialect({ pool }),
    // Nested keys too: relations built with jsonArrayFrom come back camel-cased like top-level
    // columns. A jsonb document whose keys must stay as written (a grammar) is read as text.
    plugins: [new CamelCasePlugin({ maintainNestedObjectKeys: false })],
  });
}

/** The database URL of a command-line tool, with a clear message when it is missing. */
export function databaseUrlFromEnv(): string {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set. Run through `npm start` / `npm test`, or see .env.example.');
  return url;
}
