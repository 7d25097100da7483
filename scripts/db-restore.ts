// npm run db:restore -- FILE [--into DBNAME] [--replace]
// Restores a db:backup file with pg_restore, into DBNAME on the server of DATABASE_URL (default:
// the database of DATABASE_URL itself). A missing database is created. A database that already
// holds tables is only overwritten with --replace (its objects are dropped first), so that a
// mistyped command cannot wipe the live records.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import { connArgs, pgTargetFrom, pgToolsDir } from './db-backup';

const args = process.argv.slice(2);
const opt = (name: string) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? args[i + 1] : undefined;
};
const file = args.find((a, i) => !a.startsWith('--') && args[i - 1] !== '--into');
const fail = (msg: string): never => {
  console.error(`[db:restore] ${msg}`);
  process.exit(1);
};

const url = process.env.DATABASE_URL ?? fail('DATABASE_URL is not set (see .env.example)');
if (!file) fail('usage: npm run db:restore -- FILE [--into DBNAME] [--replace]');
const source = path.resolve(file!);
if (!fs.existsSync(source)) fail(`no such backup file: ${source}`);
const target = pgTargetFrom(url, opt('into'));
const replace = args.includes('--replace');

async function main() {
  const admin = new URL(url);
  admin.pathname = '/postgres';
  const client = new pg.Client({ connectionString: admin.toString() });
  await client.connect();
  const exists = (await client.query('select 1 from pg_database where datname = $1', [target.database])).rowCount;
  if (!exists) {
    await client.query(`create database ${target.database}`);
    console.log(`[db:restore] created database ${target.database}`);
  }
  await client.end();

  const probeUrl = new URL(url);
  probeUrl.pathname = `/${target.database}`;
  const probe = new pg.Client({ connectionString: probeUrl.toString() });
  await probe.connect();
  const tables = Number(
    (
      await probe.query<{ n: number }>(
        `select count(*)::int as n from information_schema.tables where table_schema = 'public'`,
      )
    ).rows[0]?.n,
  );
  await probe.end();
  if (tables > 0 && !replace)
    fail(
      `${target.database} already holds ${tables} tables; add --replace to drop them and restore the backup over them`,
    );

  const t0 = Date.now();
  const r = spawnSync(
    path.join(pgToolsDir(), 'pg_restore'),
    [
      ...connArgs(target),
      '-d',
      target.database,
      '--no-owner',
      '--no-privileges',
      '--exit-on-error',
      '--single-transaction',
      ...(tables > 0 ? ['--clean', '--if-exists'] : []),
      source,
    ],
    { env: target.env, stdio: ['ignore', 'inherit', 'inherit'] },
  );
  if (r.status !== 0)
    fail(
      `pg_restore failed (exit ${r.status ?? r.error?.message}); ${target.database} is left as it was (single transaction)`,
    );
  console.log(`[db:restore] ${source} → ${target.database} in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
}

main().catch((err) => fail(String(err)));
