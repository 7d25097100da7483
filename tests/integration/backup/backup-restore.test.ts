// db:backup and db:restore, round trip: a backup of the test database restored into a scratch
// database holds the same rows, and the signed reports still check out against their hashes.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { sql } from 'kysely';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb, type DB } from '../../../db/connect';
import { makeFleetFixture, type FleetFixture } from '../../setup/fleet-fixture';
import { getTestDb } from '../../setup/test-db';
import { makeSignedReport } from '../security/walk-helpers';
import { hashReport } from '@/lib/walk';

const SCRATCH = 'rigcall_backup_scratch_test';
const root = path.resolve(__dirname, '../../..');
const db = getTestDb();
const url = process.env.DATABASE_URL!;
const scratchUrl = (() => {
  const u = new URL(url);
  u.pathname = `/${SCRATCH}`;
  return u.toString();
})();
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'rigcall-backup-'));
let f: FleetFixture;
let reportId: string;

async function dropScratch() {
  const u = new URL(url);
  u.pathname = '/postgres';
  const c = new pg.Client({ connectionString: u.toString() });
  await c.connect();
  await c.query(`drop database if exists ${SCRATCH} with (force)`);
  await c.end();
}

const tsx = (script: string, args: string[]) =>
  spawnSync(process.execPath, [path.join(root, 'node_modules/tsx/dist/cli.mjs'), path.join(root, script), ...args], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: url },
    encoding: 'utf8',
    timeout: 120_000,
  });

async function fleetRows(d: DB, fleetId: string) {
  const out: Record<string, number> = {};
  for (const t of ['inspection', 'inspection_step', 'defect', 'attachment', 'app_user', 'unit', 'audit_log']) {
    const r = await sql<{
      n: number;
    }>`select count(*)::int as n from ${sql.table(t)} where fleet_id = ${fleetId}`.execute(d);
    out[t] = r.rows[0]!.n;
  }
  return out;
}

async function hashHolds(d: DB, id: string) {
  const h = await d.selectFrom('inspection').selectAll().where('id', '=', id).executeTakeFirstOrThrow();
  const steps = await d.selectFrom('inspectionStep').selectAll().where('inspectionId', '=', id).execute();
  const photos = await d
    .selectFrom('attachment')
    .select(['id', 'stepId', 'sha256'])
    .where('inspectionId', '=', id)
    .where('defectId', 'is', null)
    .execute();
  const computed = hashReport(
    {
      ...h,
      finishedAt: h.finishedAt!,
      certificationText: h.certificationText!,
      signatureName: h.signatureName!,
      signedAt: h.signedAt!,
    },
    steps,
    { photos, signatureSha256: h.signatureSha256 },
    h.reportFormat,
  );
  return computed === h.contentHash;
}

beforeAll(async () => {
  if (!SCRATCH.endsWith('_scratch_test')) throw new Error('the scratch database must end in _scratch_test');
  await dropScratch();
  f = await makeFleetFixture(db, 'Backup fleet');
  reportId = (await makeSignedReport(db, f)).id;
}, 60_000);
afterAll(async () => {
  await dropScratch();
  fs.rmSync(dir, { recursive: true, force: true });
  await db.destroy();
});

describe('backup and restore', () => {
  const file = path.join(dir, 'rigcall.dump');

  it('backs up, restores into a scratch database, and the rows and hashes are the same', async () => {
    const backup = tsx('scripts/db-backup.ts', ['--out', file]);
    expect(backup.status, backup.stderr).toBe(0);
    expect(JSON.parse(backup.stdout.trim().split('\n').pop()!)).toMatchObject({
      file,
      database: new URL(url).pathname.slice(1),
    });
    expect(fs.statSync(file).size).toBeGreaterThan(1000);
    expect(fs.existsSync(`${file}.partial`)).toBe(false);
    // The password never appears on a command line.
    expect(backup.stdout + backup.stderr).not.toContain(decodeURIComponent(new URL(url).password));

    const restore = tsx('scripts/db-restore.ts', [file, '--into', SCRATCH]);
    expect(restore.status, restore.stderr).toBe(0);

    const scratch = createDb(scratchUrl, 2);
    try {
      expect(await fleetRows(scratch, f.fleet.id)).toEqual(await fleetRows(db, f.fleet.id));
      expect(await hashHolds(db, reportId)).toBe(true);
      expect(await hashHolds(scratch, reportId)).toBe(true);
      const migrations = await sql<{ n: number }>`select count(*)::int as n from kysely_migration`.execute(scratch);
      expect(migrations.rows[0]!.n).toBeGreaterThan(0);
    } finally {
      await scratch.destroy();
    }
  }, 120_000);

  it('will not restore over a database that holds tables unless told to replace it', async () => {
    const again = tsx('scripts/db-restore.ts', [file, '--into', SCRATCH]);
    expect(again.status).not.toBe(0);
    expect(again.stderr).toMatch(/already holds \d+ tables; add --replace/);
    // With --replace, a row changed since the backup comes back as it was.
    const scratch = createDb(scratchUrl, 1);
    try {
      await sql`update inspection set odometer = 1 where id = ${reportId}`.execute(scratch);
      expect(await hashHolds(scratch, reportId)).toBe(false);
    } finally {
      await scratch.destroy();
    }
    const replaced = tsx('scripts/db-restore.ts', [file, '--into', SCRATCH, '--replace']);
    expect(replaced.status, replaced.stderr).toBe(0);
    const after = createDb(scratchUrl, 1);
    try {
      expect(await hashHolds(after, reportId)).toBe(true);
    } finally {
      await after.destroy();
    }
  }, 120_000);

  it('says what is wrong with a missing file', () => {
    const r = tsx('scripts/db-restore.ts', [path.join(dir, 'nope.dump'), '--into', SCRATCH]);
    expect(r.status).not.toBe(0);
    expect(r.stderr).toMatch(/no such backup file/);
  });
});
