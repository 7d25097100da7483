import { expect, test, type Page } from '@playwright/test';
import { demoPassword, demoPerson } from '../fixtures/demo';

const homes = [
  { role: 'driver', path: '/driver', heading: "Today's walk-around" },
  { role: 'mechanic', path: '/mechanic', heading: 'Open defects' },
  { role: 'supervisor', path: '/supervisor', heading: 'Fleet at a glance' },
  { role: 'trainer', path: '/trainer', heading: 'Defect vocabulary' },
  { role: 'admin', path: '/admin', heading: 'Fleet administration' },
] as const;

async function signIn(page: Page, email: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(demoPassword);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

for (const h of homes) {
  test(`${h.role === 'admin' ? 'an' : 'a'} ${h.role} lands on the ${h.role} home`, async ({ page }) => {
    const person = demoPerson(h.role);
    await signIn(page, person.email);
    await expect(page).toHaveURL(new RegExp(`${h.path}$`));
    await expect(page.getByRole('heading', { level: 1 })).toContainText(h.heading);
    await expect(page.getByTestId('signed-in-as')).toContainText(person.name);
  });
}

test('a driver cannot open the supervisor screens', async ({ page }) => {
  await signIn(page, demoPerson('driver').email);
  await expect(page).toHaveURL(/\/driver$/);
  await page.goto('/supervisor');
  await expect(page).toHaveURL(/\/not-allowed$/);
  await expect(page.getByRole('heading', { level: 1 })).toContainText('not part of your role');
});

test('a user with two roles switches views', async ({ page }) => {
  await signIn(page, 'ola.mensah@northbank.example');
  await expect(page).toHaveURL(/\/driver$/);
  await page.getByRole('link', { name: 'Supervisor view' }).click();
  await expect(page).toHaveURL(/\/supervisor$/);
  await expect(page.getByRole('heading', { level: 1 })).toContainText('Fleet at a glance');
});

test('signing out ends the session', async ({ page }) => {
  await signIn(page, demoPerson('mechanic').email);
  await expect(page).toHaveURL(/\/mechanic$/);
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page).toHaveURL(/\/sign-in\?signedOut=1/);
  await expect(page.getByRole('status')).toContainText('signed out');
  const me = await page.request.get('/api/me');
  expect(me.status()).toBe(401);
  await page.goto('/mechanic');
  await expect(page).toHaveURL(/\/sign-in/);
});
