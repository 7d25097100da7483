// `npm run bench:office [-- --json]` (the script starts the local services itself, through
// `node scripts/stack.mjs exec --test`, which sets DATABASE_URL to the test cluster):
// seeds 100,000 inspections with 2,000,000 steps into a separate database in the same cluster
// (rigcall_bench; reused once seeded), then times the reports-table query (one page + the total,
// as GET /api/reports runs them) and the report-detail query (as GET /api/reports/[id] reads the
// database), prints p50/p95 and the EXPLAIN (ANALYZE, BUFFERS) plans. With --json the last line
// is {"inspections","steps","list_p95_ms","detail_p95_ms"}.
import { spawnSync } from 'node:child_process';
import { CamelCasePlugin, Kysely, PostgresDialect, sql, type CompiledQuery } from 'kysely';
import pg from 'pg';
import type { DB as Database } from '../db/schema';

// The query functions live in server-only modules; run them with the server condition.
if (!process.execArgv.some((a) => a.includes('react-server'))) {
  const r = spawnSync(
    process.execPath,
    [...process.execArgv, '--conditions=react-server', process.argv[1]!, ...process.argv.slice(2)],
    { stdio: 'inherit' },
  );
  process.exit(r.status ?? 1);
}

const { migrateToLatest } = await import('../db/migrate');
const { poolLimits, toolDbLimits } = await import('../db/connect');
const { countReportRows, findFleetMinimums, findReportRecord, listReportRows } = await import('../lib/db/reports');
const { findInspectionDetail } = await import('../lib/db/inspections');

const json = process.argv.includes('--json');
const say = (...a: unknown[]) => (json ? console.error(...a) : console.log(...a));
const TARGET_INSPECTIONS = 100_000;
const STEPS_PER = 20;
const FLEET_ID = '00000000-0000-4000-a000-00000000b001';

pg.types.setTypeParser(pg.types.builtins.INT8, (v) => Number(v));
pg.types.setTypeParser(pg.types.builtins.NUMERIC, (v) => Number(v));

const baseUrl = process.env.DATABASE_URL;
if (!baseUrl)
  throw new Error('DATABASE_URL is not set: run `npm run bench:office`, which sets it through scripts/stack.mjs');
const withDb = (name: string) => {
  const u = new URL(baseUrl);
  u.pathname = `/${name}`;
  return u.toString();
};
const host = new URL(baseUrl).hostname;
if (!['127.0.0.1', 'localhost', '::1'].includes(host)) throw new Error(`refusing to benchmark a database on ${host}`);

// 1. the benchmark database, created once
{
  const admin = new pg.Client({ connectionString: withDb('postgres') });
  await admin.connect();
  const exists = await admin.query(`SELECT 1 FROM pg_database WHERE datname = 'rigcall_bench'`);
  if (!exists.rowCount) {
    say('[bench] creating database rigcall_bench');
    await admin.query('CREATE DATABASE rigcall_bench');
  }
  await admin.end();
}

const captured: CompiledQuery[] = [];
let capturing = false;
const pool = new pg.Pool({ connectionString: withDb('rigcall_bench'), max: 4, ...poolLimits(toolDbLimits) });
const db = new Kysely<Database>({
  dialect: new PostgresDialect({ pool }),
  plugins: [new CamelCasePlugin({ maintainNestedObjectKeys: true })],
  log: (e) => {
    if (capturing && e.level === 'query') captured.push(e.query);
  },
});
await migrateToLatest(db, (m) => say(`[bench] ${m}`));

const count = async (table: 'inspection' | 'inspection_step') =>
  Number(
    (
      await sql<{
        n: number;
      }>`SELECT count(*)::bigint AS n FROM ${sql.table(table)} WHERE fleet_id = ${FLEET_ID}`.execute(db)
    ).rows[0]!.n,
  );

