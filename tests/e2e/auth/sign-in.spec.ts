import { expect, test } from '@playwright/test';
import { demoPassword, demoPerson } from '../fixtures/demo';

test('a driver signs in through our page and lands on the driver home', async ({ page }) => {
  const dana = demoPerson('driver');
  await page.goto('/driver');
  await expect(page).toHaveURL(/\/sign-in\?next=%2Fdriver/);
  await page.getByLabel('E-mail').fill(dana.email);
  await page.getByLabel('Password').fill(demoPassword);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/driver$/);
  await expect(page.getByTestId('signed-in-as')).toContainText(dana.name);
  await expect(page.getByRole('heading', { name: "Today's walk-around" })).toBeVisible();
});

test('a wrong password gives a clear message and no session', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(demoPerson('driver').email);
  await page.getByLabel('Password').fill('not-the-password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('alert').filter({ hasText: 'do not match an active account' })).toBeVisible();
  await page.goto('/driver');
  await expect(page).toHaveURL(/\/sign-in/);
});

test('the health route reports every service ok', async ({ request }) => {
  const res = await request.get('/api/health');
  expect(res.status()).toBe(200);
  expect(await res.json()).toMatchObject({ ok: true, services: { database: 'ok', mail: 'ok', storage: 'ok' } });
});
