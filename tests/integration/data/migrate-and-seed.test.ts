// Migrations from an empty database and back, and the demo seed run twice, on a scratch database.
import { sql } from 'kysely';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb, type DB } from '../../../db/connect';
import { migrateToEmpty, migrateToLatest } from '../../../db/migrate';
import { seedDemoFleet } from '../../../db/seeds/01-demo-fleet';
import { seedHistory } from '../../../db/seeds/02-history';

const base = new URL(process.env.DATABASE_URL!);
const scratchName = `${base.pathname.slice(1)}_scratch`.replace(/_test_scratch$/, '_scratch_test');
const adminUrl = Object.assign(new URL(base), { pathname: '/postgres' }).toString();
const scratchUrl = Object.assign(new URL(base), { pathname: `/${scratchName}` }).toString();

async function admin(q: string) {
  const c = new pg.Client({ connectionString: adminUrl });
  await c.connect();
  try {
    await c.query(q);
  } finally {
    await c.end();
  }
}

let db: DB;
beforeAll(async () => {
  await admin(`DROP DATABASE IF EXISTS ${scratchName} WITH (FORCE)`);
  await admin(`CREATE DATABASE ${scratchName}`);
  db = createDb(scratchUrl, 2);
});
afterAll(async () => {
  await db.destroy();
  await admin(`DROP DATABASE IF EXISTS ${scratchName} WITH (FORCE)`);
});

const tables = async () =>
  (
    await sql<{
      t: string;
    }>`select table_name as t from information_schema.tables where table_schema = 'public' and table_name not like 'kysely_%' order by 1`.execute(
      db,
    )
  ).rows.map((r) => r.t);

const counts = async () => {
  const out: Record<string, number> = {};
  for (const t of [
    'fleet',
    'app_user',
    'unit',
    'inspection',
    'inspection_step',
    'defect',
    'acknowledgement',
    'vocabulary_version',
    'field_utterance',
  ]) {
    const { rows } = await sql<{ n: number }>`select count(*)::int as n from ${sql.table(t)}`.execute(db);
    out[t] = rows[0]!.n;
  }
  return out;
};

describe('migrations and seed', () => {
  it('migrate up from empty, down to empty, and up again', async () => {
    expect(await tables()).toEqual([]);
    await migrateToLatest(db);
    const up = await tables();
    expect(up).toEqual(
      expect.arrayContaining([
        'fleet',
        'app_user',
        'unit',
        'inspection',
        'inspection_step',
        'defect',
        'acknowledgement',
        'attachment',
        'audit_log',
        'mail_outbox',
        'vocabulary_version',
        'field_utterance',
      ]),
    );
    await migrateToEmpty(db);
    expect(await tables()).toEqual([]);
    await migrateToLatest(db);
    expect(await tables()).toEqual(up);
  });

  it('the demo seed is idempotent and tells a full story', async () => {
    const now = new Date('2026-11-30T18:00:00Z');
    const first = await seedDemoFleet(db);
    await seedHistory(db, { fleetSlug: first.fleet.slug, now });
    const once = await counts();
    await seedDemoFleet(db);
    const again = await seedHistory(db, { fleetSlug: first.fleet.slug, now });
    expect(again.skipped).toBe(true);
    expect(await counts()).toEqual(once);

    expect(once.unit).toBeGreaterThanOrEqual(13 + 1); // 5 tractors + 8 trailers, and the other fleet's
    expect(once.inspection).toBeGreaterThan(200);
    expect(once.defect).toBeGreaterThan(20);
    expect(once.acknowledgement).toBeGreaterThan(10);
    const span = await sql<{
      days: number;
    }>`select extract(day from max(started_at) - min(started_at))::int as days from inspection`.execute(db);
    expect(span.rows[0]!.days).toBeGreaterThanOrEqual(59);
    // Every submitted report is signed and carries its content hash.
    const unsigned = await sql<{
      n: number;
    }>`select count(*)::int as n from inspection where status = 'submitted' and (content_hash is null or signed_at is null)`.execute(
      db,
    );
    expect(unsigned.rows[0]!.n).toBe(0);
    // Out of service exactly where a major defect is open.
    const mismatch = await sql<{ n: number }>`
      select count(*)::int as n from unit u
      where (u.status = 'out_of_service') <> exists (select 1 from defect d where d.unit_id = u.id and d.status = 'open' and d.severity = 'major')`.execute(
      db,
    );
    expect(mismatch.rows[0]!.n).toBe(0);
  });
});
