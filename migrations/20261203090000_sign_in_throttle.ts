import { sql, type Kysely } from 'kysely';

// Failed sign-ins counted per account and per address, in the database so that every app
// instance behind a load balancer sees the same counts. Not tenant data: a sign-in attempt
// happens before anyone is known to belong to a fleet.

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('sign_in_throttle')
    .addColumn('key', 'text', (c) => c.primaryKey())
    .addColumn('failures', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('window_started_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('sign_in_throttle_updated_at_idx').on('sign_in_throttle').column('updated_at').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('sign_in_throttle').execute();
}
