import { sql, type Kysely } from 'kysely';

// Each fleet keeps its own labelled utterance set (one JSON object a line, the shape of
// tests/fixtures/matcher/*.jsonl) to score a draft vocabulary before it is published.
// Stored as text so that the labels' keys reach the matcher exactly as written.

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('vocabulary_test_set')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('fleet_id', 'uuid', (c) => c.notNull().unique().references('fleet.id'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('jsonl', 'text', (c) => c.notNull())
    .addColumn('line_count', 'integer', (c) => c.notNull().check(sql`line_count >= 0`))
    .addColumn('updated_by', 'uuid', (c) => c.references('app_user.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await sql`CREATE TRIGGER vocabulary_test_set_touch BEFORE UPDATE ON vocabulary_test_set FOR EACH ROW EXECUTE FUNCTION touch_updated_at()`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('vocabulary_test_set').ifExists().execute();
}
