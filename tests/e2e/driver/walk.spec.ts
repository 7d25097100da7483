import path from 'node:path';
import os from 'node:os';
import sharp from 'sharp';
import { expect, test } from '@playwright/test';
import { fakeSpeechScript } from '../fixtures/fake-speech';
import {
  countSteps,
  db,
  expectZone,
  makeTestRig,
  readAirBrakeTests,
  say,
  signIn,
  signReport,
  startPreTrip,
  waitForMail,
} from '../fixtures/walk-helpers';

test.describe.configure({ mode: 'serial' });
test.setTimeout(120_000);

test.beforeEach(async ({ context }) => {
  await context.addInitScript(fakeSpeechScript);
});

async function photoFixture() {
  const file = path.join(os.tmpdir(), `rigcall-defect-${process.pid}.jpg`);
  await sharp({ create: { width: 640, height: 480, channels: 3, background: '#5a3a22' } })
    .withMetadata({ exif: { IFD0: { Make: 'YardCam' } } })
    .jpeg()
    .toFile(file);
  return file;
}

test('a whole pre-trip by voice: findings, a "no", readings, a photo, undo, sign; database and mail agree', async ({
  page,
}) => {
  const rig = await makeTestRig();
  await signIn(page, 'luis.ferreira@northbank.example');
  const inspectionId = await startPreTrip(page, rig);
  await page.getByRole('button', { name: '● Listen' }).click();
  await expect(page.getByText('● Listening')).toBeVisible();

  // Front: a confident finding and its photo, then a failing and a passing reading.
  await say(page, ['bulge on the left steer tire', 'bulge on the left steer tyre']);
  await expect(page.getByTestId('readback')).toHaveText('Left steer tire, bulge. Major: out of service.');
  await say(page, 'photo');
  await page.locator('input[type=file]').setInputFiles(await photoFixture());
  await expect(page.getByTestId('readback')).toContainText('Photo added to: steer tire, bulge');
  await say(page, 'steer tread three thirty seconds');
  await expect(page.getByTestId('readback')).toContainText('Major defect'); // 49 CFR 393.75(b): 4/32 in on a steer tire
  await say(page, 'steer pressure one hundred and twelve psi');
  await expect(page.getByTestId('readback')).toContainText('Pass');
  await say(page, 'all good');
  await expectZone(page, 'Engine bay');

  // A zone closes on a zone-level phrase; a bare "looks good" only acknowledges.
  await say(page, 'engine bay looks good');
  await expectZone(page, 'Driver side tractor');
  await say(page, 'drive tread eight thirty seconds');
  await expect(page.getByTestId('readback')).toContainText('Pass');
  await say(page, 'all good');
  await expectZone(page, 'Coupling');

  // An unsure match: "no", then the right one from the buttons.
  await say(page, 'glad hand seal leaking');
  await expect(page.getByText(/Did you mean/)).toBeVisible();
  await say(page, 'no');
  await page.getByRole('button', { name: 'glad hand, audible air leak' }).click();
  await expect(page.getByTestId('readback')).toContainText('Glad hand, audible air leak');
  // A finding said by mistake, taken back.
  await say(page, 'landing gear bent');
  await expect(page.getByTestId('readback')).toContainText('Landing gear, bent');
  await say(page, 'undo');
  await expect(page.getByTestId('readback')).toContainText('Took back: landing gear, bent');
  await say(page, 'all good');

  for (const zone of ['Driver side trailer', 'Rear', 'Passenger side trailer', 'Passenger side tractor', 'In cab']) {
    await expectZone(page, zone);
    await say(page, 'all good');
  }
  await expectZone(page, 'Air-brake tests');
  await say(page, 'governor cut out one twenty five psi');
  await expect(page.getByTestId('readback')).toContainText('Pass');
  await say(page, 'lost five psi in a minute with the brakes applied');
  await expect(page.getByTestId('readback')).toContainText(/defect/); // CDL manual §5.3: combination, applied, at most 4 psi
  // The other readings the pre-trip requires: "all good" never stands in for a gauge.
  await readAirBrakeTests(page, ['Governor cut-out', 'Leakage, brakes applied']);
  await say(page, 'all good');
  await expect(page.getByTestId('readback')).toContainText('all good');
  await say(page, 'finish');

  await expect(page.getByRole('heading', { name: 'Review and sign' })).toBeVisible();
  await expect(page.getByRole('alert').filter({ hasText: 'OUT OF SERVICE' })).toBeVisible();
  await signReport(page, 'Luis Ferreira');
  await expect(page.getByTestId('signed-status')).toHaveText('✓ Report locked on RigCall’s server.', {
    timeout: 20_000,
  });

  // The database: every step once, the defects (not the one taken back), the unit out of service.
  const counted = await countSteps(inspectionId);
  expect(counted.total).toBe(counted.distinctSeq);
  expect(counted.byKind).toMatchObject({ visit: 10, zone_ok: 10, defect: 3, undo: 1 });
  const report = await db
    .selectFrom('inspection')
    .select(['status', 'contentHash', 'signatureName', 'signatureKey'])
    .where('id', '=', inspectionId)
    .executeTakeFirstOrThrow();
  expect(report).toMatchObject({
    status: 'submitted',
    signatureName: 'Luis Ferreira',
    signatureKey: `fleet/${rig.tractor.fleetId}/inspections/${inspectionId}/signature.png`,
  });
  const defects = await db
    .selectFrom('defect')
    .select(['component', 'condition', 'severity', 'unitId'])
    .where('inspectionId', '=', inspectionId)
    .orderBy('createdAt')
    .execute();
  expect(defects.map((d) => `${d.component}:${d.condition}`)).toEqual([
    'steer tire:bulge',
    'steer tire:tread depth fails the limit',
    'glad hand:audible air leak',
    'air system:air leak fails the limit',
  ]);
  const unit = await db.selectFrom('unit').select('status').where('id', '=', rig.tractor.id).executeTakeFirstOrThrow();
  expect(unit.status).toBe('out_of_service');
  const photos = await db
    .selectFrom('attachment')
    .select(['stepId', 'contentType'])
    .where('inspectionId', '=', inspectionId)
    .execute();
  expect(photos).toHaveLength(1);
  expect(photos[0]!.stepId).not.toBeNull();
  // The mail catcher: maintenance heard about it.
  expect(
    await waitForMail('shop@northbank.example', new RegExp(`OUT OF SERVICE: unit ${rig.tractor.unitNumber}`)),
  ).not.toBeNull();
});

