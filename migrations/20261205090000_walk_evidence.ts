import { sql, type Kysely } from 'kysely';

// The record is evidence: an item not checked carries its reason; a step keeps whether it waited
// on the phone (offline); a report keeps its hash format, where its duration came from and the
// SHA-256 of the drawn signature; a fleet chooses the readings a pre-trip requires and its
// tire-pressure gauge tolerance.

export async function up(db: Kysely<any>): Promise<void> {
  await sql`ALTER TABLE inspection_step DROP CONSTRAINT IF EXISTS inspection_step_kind_check`.execute(db);
  await sql`ALTER TABLE inspection_step ADD CONSTRAINT inspection_step_kind_check CHECK (kind IN ('ok', 'defect', 'measurement', 'not_checked', 'zone_ok', 'visit', 'undo', 'note', 'photo'))`.execute(db);
  await db.schema
    .alterTable('inspection_step')
    .addColumn('not_checked_reason', 'text', (c) =>
      c.check(sql`not_checked_reason IN ('not_accessible', 'not_equipped', 'no_gauge', 'other')`),
    )
    .addColumn('note', 'text')
    .addColumn('queued_offline', 'boolean', (c) => c.notNull().defaultTo(false))
    .execute();
  await sql`ALTER TABLE inspection_step ADD CONSTRAINT inspection_step_not_checked_has_reason CHECK (kind <> 'not_checked' OR not_checked_reason IS NOT NULL)`.execute(db);

  await db.schema
    .alterTable('inspection')
    .addColumn('report_format', 'integer', (c) => c.notNull().defaultTo(1).check(sql`report_format IN (1, 2)`))
    .addColumn('duration_source', 'text', (c) => c.check(sql`duration_source IN ('server', 'device')`))
    .addColumn('signature_sha256', 'text')
    .execute();

  await db.schema
    .alterTable('fleet')
    .addColumn('required_readings', 'jsonb', (c) =>
      c.notNull().defaultTo(sql`'["air_buildup", "governor_cutout", "governor_cutin", "air_leak", "low_air_warning"]'::jsonb`),
    )
    .addColumn('tire_pressure_tolerance_psi', 'integer', (c) =>
      c.notNull().defaultTo(2).check(sql`tire_pressure_tolerance_psi BETWEEN 0 AND 10`),
    )
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('fleet').dropColumn('required_readings').dropColumn('tire_pressure_tolerance_psi').execute();
  await db.schema
    .alterTable('inspection')
    .dropColumn('report_format')
    .dropColumn('duration_source')
    .dropColumn('signature_sha256')
    .execute();
  await sql`ALTER TABLE inspection_step DROP CONSTRAINT IF EXISTS inspection_step_not_checked_has_reason`.execute(db);
  await db.schema
    .alterTable('inspection_step')
    .dropColumn('not_checked_reason')
    .dropColumn('note')
    .dropColumn('queued_offline')
    .execute();
  await sql`ALTER TABLE inspection_step DROP CONSTRAINT IF EXISTS inspection_step_kind_check`.execute(db);
  await sql`ALTER TABLE inspection_step ADD CONSTRAINT inspection_step_kind_check CHECK (kind IN ('ok', 'defect', 'measurement', 'zone_ok', 'visit', 'undo', 'note', 'photo'))`.execute(db);
}
