// Issue 16, defects 1 and 6 in Chromium: an admin invites a person, the invitation is caught,
// the first sign-in with the temporary password is held on the change-password page, changing it
// ends the person's other sessions, and the temporary password is refused from then on.
import { randomUUID } from 'node:crypto';
import { expect, test, type Browser, type Page } from '@playwright/test';
import { demoPassword, demoPerson } from '../fixtures/demo';

async function signIn(page: Page, email: string, password: string, { expectRefusal = false } = {}) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  if (!expectRefusal) await page.waitForURL((url) => url.pathname !== '/sign-in');
}

/** A driver of the demo fleet of its own, so that ending its sessions touches no other test. */
async function makeOwnDriver(): Promise<{ email: string; password: string }> {
  const { createDb } = await import('../../../db/connect');
  const { makeUser } = await import('../../../db/factories');
  const db = createDb(process.env.DATABASE_URL ?? '', 1);
  try {
    const fleet = await db.selectFrom('fleet').select('id').where('slug', '=', 'northbank').executeTakeFirstOrThrow();
    const email = `own-${randomUUID().slice(0, 8)}@northbank.example`;
    await makeUser(db, { fleetId: fleet.id, roles: ['driver'], email, name: 'Own Driver', password: demoPassword });
    return { email, password: demoPassword };
  } finally {
    await db.destroy();
  }
}
const newPage = async (browser: Browser) => (await browser.newContext()).newPage();

test('invite, mail caught, first sign-in forced to change, old password refused, other sessions ended', async ({
  browser,
  page,
  request,
}) => {
  const email = `temp-${randomUUID().slice(0, 8)}@northbank.example`;
  const admin = demoPerson('admin');
  await signIn(page, admin.email, demoPassword);
  await page.goto('/admin/users');
  const form = page.getByRole('region', { name: 'Invite someone' });
  await expect(form.getByRole('button', { name: 'Send invitation' })).toBeEnabled();
  await form.getByLabel('Full name').fill('Noor Vasquez');
  await form.getByLabel('E-mail').fill(email);
  await form.getByRole('button', { name: 'Send invitation' }).click();
  await expect(form.getByRole('status')).toHaveText(/Invitation sent to/);

  // The invitation reached the catcher, and the admin's caught-mail page lists it.
  const catcher = process.env.MAIL_CATCHER_URL!;
  let temporary = '';
  await expect
    .poll(async () => {
      const { messages } = (await (
        await request.get(`${catcher}/messages?to=${encodeURIComponent(email)}`)
      ).json()) as {
        messages: { id: string }[];
      };
      if (!messages[0]) return '';
      const full = (await (await request.get(`${catcher}/messages/${messages[0].id}`)).json()) as { text: string };
      temporary = /Temporary password:\s+(\S+)/.exec(full.text)?.[1] ?? '';
      return temporary;
    })
    .toMatch(/^[a-z2-9]{4}-[a-z2-9]{4}-[a-z2-9]{4}$/);
  await page.goto(`/admin/mail?to=${encodeURIComponent(email)}`);
  await expect(page.getByTestId('caught-mail')).toHaveCount(1);

  // First sign-in, on a phone: held on the change-password page, whatever it asks for.
  const phone = await newPage(browser);
  await signIn(phone, email, temporary);
  await expect(phone).toHaveURL(/\/change-password$/);
  await expect(phone.getByRole('status')).toContainText('temporary password');
  await phone.goto('/driver');
  await expect(phone).toHaveURL(/\/change-password$/);
  const blocked = await phone.request.get('/api/units');
  expect(blocked.status()).toBe(403);

  // A second session, on a tablet, with the same temporary password.
  const tablet = await newPage(browser);
  await signIn(tablet, email, temporary);
  await expect(tablet).toHaveURL(/\/change-password$/);

  // A password that is too common is refused beside the field; then a good one is saved.
  const chosen = 'gravel lot under sodium lights';
  await phone.getByLabel('Current password').fill(temporary);
  await phone.getByLabel('New password', { exact: true }).fill('password1234');
  await phone.getByLabel('New password again').fill('password1234');
  await phone.getByRole('button', { name: 'Save the new password' }).click();
  await expect(phone.getByText(/most common passwords/)).toBeVisible();
  await phone.getByLabel('New password', { exact: true }).fill(chosen);
  await phone.getByLabel('New password again').fill(chosen);
  await phone.getByRole('button', { name: 'Save the new password' }).click();
  await expect(phone).toHaveURL(/\/driver$/);
  await expect(phone.getByTestId('signed-in-as')).toContainText('Noor Vasquez');

  // The tablet's session ended with the change.
  await tablet.goto('/driver');
  await expect(tablet).toHaveURL(/\/sign-in/);

  // The temporary password is refused; the chosen one signs in.
  const later = await newPage(browser);
  await signIn(later, email, temporary, { expectRefusal: true });
  await expect(later.getByRole('alert').filter({ hasText: 'do not match an active account' })).toBeVisible();
  await signIn(later, email, chosen);
  await expect(later).toHaveURL(/\/driver$/);
});

test('signing out ends the session: the old cookie no longer opens anything', async ({ page, context }) => {
  const driver = await makeOwnDriver();
  await signIn(page, driver.email, driver.password);
  await expect(page).toHaveURL(/\/driver$/);
  const cookie = (await context.cookies()).find((c) => c.name === 'next-auth.session-token');
  expect(cookie).toBeTruthy();
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page).toHaveURL(/\/sign-in/);
  // Someone kept a copy of the cookie.
  await context.addCookies([cookie!]);
  const res = await page.request.get('/api/me');
  expect(res.status()).toBe(401);
});

test('after sign-in, next=/\\host and next=/%09/host stay on our site', async ({ page }) => {
  const driver = await makeOwnDriver();
  for (const next of ['/\\evil.example', '/%09/evil.example']) {
    await page.context().clearCookies();
    await page.goto(`/sign-in?next=${next}`);
    await page.getByLabel('E-mail').fill(driver.email);
    await page.getByLabel('Password').fill(driver.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page).toHaveURL(/^http:\/\/127\.0\.0\.1:\d+\/driver$/);
  }
});
