// Faults in the middle of a walk: the app server killed and started again, and PostgreSQL
// stopped for 10 seconds and started again. The driver keeps walking, the screen says the server
// is away, and afterwards the walk finishes with every step recorded exactly once.
import { randomUUID } from 'node:crypto';
import { expect, test, type Page } from '@playwright/test';
import { createDb, type DB } from '../../../db/connect';
import { makeUnit, makeUser } from '../../../db/factories';
import { demoPassword } from '../fixtures/demo';
import { fakeSpeechScript } from '../fixtures/fake-speech';
import { expectZone, readAirBrakeTests, say, signIn, signReport, startPreTrip } from '../fixtures/walk-helpers';
import { AppServer, ThrowawayCluster } from './fault-servers';

test.describe.configure({ mode: 'serial' });
test.setTimeout(180_000);

const axles = {
  tractor: [
    { position: 'steer', tires: ['LF', 'RF'], coldPsi: 110, chamber: '24' },
    { position: 'drive', tires: ['LFO', 'LFI', 'RFI', 'RFO'], coldPsi: 100, chamber: '30' },
  ],
  trailer: [{ position: 'trailer', tires: ['LO', 'LI', 'RI', 'RO'], coldPsi: 100, chamber: '30L' }],
};

async function makeRig(db: DB) {
  const fleet = await db.selectFrom('fleet').select('id').where('slug', '=', 'northbank').executeTakeFirstOrThrow();
  const tag = randomUUID().slice(0, 4).toUpperCase();
  const tractor = await makeUnit(db, {
    fleetId: fleet.id,
    kind: 'tractor',
    unitNumber: `X${tag}`,
    make: 'Kestrel',
    model: 'fault tractor',
    year: 2022,
    axles: JSON.stringify(axles.tractor),
  });
  const trailer = await makeUnit(db, {
    fleetId: fleet.id,
    kind: 'trailer',
    unitNumber: `Y${tag}`,
    make: 'Plainsman',
    model: 'fault trailer',
    year: 2021,
    axles: JSON.stringify(axles.trailer),
  });
  return { fleetId: fleet.id, tractor, trailer };
}

async function countSteps(db: DB, inspectionId: string) {
  const rows = await db
    .selectFrom('inspectionStep')
    .select(['id', 'seq', 'kind'])
    .where('inspectionId', '=', inspectionId)
    .execute();
  return {
    total: rows.length,
    distinctSeq: new Set(rows.map((r) => r.seq)).size,
    distinctId: new Set(rows.map((r) => r.id)).size,
    byKind: rows.reduce<Record<string, number>>((m, r) => ((m[r.kind] = (m[r.kind] ?? 0) + 1), m), {}),
  };
}

/** The walk after the fault: the remaining zones, then sign, and wait for the server's lock. */
async function finishWalk(page: Page, zones: string[], name: string) {
  for (const zone of zones) {
    await expectZone(page, zone);
    // The readings a pre-trip requires: "all good" never stands in for a gauge.
    if (zone === 'Air-brake tests') await readAirBrakeTests(page);
    await say(page, 'all good');
  }
  await say(page, 'finish');
  await signReport(page, name);
  await expect(page.getByTestId('signed-status')).toHaveText('✓ Report locked on RigCall’s server.', {
    timeout: 30_000,
  });
}

test.beforeEach(async ({ context }) => {
  await context.addInitScript(fakeSpeechScript);
});

test.describe('the app server restarted mid-walk', () => {
  const app = new AppServer(3117);
  const db = createDb(process.env.DATABASE_URL ?? '', 2);
  test.use({ baseURL: app.url });
  test.beforeAll(async () => app.start());
  test.afterAll(async () => {
    await app.kill();
    await db.destroy();
  });

  test('the driver keeps walking while it is gone; afterwards nothing is lost or doubled', async ({ page }) => {
    const rig = await makeRig(db);
    const email = `restart-${randomUUID().slice(0, 6)}@northbank.example`;
    await makeUser(db, {
      fleetId: rig.fleetId,
      roles: ['driver'],
      email,
      name: 'Remy Restart',
      password: demoPassword,
    });
    await signIn(page, email);
    const inspectionId = await startPreTrip(page, rig);
    await page.getByRole('button', { name: '● Listen' }).click();
    await say(page, 'all good');
    await expectZone(page, 'Engine bay');
    await expect(page.getByTestId('sync-status')).toHaveText('✓ All saved');

    await app.kill();
    await say(page, 'coolant low');
    await say(page, 'all good');
    await expectZone(page, 'Driver side tractor');
    await say(page, 'all good');
    await expectZone(page, 'Coupling');
    await expect(page.getByTestId('away-banner')).toContainText(/No connection|server is not answering/);
    await expect(page.getByTestId('away-banner')).toContainText('everything is saved on this phone and will be sent');
    await expect(page.getByTestId('sync-status')).toContainText('saved on this phone');
    const whileAway = await countSteps(db, inspectionId);

    await app.start();
    await expect(page.getByTestId('sync-status')).toHaveText('✓ All saved', { timeout: 30_000 });
    await expect(page.getByTestId('away-banner')).toBeHidden();
    await finishWalk(
      page,
      [
        'Coupling',
        'Driver side trailer',
        'Rear',
        'Passenger side trailer',
        'Passenger side tractor',
        'In cab',
        'Air-brake tests',
      ],
      'Remy Restart',
    );

    const after = await countSteps(db, inspectionId);
    expect(after).toEqual({
      total: 27,
      distinctSeq: 27,
      distinctId: 27,
      byKind: { visit: 10, zone_ok: 10, defect: 1, measurement: 6 },
    });
    expect(after.total).toBeGreaterThan(whileAway.total);
    const report = await db
      .selectFrom('inspection')
      .select('status')
      .where('id', '=', inspectionId)
      .executeTakeFirstOrThrow();
    expect(report.status).toBe('submitted');
  });
});

