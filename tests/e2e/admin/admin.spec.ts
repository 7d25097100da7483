import { randomUUID } from 'node:crypto';
import { expect, test, type Page } from '@playwright/test';
import { computeVinCheckDigit } from '../../../lib/schemas/units';
import demo from '../../../db/seeds/demo-people.json' with { type: 'json' };
import { demoPassword } from '../fixtures/demo';

const admin = demo.people.find((p) => p.roles.length === 1 && p.roles[0] === 'admin')!;

async function signInAsAdmin(page: Page, next: string) {
  await page.goto(next);
  await page.getByLabel('E-mail').fill(admin.email);
  await page.getByLabel('Password').fill(demoPassword);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(new RegExp(`${next}$`));
}

function vinFrom(seed: string): string {
  const c = seed.replace(/[^A-HJ-NPR-Z0-9]/g, '').padEnd(16, '7');
  const draft = `${c.slice(0, 8)}0${c.slice(8, 16)}`;
  return `${draft.slice(0, 8)}${computeVinCheckDigit(draft)}${draft.slice(9)}`;
}

test('an admin invites a person, and the invitation reaches the mail catcher', async ({ page, request }) => {
  const email = `e2e-${randomUUID().slice(0, 8)}@northbank.example`;
  await signInAsAdmin(page, '/admin/users');
  await expect(page.getByRole('heading', { name: 'People' })).toBeVisible();

  const form = page.getByRole('region', { name: 'Invite someone' });
  // The submit button turns on once the page is live; typing before that would be lost.
  await expect(form.getByRole('button', { name: 'Send invitation' })).toBeEnabled();
  await form.getByRole('button', { name: 'Send invitation' }).click();
  await expect(form.getByText("Enter the person's name.")).toBeVisible();

  await form.getByLabel('Full name').fill('Hollis Ngata');
  await form.getByLabel('E-mail').fill(email);
  await form.getByRole('checkbox', { name: /Mechanic/ }).check();
  await form.getByRole('button', { name: 'Send invitation' }).click();
  await expect(form.getByRole('status')).toHaveText(/Invitation sent to/);
  await expect(page.getByRole('region', { name: 'Everyone in the fleet' }).getByText(email)).toBeVisible();

  const catcher = process.env.MAIL_CATCHER_URL;
  expect(catcher, 'MAIL_CATCHER_URL is set by scripts/stack.mjs').toBeTruthy();
  await expect
    .poll(
      async () =>
        (
          (await (await request.get(`${catcher}/messages?to=${encodeURIComponent(email)}`)).json()) as {
            messages: unknown[];
          }
        ).messages.length,
    )
    .toBe(1);

  // The same address a second time is refused beside the field.
  await form.getByLabel('Full name').fill('Hollis Again');
  await form.getByLabel('E-mail').fill(email);
  await form.getByRole('button', { name: 'Send invitation' }).click();
  await expect(form.getByText(`${email} already has an account.`).first()).toBeVisible();
});

test('an admin adds a trailer with its axles, after fixing a mistyped VIN', async ({ page }) => {
  const unitNumber = `E2E-${randomUUID().slice(0, 6).toUpperCase()}`;
  const vin = vinFrom(randomUUID().toUpperCase());
  await signInAsAdmin(page, '/admin/units');
  await page.getByRole('link', { name: '+ Add a unit' }).click();
  await expect(page.getByRole('heading', { name: 'Add a unit' })).toBeVisible();
  await expect(page.getByRole('button', { name: 'Add this unit' })).toBeEnabled();

  // The radio is drawn by its label; a click on the label picks it.
  await page.getByRole('radio', { name: 'Trailer' }).check({ force: true });
  await expect(page.getByRole('radio', { name: 'Trailer' })).toBeChecked();
  await page.getByLabel('Unit number').fill(unitNumber);
  await page.getByLabel('Make').fill('Plainsman');
  await page.getByLabel('Model', { exact: true }).fill('53 ft dry van');
  await page.getByLabel('Model year').fill('2023');
  await page.getByLabel('Plate').fill('TRL 4400');
  await page.getByLabel('Issued by').selectOption('IA');
  await page.getByLabel('VIN').fill(`${vin.slice(0, 5)}O${vin.slice(6)}`);
  await page.getByLabel('Cold target, psi').first().fill('105');
  await page.getByRole('button', { name: 'Add this unit' }).click();
  await expect(page.getByText(/never uses the letters I, O or Q/)).toBeVisible();

  await page.getByLabel('VIN').fill(vin);
  await page.getByRole('button', { name: 'Add this unit' }).click();
  await expect(page).toHaveURL(/\/admin\/units\?added=/);
  await expect(page.getByRole('status')).toContainText(`Unit ${unitNumber} added.`);
  const row = page.getByRole('row', { name: new RegExp(unitNumber) });
  await expect(row).toContainText(vin);
  await expect(row).toContainText('2 axles · 8 tires');
  await expect(row).toContainText('In service');
});

test('an admin changes the minimum pre-trip minutes', async ({ page }) => {
  await signInAsAdmin(page, '/admin/settings');
  await expect(page.getByRole('button', { name: 'Save settings' })).toBeEnabled();
  const field = page.getByLabel('Pre-trip');
  const original = await field.inputValue();
  const next = original === '20' ? '25' : '20';
  try {
    await field.fill('300');
    await page.getByRole('button', { name: 'Save settings' }).click();
    await expect(page.getByText('Keep the minimum pre-trip time at 240 minutes (4 hours) or less.')).toBeVisible();

    await field.fill(next);
    await page.getByRole('button', { name: 'Save settings' }).click();
    await expect(page.getByRole('status')).toHaveText(/Settings saved/);
    await page.reload();
    await expect(page.getByRole('button', { name: 'Save settings' })).toBeEnabled();
    await expect(page.getByLabel('Pre-trip')).toHaveValue(next);
    await page.goto('/admin');
    await expect(page.getByText(`${next} min`)).toBeVisible();
  } finally {
    // Leave the seeded fleet as other tests expect it.
    const res = await page.request.patch('/api/admin/fleet', { data: { minPretripMinutes: Number(original) } });
    expect(res.status()).toBe(200);
  }
});
