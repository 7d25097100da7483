// The office side end to end: the supervisor finds the seeded report with a major defect, reads
// its transcript, marks it reviewed and mails the shop; the mechanic certifies the repair; the
// unit is back in service; the catcher has both mails; the next driver must now acknowledge.
import { expect, test, type Browser, type Page } from '@playwright/test';
import { demoPassword, demoPerson } from '../fixtures/demo';
import { findTarget, openDb, type Target } from './office-data';

const catcher = process.env.MAIL_CATCHER_URL ?? 'http://127.0.0.1:1081';
const shop = 'shop@northbank.example';

async function signedIn(browser: Browser, email: string): Promise<Page> {
  const page = await (await browser.newContext()).newPage();
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(demoPassword);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
  return page;
}

const caught = async (page: Page, to: string) =>
  (
    (await (await page.request.get(`${catcher}/messages?to=${encodeURIComponent(to)}`)).json()) as {
      messages: { subject: string; receivedAt: string }[];
    }
  ).messages;

test('supervisor reviews, mechanic certifies, unit back in service, mails caught, next driver asked to acknowledge', async ({
  browser,
}) => {
  test.setTimeout(120_000);
  const db = openDb();
  let target: Target;
  try {
    target = await findTarget(db);
  } finally {
    await db.destroy();
  }
  const startedAt = new Date(Date.now() - 1000).toISOString();

  // Supervisor: find the report through the table's filters.
  const sup = await signedIn(browser, 'marcus.lindqvist@northbank.example');
  await sup.goto('/supervisor/reports');
  const filters = sup.getByRole('form', { name: 'Filters' });
  await expect(filters).toHaveAttribute('data-live', 'yes');
  await filters.getByLabel('Defects').selectOption('yes');
  await expect(sup).toHaveURL(/hasDefects=yes/);
  await filters.getByLabel('Unit').selectOption(target.unitId);
  await expect(sup).toHaveURL(new RegExp(`unitId=${target.unitId}`));
  const link = sup.locator(`a[href="/supervisor/reports/${target.reportId}"]`);
  await expect(link).toBeVisible();
  await expect(sup.getByTestId('report-row').filter({ has: link })).toContainText('MAJOR');
  await link.click();

  // The transcript: what was heard, what it matched.
  await expect(sup.getByRole('heading', { name: 'Transcript of findings' })).toBeVisible();
  await expect(sup.getByTestId('hash-match')).toBeVisible();
  // The step that raised the major defect: a spoken finding or a reading over its limit.
  const finding = target.heard
    ? sup.getByRole('row').filter({ hasText: target.heard }).first()
    : sup.getByTestId('step-defect').first();
  await expect(finding).toContainText('MAJOR');
  await expect(sup.getByTestId('transcript-zone').first()).toContainText('in zone');

  await sup.getByLabel('Review note').fill('Major defect; shop notified, follow the repair.');
  // A report reviewed on an earlier run offers to update the review instead.
  await sup.getByRole('button', { name: /^(Mark reviewed|Update review)$/ }).click();
  await expect(sup.getByTestId('review-state')).toContainText('Reviewed by Marcus Lindqvist');
  // The printable report comes from the built app (pdfkit loaded at run time).
  const pdf = await sup.request.get(`/api/reports/${target.reportId}/pdf`);
  expect(pdf.status()).toBe(200);
  expect(pdf.headers()['content-type']).toBe('application/pdf');
  expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');
  await sup.getByRole('button', { name: 'Mail the shop about open defects' }).click();
  await expect(sup.getByRole('status').filter({ hasText: 'Out-of-service notice' })).toContainText(
    `unit ${target.unitNumber} sent`,
  );

  // Mechanic: every open major defect of the unit, then the report's minor ones on it, from the queue.
  const mech = await signedIn(browser, demoPerson('mechanic').email);
  for (const defectId of [...target.openMajorIds, ...target.openMinorIds]) {
    const major = target.openMajorIds.includes(defectId);
    await mech.goto('/mechanic');
    const row = mech.getByTestId(`queue-unit-${target.unitNumber}`).locator(`a[href="/mechanic/defects/${defectId}"]`);
    await expect(row).toContainText(major ? 'MAJOR' : 'Minor');
    await row.click();
    await expect(mech.getByRole('complementary', { name: 'Before you work on the unit' })).toContainText(
      'air suspension',
    );
    const sign = mech.getByRole('button', { name: 'Sign the certification' });
    await expect(sign).toBeEnabled();
    if (major) {
      await mech.getByLabel('Work done').fill('Replaced the failed part and tested it.');
      await mech.getByLabel('Parts').fill('OEM replacement from the shop shelf');
      await mech.getByRole('radio', { name: 'Repaired' }).check();
    } else {
      await mech.getByRole('radio', { name: 'No repair needed' }).check();
      await mech.getByLabel('Notes').fill('Checked: within limits, safe to operate.');
    }
    await expect(mech.getByLabel('Your full name (signature)')).toHaveValue('Priya Raman');
    await mech.getByRole('checkbox', { name: /The time of signing is recorded/ }).check();
    await sign.click();
    await expect(mech.getByTestId('certify-result')).toContainText('Certified.');
  }
  await expect(mech.getByTestId('certify-result')).toContainText(`Unit ${target.unitNumber} is in service`);

  // The unit shows in service on the supervisor's board.
  await sup.goto('/supervisor');
  await expect(sup.getByTestId(`unit-row-${target.unitNumber}`).getByTestId('unit-status')).toHaveText(/In service/);

  // Both mails reached the catcher.
  await expect
    .poll(async () => (await caught(sup, shop)).filter((m) => m.receivedAt >= startedAt).map((m) => m.subject))
    .toEqual(
      expect.arrayContaining([
        `OUT OF SERVICE: unit ${target.unitNumber} (Northbank Freight Co.)`,
        `Back in service: unit ${target.unitNumber} (Northbank Freight Co.)`,
      ]),
    );

  // The next driver must acknowledge the report, and now may operate: every defect is certified.
  const driver = await signedIn(browser, demoPerson('driver').email);
  const res = await driver.request.get(`/api/reports/acknowledgements?units=${target.unitId}`);
  expect(res.status()).toBe(200);
  const { pending } = (await res.json()) as {
    pending: {
      report: { id: string };
      due: { signatureRequired: boolean; mayOperate: boolean };
      defects: { status: string; certifiedName: string | null }[];
    }[];
  };
  const due = pending.find((p) => p.report.id === target.reportId);
  expect(due?.due).toMatchObject({ signatureRequired: true, mayOperate: true });
  expect(due?.defects.filter((d) => d.status === 'repaired').map((d) => d.certifiedName)).toContain('Priya Raman');
});