// 2. seed, once: multi-row INSERT … SELECT over generate_series, in chunks
let inspections = await count('inspection');
let steps = await count('inspection_step');
if (inspections < TARGET_INSPECTIONS || steps < TARGET_INSPECTIONS * STEPS_PER) {
  const t0 = Date.now();
  say('[bench] seeding 100,000 inspections and 2,000,000 steps (a few minutes on two cores)…');
  await sql`DELETE FROM defect WHERE fleet_id = ${FLEET_ID}`.execute(db);
  await sql`DELETE FROM inspection_step WHERE fleet_id = ${FLEET_ID}`.execute(db);
  await sql`DELETE FROM inspection WHERE fleet_id = ${FLEET_ID}`.execute(db);
  await sql`INSERT INTO fleet (id, name, slug, maintenance_email) VALUES (${FLEET_ID}, 'Bench Freight', 'bench-freight', 'shop@bench.example') ON CONFLICT (id) DO NOTHING`.execute(
    db,
  );
  await sql`INSERT INTO app_user (id, fleet_id, email, name, password_hash, roles)
    SELECT md5('bench-driver-' || n)::uuid, ${FLEET_ID}, 'driver' || n || '@bench.example', 'Driver ' || lpad(n::text, 3, '0'), 'x', ARRAY['driver']
    FROM generate_series(1, 60) n ON CONFLICT DO NOTHING`.execute(db);
  await sql`INSERT INTO unit (id, fleet_id, kind, unit_number)
    SELECT md5('bench-unit-' || n)::uuid, ${FLEET_ID}, CASE WHEN n <= 90 THEN 'tractor' ELSE 'trailer' END, CASE WHEN n <= 90 THEN 'T' ELSE 'R' END || lpad(n::text, 4, '0')
    FROM generate_series(1, 240) n ON CONFLICT DO NOTHING`.execute(db);
  const chunk = 10_000;
  for (let lo = 1; lo <= TARGET_INSPECTIONS; lo += chunk) {
    const hi = Math.min(TARGET_INSPECTIONS, lo + chunk - 1);
    await sql`
      INSERT INTO inspection (id, fleet_id, kind, driver_id, tractor_id, trailer_id, odometer, location, rule_profile, status,
                              started_at, finished_at, duration_s, certification_text, signature_name, signed_at, content_hash, reviewed_at, created_at)
      SELECT md5('bench-insp-' || n)::uuid, ${FLEET_ID},
             CASE WHEN n % 3 = 0 THEN 'post_trip' ELSE 'pre_trip' END,
             md5('bench-driver-' || (1 + n % 60))::uuid,
             md5('bench-unit-' || (1 + n % 90))::uuid,
             CASE WHEN n % 10 = 0 THEN NULL ELSE md5('bench-unit-' || (91 + n % 150))::uuid END,
             100000 + n * 3, 'Yard ' || (n % 7), 'us-federal', 'submitted',
             st, st + make_interval(secs => dur), dur, 'I performed this inspection.', 'Driver ' || lpad((1 + n % 60)::text, 3, '0'),
             st + make_interval(secs => dur + 20), md5('hash-' || n) || md5('hash2-' || n),
             CASE WHEN n % 4 = 0 THEN st + interval '6 hours' END, st
      FROM (SELECT n, now() - make_interval(mins => n * 5) AS st, 300 + (n * 37) % 1500 AS dur FROM generate_series(${lo}::int, ${hi}::int) n) s`.execute(
      db,
    );
    await sql`
      INSERT INTO inspection_step (id, fleet_id, inspection_id, seq, zone, kind, heard, input_mode, component, condition, score, resolution, severity, device_at, server_at)
      SELECT md5('bench-step-' || n || '-' || q)::uuid, ${FLEET_ID}, md5('bench-insp-' || n)::uuid, q,
             (ARRAY['front','engine_bay','driver_side_tractor','coupling','driver_side_trailer','rear','passenger_side_trailer','passenger_side_tractor','in_cab','air_brake_tests'])[1 + q / 2],
             CASE WHEN q % 2 = 0 THEN 'visit' WHEN q = 3 AND n % 29 = 0 THEN 'defect' ELSE 'zone_ok' END,
             CASE WHEN q = 3 AND n % 29 = 0 THEN 'bulge on the left steer tire' WHEN q % 2 = 1 THEN 'all good' END,
             CASE WHEN q % 2 = 1 THEN 'voice' ELSE 'tap' END,
             CASE WHEN q = 3 AND n % 29 = 0 THEN 'steer tire' END,
             CASE WHEN q = 3 AND n % 29 = 0 THEN 'bulge' END,
             CASE WHEN q % 2 = 1 THEN 0.9 END,
             CASE WHEN q % 2 = 1 THEN 'auto' END,
             CASE WHEN q = 3 AND n % 29 = 0 THEN (CASE WHEN n % 58 = 0 THEN 'major' ELSE 'minor' END) END,
             now() - make_interval(mins => n * 5) + make_interval(secs => q * 40), now() - make_interval(mins => n * 5) + make_interval(secs => q * 40 + 1)
      FROM generate_series(${lo}::int, ${hi}::int) n CROSS JOIN generate_series(0, ${STEPS_PER - 1}::int) q`.execute(
      db,
    );
    say(
      `[bench]   ${hi.toLocaleString('en-US')} inspections, ${(hi * STEPS_PER).toLocaleString('en-US')} steps (${((Date.now() - t0) / 1000).toFixed(0)} s)`,
    );
  }
  await sql`
    INSERT INTO defect (fleet_id, inspection_id, step_id, unit_id, zone, component, condition, severity, description, status, certified_by, certified_name, certified_at, created_at)
    SELECT s.fleet_id, s.inspection_id, s.id, i.tractor_id, s.zone, s.component, s.condition, s.severity, 'steer tire, bulge, left',
           CASE WHEN i.started_at < now() - interval '2 days' THEN 'repaired' ELSE 'open' END,
           CASE WHEN i.started_at < now() - interval '2 days' THEN md5('bench-driver-1')::uuid END,
           CASE WHEN i.started_at < now() - interval '2 days' THEN 'Bench Mechanic' END,
           CASE WHEN i.started_at < now() - interval '2 days' THEN i.finished_at + interval '5 hours' END,
           s.device_at
    FROM inspection_step s JOIN inspection i ON i.id = s.inspection_id
    WHERE s.fleet_id = ${FLEET_ID} AND s.kind = 'defect'`.execute(db);
  inspections = await count('inspection');
  steps = await count('inspection_step');
  say(`[bench] seeded in ${((Date.now() - t0) / 1000).toFixed(0)} s`);
} else {
  say('[bench] reusing the seeded benchmark database');
}
// Keep the visibility map and statistics fresh (autovacuum's job in production), so that the
// covering indexes answer as index-only scans.
await pool.query('VACUUM (ANALYZE) inspection');
await pool.query('VACUUM (ANALYZE) defect');
const defects = Number(
  (await sql<{ n: number }>`SELECT count(*)::bigint AS n FROM defect WHERE fleet_id = ${FLEET_ID}`.execute(db)).rows[0]!
    .n,
);
say(
  `[bench] ${inspections.toLocaleString('en-US')} inspections, ${steps.toLocaleString('en-US')} steps, ${defects.toLocaleString('en-US')} defects`,
);

