// Runs the Kysely migrations in migrations/ (append-only; never edit a merged one).
//   tsx db/migrate.ts            up to the latest
//   tsx db/migrate.ts --reset    down to empty, then up (development only)
import { promises as fs } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { FileMigrationProvider, Migrator, NO_MIGRATIONS, type Kysely } from 'kysely';
import { createDb, databaseUrlFromEnv } from './connect';

const migrationFolder = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', 'migrations');

function migratorFor(db: Kysely<any>) {
  return new Migrator({ db, provider: new FileMigrationProvider({ fs, path, migrationFolder }) });
}

/** Migrate to the latest version; throws with the failing migration's name. */
export async function migrateToLatest(db: Kysely<any>, log: (msg: string) => void = () => {}): Promise<void> {
  const { error, results } = await migratorFor(db).migrateToLatest();
  for (const r of results ?? []) log(`migration ${r.migrationName}: ${r.status}`);
  if (error) throw error instanceof Error ? error : new Error(String(error));
}

export async function migrateToEmpty(db: Kysely<any>): Promise<void> {
  const { error } = await migratorFor(db).migrateTo(NO_MIGRATIONS);
  if (error) throw error instanceof Error ? error : new Error(String(error));
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
