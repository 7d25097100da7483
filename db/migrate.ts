// Runs the Kysely migrations in migrations/ (append-only; never edit a merged one).
//   tsx db/migrate.ts            up to the latest
//   tsx db/migrate.ts --reset    down to empty, then up (development only)
import { promises as fs } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { inspect } from 'node:util';
import { FileMigrationProvider, Migrator, NO_MIGRATIONS, type MigrationResultSet } from 'kysely';
import { createDb, databaseUrlFromEnv, type DB } from './connect';

const migrationFolder = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', 'migrations');

function migratorFor(db: DB) {
  return new Migrator({ db, provider: new FileMigrationProvider({ fs, path, migrationFolder }) });
}

/** Kysely reports a failed migration as an `unknown` error; throw it as an Error. */
function throwIfFailed({ error }: MigrationResultSet): void {
  if (!error) return;
  throw error instanceof Error ? error : new Error(`migration failed: ${inspect(error)}`, { cause: error });
}

/** Migrate to the latest version; throws with the failing migration's name. */
export async function migrateToLatest(db: DB, log: (msg: string) => void = () => {}): Promise<void> {
  const result = await migratorFor(db).migrateToLatest();
  for (const r of result.results ?? []) log(`migration ${r.migrationName}: ${r.status}`);
  throwIfFailed(result);
}

export async function migrateToEmpty(db: DB): Promise<void> {
  throwIfFailed(await migratorFor(db).migrateTo(NO_MIGRATIONS));
}

const isMain = process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url);
if (isMain) {
  const db = createDb(databaseUrlFromEnv(), 2);
  try {
    if (process.argv.includes('--reset')) await migrateToEmpty(db);
    await migrateToLatest(db, (m) => console.log(`[rigcall] ${m}`));
  } catch (err) {
    console.error('[rigcall] migration failed:', err);
    process.exitCode = 1;
  } finally {
    await db.destroy();
  }
}