// 3. timings
const fleet = await findFleetMinimums(db, { fleetId: FLEET_ID });
if (!fleet) throw new Error('bench fleet missing');
const drivers = (
  await sql<{ id: string }>`SELECT id FROM app_user WHERE fleet_id = ${FLEET_ID} ORDER BY id`.execute(db)
).rows.map((r) => r.id);
const units = (
  await sql<{ id: string }>`SELECT id FROM unit WHERE fleet_id = ${FLEET_ID} ORDER BY id`.execute(db)
).rows.map((r) => r.id);
const ids = (
  await sql<{
    id: string;
  }>`SELECT id FROM inspection WHERE fleet_id = ${FLEET_ID} ORDER BY md5(id::text) LIMIT 400`.execute(db)
).rows.map((r) => r.id);

type Variant = {
  name: string;
  filters: Record<string, string>;
  sort: 'startedAt' | 'durationS' | 'driverName';
  dir: 'asc' | 'desc';
  page: number;
};
const variants: Variant[] = [
  { name: 'newest first, page 1', filters: {}, sort: 'startedAt', dir: 'desc', page: 1 },
  { name: 'newest first, page 40', filters: {}, sort: 'startedAt', dir: 'desc', page: 40 },
  { name: 'one driver', filters: { driverId: drivers[7]! }, sort: 'startedAt', dir: 'desc', page: 1 },
  { name: 'one unit (tractor or trailer)', filters: { unitId: units[120]! }, sort: 'startedAt', dir: 'desc', page: 1 },
  {
    name: 'has defects, unreviewed',
    filters: { hasDefects: 'yes', status: 'unreviewed' },
    sort: 'startedAt',
    dir: 'desc',
    page: 1,
  },
  {
    name: 'short pre-trips, last 30 days',
    filters: {
      short: 'yes',
      kind: 'pre_trip',
      from: new Date(Date.now() - 30 * 86_400_000).toISOString().slice(0, 10),
    },
    sort: 'startedAt',
    dir: 'desc',
    page: 1,
  },
  { name: 'by duration, shortest first', filters: {}, sort: 'durationS', dir: 'asc', page: 1 },
];