test('offline for the middle zones and back: nothing lost, nothing recorded twice', async ({ page, context }) => {
  const rig = await makeTestRig();
  await signIn(page, 'wren.castillo@northbank.example');
  const inspectionId = await startPreTrip(page, rig);
  await page.getByRole('button', { name: '● Listen' }).click();
  await say(page, 'all good');
  await expectZone(page, 'Engine bay');
  await expect(page.getByTestId('sync-status')).toHaveText('✓ All saved');

  await context.setOffline(true);
  await say(page, 'coolant low');
  await say(page, 'all good');
  await expectZone(page, 'Driver side tractor');
  await say(page, 'drive pressure ninety eight psi');
  await say(page, 'all good');
  await expectZone(page, 'Coupling');
  await say(page, 'all good');
  await expectZone(page, 'Driver side trailer');
  await expect(page.getByTestId('away-banner')).toContainText('No connection');
  await expect(page.getByTestId('sync-status')).toContainText('saved on this phone');
  const whileAway = await countSteps(inspectionId);

  await context.setOffline(false);
  await expect(page.getByTestId('sync-status')).toHaveText('✓ All saved', { timeout: 20_000 });
  for (const zone of [
    'Driver side trailer',
    'Rear',
    'Passenger side trailer',
    'Passenger side tractor',
    'In cab',
    'Air-brake tests',
  ]) {
    await expectZone(page, zone);
    if (zone === 'Air-brake tests') await readAirBrakeTests(page);
    await say(page, 'all good');
  }
  await say(page, 'finish');
  await signReport(page, 'Wren Castillo');
  await expect(page.getByTestId('signed-status')).toHaveText('✓ Report locked on RigCall’s server.', {
    timeout: 20_000,
  });

  const after = await countSteps(inspectionId);
  // 10 visits, 10 zone OKs, the coolant finding, the pressure reading and the six air-brake
  // readings: each exactly once.
  expect(after).toEqual({ total: 28, distinctSeq: 28, byKind: { visit: 10, zone_ok: 10, defect: 1, measurement: 7 } });
  expect(after.total).toBeGreaterThan(whileAway.total); // the offline part really waited on the phone
});

test('every control on the walk screen is at least 64 px high', async ({ page }) => {
  const rig = await makeTestRig();
  await page.setViewportSize({ width: 390, height: 844 });
  await signIn(page, 'dana.okafor@northbank.example');
  await startPreTrip(page, rig);
  for (const zone of ['Front', 'Air-brake tests']) {
    if (zone !== 'Front') {
      await page.getByRole('button', { name: '● Listen' }).click();
      for (let i = 0; i < 9; i++) await say(page, 'next');
      await expectZone(page, zone);
    }
    const small = await page.evaluate(() =>
      [...document.querySelectorAll<HTMLElement>('button, a[href], input, select, textarea, summary, [role=button]')]
        .filter((el) => !el.classList.contains('sr-only') && el.offsetParent !== null)
        .map((el) => ({
          what: `${el.tagName.toLowerCase()} “${(el.innerText || el.getAttribute('aria-label') || el.getAttribute('placeholder') || '').trim().slice(0, 40)}”`,
          h: el.getBoundingClientRect().height,
        }))
        .filter((x) => x.h < 64),
    );
    expect(small, `controls under 64 px in ${zone}`).toEqual([]);
  }
  await page.screenshot({ path: '.data/playwright-output/walk-phone.png', fullPage: true });
});
