import { sql, type Kysely } from 'kysely';

// Sessions that can end and passwords that are replaced:
// - app_user.session_version: every session carries the version it was issued under; bumping it
//   (sign-out, password change, deactivation, role change) ends every session of the account.
// - app_user.temporary_password_expires_at: an invitation's temporary password stops working.
// - password_reset: "forgot password" links, stored as the SHA-256 of the token, single use.

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('app_user')
    .addColumn('session_version', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('temporary_password_expires_at', 'timestamptz')
    .addColumn('password_changed_at', 'timestamptz')
    .execute();
  await db.schema
    .createTable('password_reset')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('fleet_id', 'uuid', (c) => c.notNull().references('fleet.id'))
    .addColumn('user_id', 'uuid', (c) => c.notNull().references('app_user.id').onDelete('cascade'))
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addColumn('used_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('password_reset_user_idx').on('password_reset').columns(['user_id', 'created_at']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('password_reset').execute();
  await db.schema
    .alterTable('app_user')
    .dropColumn('session_version')
    .dropColumn('temporary_password_expires_at')
    .dropColumn('password_changed_at')
    .execute();
}