const listOnce = async (v: Variant) => {
  const a = { fleetId: FLEET_ID, filters: v.filters, minimums: fleet, sort: v.sort, dir: v.dir } as const;
  await Promise.all([listReportRows(db, { ...a, limit: 25, offset: (v.page - 1) * 25 }), countReportRows(db, a)]);
};
const detailOnce = async (id: string) => {
  await Promise.all([
    findInspectionDetail(db, { fleetId: FLEET_ID, id }),
    findReportRecord(db, { fleetId: FLEET_ID, id }),
  ]);
};

const pct = (xs: number[], p: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.ceil((p / 100) * s.length) - 1)]!;
};
const time = async (fn: () => Promise<void>) => {
  const t = performance.now();
  await fn();
  return performance.now() - t;
};

for (const v of variants) await listOnce(v); // warm
for (const id of ids.slice(0, 20)) await detailOnce(id);

const listTimes: number[] = [];
say('\n[bench] reports-table query (page of 25 + total), 30 runs each:');
for (const v of variants) {
  const own: number[] = [];
  for (let i = 0; i < 30; i++) own.push(await time(() => listOnce(v)));
  listTimes.push(...own);
  say(
    `  ${v.name.padEnd(34)} p50 ${pct(own, 50).toFixed(1).padStart(6)} ms   p95 ${pct(own, 95).toFixed(1).padStart(6)} ms`,
  );
}
const detailTimes: number[] = [];
for (const id of ids) detailTimes.push(await time(() => detailOnce(id)));
const listP95 = Math.round(pct(listTimes, 95) * 10) / 10;
const detailP95 = Math.round(pct(detailTimes, 95) * 10) / 10;
say(
  `  ${'all list variants'.padEnd(34)} p50 ${pct(listTimes, 50).toFixed(1).padStart(6)} ms   p95 ${listP95.toFixed(1).padStart(6)} ms  (${listTimes.length} runs)`,
);
say(`\n[bench] report-detail query (header + steps + defects + photos + acknowledgements), ${ids.length} reports:`);
say(
  `  p50 ${pct(detailTimes, 50).toFixed(1)} ms   p95 ${detailP95.toFixed(1)} ms   max ${Math.max(...detailTimes).toFixed(1)} ms`,
);
say(`  target p95 <= 50 ms: list ${listP95 <= 50 ? 'met' : 'MISSED'}, detail ${detailP95 <= 50 ? 'met' : 'MISSED'}`);

// 4. plans
const explain = async (label: string, fn: () => Promise<void>) => {
  captured.length = 0;
  capturing = true;
  await fn();
  capturing = false;
  for (const q of [...captured]) {
    const plan = await pool.query(`EXPLAIN (ANALYZE, BUFFERS) ${q.sql}`, q.parameters as unknown[]);
    say(`\n[bench] EXPLAIN ANALYZE — ${label}: ${q.sql.slice(0, 90).replace(/\s+/g, ' ')}…`);
    for (const row of plan.rows as { 'QUERY PLAN': string }[]) say(`  ${row['QUERY PLAN']}`);
  }
};
await explain('reports table, newest first, page 1', () => listOnce(variants[0]!));
await explain('reports table, has defects + unreviewed', () => listOnce(variants[4]!));
await explain('report detail', () => detailOnce(ids[0]!));

await db.destroy();
if (json) console.log(JSON.stringify({ inspections, steps, list_p95_ms: listP95, detail_p95_ms: detailP95 }));
