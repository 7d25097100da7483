import { CamelCasePlugin, Kysely, PostgresDialect } from 'kysely';
import pg from 'pg';
import type { DB as Database } from './schema';

// int8 (counts, sums) and numeric come back from pg as strings; the app wants numbers.
pg.types.setTypeParser(pg.types.builtins.INT8, (v) => Number(v));
pg.types.setTypeParser(pg.types.builtins.NUMERIC, (v) => Number(v));

export type DB = Kysely<Database>;

/** How long one connection may wait on the server before it gives up, in milliseconds. */
export type DbLimits = {
  /** One statement (statement_timeout). */
  statementMs: number;
  /** Waiting for a row or table lock (lock_timeout). */
  lockMs: number;
  /** A transaction left open with nothing running (idle_in_transaction_session_timeout). */
  idleInTransactionMs: number;
  /** Opening a connection, or waiting for a free one from the pool (pg's connectionTimeoutMillis). */
  connectMs: number;
};

/**
 * The app's request pools: a request never waits long for anything. A step that meets a lock
 * held by the signature gets a quick refusal (503) and the phone sends it again.
 */
export const appDbLimits: DbLimits = {
  statementMs: 15_000,
  lockMs: 4_000,
  idleInTransactionMs: 30_000,
  connectMs: 5_000,
};

/** Command-line tools (migrate, seed, benchmarks, backups, tests): bigger statements, still bounded. */
export const toolDbLimits: DbLimits = {
  statementMs: 15 * 60_000,
  lockMs: 60_000,
  idleInTransactionMs: 15 * 60_000,
  connectMs: 15_000,
};

/** pg.Pool options that apply the limits to every connection of the pool. */
export function poolLimits(limits: DbLimits, extraSettings: string[] = []) {
  const settings = [
    `-c statement_timeout=${limits.statementMs}`,
    `-c lock_timeout=${limits.lockMs}`,
    `-c idle_in_transaction_session_timeout=${limits.idleInTransactionMs}`,
    ...extraSettings,
  ];
  return {
    options: settings.join(' '),
    connectionTimeoutMillis: limits.connectMs,
    // A server that stops answering mid-query is given up on rather than waited for.
    query_timeout: limits.statementMs + 5_000,
  };
}

/**
 * Build a Kysely instance over a pg pool. The app has exactly one (lib/db); the command-line
 * tools (migrate, seed, benchmarks) and the tests make their own, one per process.
 */
export function createDb(
  connectionString: string,
  max = 10,
  opts: { waitForDisk?: boolean; limits?: 'app' | 'tool' | DbLimits } = {},
): DB {
  const limits =
    opts.limits === 'app' ? appDbLimits : opts.limits === 'tool' || !opts.limits ? toolDbLimits : opts.limits;
  // waitForDisk: false gives connections whose commits do not wait for the WAL to reach the disk
  // (synchronous_commit off): only for writes that the client keeps and checks again later.
  const pool = new pg.Pool({
    connectionString,
    max,
    ...poolLimits(limits, opts.waitForDisk === false ? ['-c synchronous_commit=off'] : []),
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