test.describe('PostgreSQL stopped for 10 seconds mid-walk', () => {
  const cluster = new ThrowawayCluster(54339);
  const dbName = 'rigcall_fault';
  const app = new AppServer(3118, { DATABASE_URL: cluster.url(dbName) });
  let db: DB;
  test.use({ baseURL: app.url });
  test.beforeAll(async () => {
    cluster.init();
    cluster.start();
    cluster.prepare(dbName);
    db = createDb(cluster.url(dbName), 2);
    await app.start();
  });
  test.afterAll(async () => {
    await app.kill();
    await db?.destroy();
    cluster.destroy();
  });

  test('the screen says the server is not answering; after it is back the walk finishes, every step once', async ({
    page,
  }) => {
    const rig = await makeRig(db);
    await signIn(page, 'dana.okafor@northbank.example');
    const inspectionId = await startPreTrip(page, rig);
    await page.getByRole('button', { name: '● Listen' }).click();
    await say(page, 'all good');
    await expectZone(page, 'Engine bay');
    await expect(page.getByTestId('sync-status')).toHaveText('✓ All saved');

    await db.destroy(); // our own connections would only see errors while it is down
    cluster.stop();
    const stoppedAt = Date.now();
    await say(page, 'coolant low');
    await say(page, 'all good');
    await expectZone(page, 'Driver side tractor');
    await say(page, 'drive pressure ninety eight psi');
    await say(page, 'all good');
    await expectZone(page, 'Coupling');
    await expect(page.getByTestId('away-banner')).toContainText('RigCall’s server is not answering.', {
      timeout: 8_000,
    });
    await expect(page.getByTestId('sync-status')).toContainText('saved on this phone');
    await page.waitForTimeout(Math.max(0, 10_000 - (Date.now() - stoppedAt)));
    expect(app.running, 'the app server survives the database going away').toBe(true);
    cluster.start();
    db = createDb(cluster.url(dbName), 2);

    await expect(page.getByTestId('sync-status')).toHaveText('✓ All saved', { timeout: 30_000 });
    await expect(page.getByTestId('away-banner')).toBeHidden();
    await finishWalk(
      page,
      [
        'Coupling',
        'Driver side trailer',
        'Rear',
        'Passenger side trailer',
        'Passenger side tractor',
        'In cab',
        'Air-brake tests',
      ],
      'Dana Okafor',
    );

    const after = await countSteps(db, inspectionId);
    expect(after).toEqual({
      total: 28,
      distinctSeq: 28,
      distinctId: 28,
      byKind: { visit: 10, zone_ok: 10, defect: 1, measurement: 7 },
    });
    const report = await db
      .selectFrom('inspection')
      .select('status')
      .where('id', '=', inspectionId)
      .executeTakeFirstOrThrow();
    expect(report.status).toBe('submitted');
  });
});

test.describe('a step the server answered for, then lost before it reached its disk', () => {
  // An open walk's steps commit without waiting for the disk, so a database crash can lose one
  // the phone was told was saved. Taking the row away plays that crash; signing must find it.
  const db = createDb(process.env.DATABASE_URL ?? '', 2);
  test.afterAll(() => db.destroy());

  test('signing finds it missing, the phone sends it again, and the report locks with it', async ({ page }) => {
    const rig = await makeRig(db);
    const email = `lost-${randomUUID().slice(0, 6)}@northbank.example`;
    await makeUser(db, {
      fleetId: rig.fleetId,
      roles: ['driver'],
      email,
      name: 'Lou Lostwrite',
      password: demoPassword,
    });
    await signIn(page, email);
    const inspectionId = await startPreTrip(page, rig);
    await page.getByRole('button', { name: '● Listen' }).click();
    await say(page, 'all good');
    await expectZone(page, 'Engine bay');
    await say(page, 'all good');
    await expectZone(page, 'Driver side tractor');
    // The engine bay's "all good" reached the server (the status line may still show the moment before it was sent).
    const engineBayOk = () =>
      db
        .selectFrom('inspectionStep')
        .select(['id'])
        .where('inspectionId', '=', inspectionId)
        .where('kind', '=', 'zone_ok')
        .where('zone', '=', 'engine_bay')
        .executeTakeFirst();
    await expect.poll(async () => !!(await engineBayOk()), { timeout: 10_000 }).toBe(true);
    await expect(page.getByTestId('sync-status')).toHaveText('✓ All saved');
    const lost = (await engineBayOk())!;
    await db.deleteFrom('inspectionStep').where('id', '=', lost.id).execute();

    await finishWalk(
      page,
      [
        'Driver side tractor',
        'Coupling',
        'Driver side trailer',
        'Rear',
        'Passenger side trailer',
        'Passenger side tractor',
        'In cab',
        'Air-brake tests',
      ],
      'Lou Lostwrite',
    );

    const after = await countSteps(db, inspectionId);
    expect(after).toEqual({
      total: 26,
      distinctSeq: 26,
      distinctId: 26,
      byKind: { visit: 10, zone_ok: 10, measurement: 6 },
    });
    const back = await db.selectFrom('inspectionStep').select('id').where('id', '=', lost.id).execute();
    expect(back).toHaveLength(1);
    const report = await db
      .selectFrom('inspection')
      .select('status')
      .where('id', '=', inspectionId)
      .executeTakeFirstOrThrow();
    expect(report.status).toBe('submitted');
    const refused = await db
      .selectFrom('auditLog')
      .select('action')
      .where('entityId', '=', inspectionId)
      .where('action', '=', 'inspection.sign')
      .execute();
    expect(refused).toHaveLength(1);
  });
});
