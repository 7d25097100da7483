import { sql, type Kysely } from 'kysely';

// The office's reports table pages, counts and filters 100,000s of reports per fleet. Each report
// keeps its defect counts (kept by a trigger on defect, so every writer stays correct), and the
// list reads one covering index in its display order instead of joining and sorting every row.

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('inspection')
    .addColumn('defect_count', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('major_defect_count', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('open_defect_count', 'integer', (c) => c.notNull().defaultTo(0))
    .execute();

  await sql`
    CREATE FUNCTION inspection_defect_counts(target uuid) RETURNS void LANGUAGE sql AS $$
      UPDATE inspection i SET
        defect_count = c.total, major_defect_count = c.major, open_defect_count = c.open
      FROM (
        SELECT count(*)::int AS total,
               count(*) FILTER (WHERE severity = 'major')::int AS major,
               count(*) FILTER (WHERE status = 'open')::int AS open
        FROM defect WHERE inspection_id = target
      ) c
      WHERE i.id = target
        AND (i.defect_count, i.major_defect_count, i.open_defect_count) IS DISTINCT FROM (c.total, c.major, c.open);
    $$;
    CREATE FUNCTION defect_keeps_inspection_counts() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP IN ('UPDATE', 'DELETE') THEN PERFORM inspection_defect_counts(OLD.inspection_id); END IF;
      IF TG_OP IN ('INSERT', 'UPDATE') AND (TG_OP = 'INSERT' OR NEW.inspection_id IS DISTINCT FROM OLD.inspection_id OR NEW.status IS DISTINCT FROM OLD.status OR NEW.severity IS DISTINCT FROM OLD.severity) THEN
        PERFORM inspection_defect_counts(NEW.inspection_id);
      END IF;
      RETURN NULL;
    END $$;
    CREATE TRIGGER defect_keeps_inspection_counts AFTER INSERT OR UPDATE OR DELETE ON defect
    FOR EACH ROW EXECUTE FUNCTION defect_keeps_inspection_counts();
  `.execute(db);

  await sql`
    UPDATE inspection i SET defect_count = c.total, major_defect_count = c.major, open_defect_count = c.open
    FROM (
      SELECT inspection_id, count(*)::int AS total, count(*) FILTER (WHERE severity = 'major')::int AS major, count(*) FILTER (WHERE status = 'open')::int AS open
      FROM defect GROUP BY inspection_id
    ) c
    WHERE i.id = c.inspection_id
  `.execute(db);

  // Newest first (the default view), with every column the filters read, so a page and its count
  // are index-only scans.
  await sql`
    CREATE INDEX inspection_fleet_list_idx ON inspection (fleet_id, started_at DESC, id DESC)
    INCLUDE (kind, status, reviewed_at, duration_s, driver_id, tractor_id, trailer_id, defect_count, major_defect_count)
  `.execute(db);
  // Reports with defects are few: their own small index.
  await sql`CREATE INDEX inspection_fleet_defects_idx ON inspection (fleet_id, started_at DESC, id DESC) WHERE defect_count > 0`.execute(db);
  // Sorted by time taken (shortest first finds rushed walks).
  await sql`CREATE INDEX inspection_fleet_duration_idx ON inspection (fleet_id, duration_s, started_at, id)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`DROP TRIGGER IF EXISTS defect_keeps_inspection_counts ON defect`.execute(db);
  await sql`DROP FUNCTION IF EXISTS defect_keeps_inspection_counts, inspection_defect_counts`.execute(db);
  for (const i of ['inspection_fleet_list_idx', 'inspection_fleet_defects_idx', 'inspection_fleet_duration_idx']) await sql`DROP INDEX IF EXISTS ${sql.raw(i)}`.execute(db);
  await db.schema.alterTable('inspection').dropColumn('defect_count').dropColumn('major_defect_count').dropColumn('open_defect_count').execute();
}
