import type { Kysely } from 'kysely';

// The thumbnail's SHA-256 beside the photo's, so that every read of either can be checked
// against what was stored (a swapped object shows as tampered evidence).

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('attachment').addColumn('thumb_sha256', 'text').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('attachment').dropColumn('thumb_sha256').execute();
}
