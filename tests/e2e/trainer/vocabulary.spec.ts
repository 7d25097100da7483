import { randomBytes } from 'node:crypto';
import { expect, test, type Page } from '@playwright/test';
import { demoPassword } from '../fixtures/demo';
import { fakeSpeechScript } from '../fixtures/fake-speech';
import { db, expectZone, makeTestRig, say, signIn, startPreTrip } from '../fixtures/walk-helpers';

test.describe.configure({ mode: 'serial' });
test.setTimeout(180_000);

const shots = process.env.SCREENSHOT_DIR;
async function shot(page: Page, name: string) {
  if (shots) await page.screenshot({ path: `${shots}/${name}.png`, fullPage: true });
}

async function signInTrainer(page: Page) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('june.whitaker@northbank.example');
  await page.getByLabel('Password').fill(demoPassword);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/trainer$/);
}

test('a trainer turns a field utterance into a synonym, evaluates, publishes; the next walk matches it', async ({
  page,
  browser,
}) => {
  // A word no vocabulary knows, so that the utterance is new on every run.
  const word = `xq${[...randomBytes(4)].map((b) => 'bcdfghjklmnprstvwz'[b % 18]).join('')}`;
  const heard = `mud flap doing the ${word}`;
  const fleet = await db.selectFrom('fleet').select('id').where('slug', '=', 'northbank').executeTakeFirstOrThrow();
  // As the walk writes it when a voice step matches nothing.
  await db
    .insertInto('fieldUtterance')
    .values(
      [heard, `the mud flaps doing the ${word}`].map((text) => ({
        fleetId: fleet.id,
        zone: 'driver_side_tractor',
        text,
        normalized: text,
        outcome: 'unmatched' as const,
      })),
    )
    .execute();

  await signInTrainer(page);
  await page.setViewportSize({ width: 1280, height: 800 });
  await expect(page.getByTestId('version-row').first()).toBeVisible();
  const editDraft = page.getByRole('link', { name: 'Edit the draft' });
  const openDraft = page.getByRole('button', { name: 'Open a draft' });
  await expect(editDraft.or(openDraft)).toBeVisible();
  if (await openDraft.isVisible()) await openDraft.click();
  await expect(editDraft).toBeVisible();
  await shot(page, 'trainer-versions');

  // Inbox: the two similar lines are one group; one click adds the phrase to the draft.
  await page.getByRole('link', { name: 'Field utterances' }).click();
  await page.waitForURL(/\/trainer\/inbox$/);
  const group = page.getByTestId('inbox-group').filter({ hasText: heard });
  await expect(group).toContainText('×2');
  await group.getByLabel(/Term for/).fill('mud flap, loose');
  await shot(page, 'trainer-inbox');
  await group.getByRole('button', { name: 'Add as phrase of mud flap, loose' }).click();
  await expect(page.getByTestId('phrase-added')).toContainText('The draft now reads it as mud flap, loose', {
    timeout: 15_000,
  });
  await expect(page.getByTestId('inbox-group').filter({ hasText: heard })).toHaveCount(0);

  // Test bench: the draft reads it, the published version does not.
  await page.getByRole('link', { name: 'Test bench' }).click();
  await page.getByLabel('Utterance, as a driver would say it').fill(heard);
  await page.getByLabel('Zone').selectOption('driver_side_tractor');
  await page.getByRole('button', { name: 'Try it' }).click();
  await expect(page.getByTestId('bench-draft').getByTestId('bench-reading')).toHaveText('mud flap, loose');
  await expect(page.getByTestId('bench-published').getByTestId('bench-reading')).toHaveText('✕ nothing matched');
  await shot(page, 'trainer-bench');

  // The editor shows the new phrase on the condition.
  await page.getByRole('link', { name: 'Vocabulary editor' }).click();
  await page.getByLabel('Find a component').fill('mud flap');
  await page.getByRole('button', { name: /^mud flap \d+ ph/ }).click();
  await shot(page, 'trainer-editor');
  await page.getByRole('button', { name: 'loose', exact: true }).click();
  await expect(page.getByRole('list', { name: 'loose' })).toContainText(word);
  await page.getByRole('tab', { name: 'Zone checklists' }).click();
  await shot(page, 'trainer-editor-zones');

  // Evaluation, then publish.
  await page.getByRole('link', { name: 'Evaluate & publish' }).click();
  await page.getByRole('button', { name: 'Run the evaluation' }).click();
  await expect(page.getByTestId('evaluation-draft')).toContainText('top-1', { timeout: 30_000 }); // two versions over the whole labelled set
  await expect(page.getByTestId('evaluation-difference')).toContainText('±0 top-1');
  await shot(page, 'trainer-evaluation');
  await page.getByRole('button', { name: 'Publish the draft' }).click();
  await expect(page.getByTestId('published-notice')).toContainText('Published', { timeout: 30_000 });
  const published = await db
    .selectFrom('vocabularyVersion')
    .select(['id', 'label'])
    .where('fleetId', '=', fleet.id)
    .where('status', '=', 'published')
    .orderBy('publishedAt', 'desc')
    .executeTakeFirstOrThrow();
  expect(
    await db
      .selectFrom('vocabularyVersion')
      .select('id')
      .where('fleetId', '=', fleet.id)
      .where('status', '=', 'draft')
      .execute(),
  ).toEqual([]);

  // The phone width still reads.
  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto('/trainer/bench');
  await page.getByLabel('Utterance, as a driver would say it').fill(heard);
  await page.getByRole('button', { name: 'Try it' }).click();
  await expect(page.getByTestId('bench-published').getByTestId('bench-reading')).toHaveText('mud flap, loose');
  await shot(page, 'trainer-bench-phone');

  // A driver's next walk matches what was said.
  const driverContext = await browser.newContext();
  await driverContext.addInitScript(fakeSpeechScript);
  const driver = await driverContext.newPage();
  const rig = await makeTestRig();
  await signIn(driver, 'dana.okafor@northbank.example');
  const inspectionId = await startPreTrip(driver, rig);
  expect(
    (
      await db
        .selectFrom('inspection')
        .select('vocabularyVersionId')
        .where('id', '=', inspectionId)
        .executeTakeFirstOrThrow()
    ).vocabularyVersionId,
  ).toBe(published.id);
  await driver.getByRole('button', { name: '● Listen' }).click();
  await say(driver, 'next');
  await expectZone(driver, 'Engine bay');
  await say(driver, 'next');
  await expectZone(driver, 'Driver side tractor');
  await say(driver, heard);
  await expect(driver.getByTestId('readback')).toContainText('Mud flap, loose');
  await expect
    .poll(async () =>
      (
        await db
          .selectFrom('inspectionStep')
          .select(['termKey', 'heard'])
          .where('inspectionId', '=', inspectionId)
          .where('kind', '=', 'defect')
          .execute()
      ).map((s) => s.termKey),
    )
    .toEqual(['mud_flap:loose']);
  await driverContext.close();
});
