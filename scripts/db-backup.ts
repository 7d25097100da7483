// npm run db:backup [-- --out FILE]
// A full backup of the database in DATABASE_URL with pg_dump (custom format: compressed, and
// pg_restore can restore all of it or single tables). Default file: .data/backups/<db>-<time>.dump
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export function pgToolsDir(): string {
  const base = '/usr/lib/postgresql';
  const versions = fs.existsSync(base)
    ? fs
        .readdirSync(base)
        .filter((v) => fs.existsSync(path.join(base, v, 'bin', 'pg_dump')))
        .sort((a, b) => Number(b) - Number(a))
    : [];
  if (!versions[0])
    throw new Error('pg_dump was not found under /usr/lib/postgresql/*/bin (install the postgresql-client package)');
  return path.join(base, versions[0], 'bin');
}

export type PgTarget = { host: string; port: string; user: string; database: string; env: NodeJS.ProcessEnv };

export function pgTargetFrom(databaseUrl: string, database?: string): PgTarget {
  const u = new URL(databaseUrl);
  const db = database ?? decodeURIComponent(u.pathname.replace(/^\//, ''));
  if (!/^[A-Za-z0-9_]+$/.test(db))
    throw new Error(`"${db}" is not a database name this tool accepts (letters, digits, _)`);
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    PGPASSWORD: decodeURIComponent(u.password),
    PGCONNECT_TIMEOUT: '10',
  };
  const sslmode = u.searchParams.get('sslmode');
  if (sslmode) env.PGSSLMODE = sslmode;
  return { host: u.hostname, port: u.port || '5432', user: decodeURIComponent(u.username), database: db, env };
}

export const connArgs = (t: PgTarget) => ['-h', t.host, '-p', t.port, '-U', t.user];

/** Back up the database of `url` into `out`; returns the process exit code. */
export function backupDatabase(url: string | undefined, outArg?: string): number {
  if (!url) {
    console.error(
      '[db:backup] DATABASE_URL is not set (run through `node scripts/stack.mjs exec -- npm run db:backup`, or see .env.example)',
    );
    return 1;
  }
  const target = pgTargetFrom(url);
  const stamp = new Date().toISOString().replace(/[:.]/g, '-');
  const out = path.resolve(outArg ?? path.join('.data', 'backups', `${target.database}-${stamp}.dump`));
  fs.mkdirSync(path.dirname(out), { recursive: true });

  const t0 = Date.now();
  const partial = `${out}.partial`;
  const r = spawnSync(
    path.join(pgToolsDir(), 'pg_dump'),
    [
      ...connArgs(target),
      '-d',
      target.database,
      '--format=custom',
      '--compress=6',
      '--no-owner',
      '--no-privileges',
      '-f',
      partial,
    ],
    { env: target.env, stdio: ['ignore', 'inherit', 'inherit'] },
  );
  if (r.status !== 0) {
    fs.rmSync(partial, { force: true });
    console.error(`[db:backup] pg_dump failed (exit ${r.status ?? r.error?.message})`);
    return 1;
  }
  // Renamed only when complete, so a file with the final name is always a whole backup.
  fs.renameSync(partial, out);
  const size = fs.statSync(out).size;
  console.log(
    `[db:backup] ${target.database} → ${out} (${(size / 1024).toFixed(0)} KB in ${((Date.now() - t0) / 1000).toFixed(1)} s)`,
  );
  console.log(JSON.stringify({ file: out, database: target.database, bytes: size }));
  return 0;
}

const isMain = process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url);
if (isMain) {
  const args = process.argv.slice(2);
  const i = args.indexOf('--out');
  process.exit(backupDatabase(process.env.DATABASE_URL, i >= 0 ? args[i + 1] : undefined));
}
