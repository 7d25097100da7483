// Office screens at a phone (390×844) and a desk (1280×800) size: no page scrolls sideways, every
// nav marks its current tab (aria-current), and one report's times are in one zone on every screen.
import { expect, test, type Browser, type Page } from '@playwright/test';
import { demoPassword } from '../fixtures/demo';
import { openDb } from './office-data';

const people = {
  supervisor: 'marcus.lindqvist@northbank.example',
  mechanic: 'priya.raman@northbank.example',
  admin: 'tomasz.brandt@northbank.example',
  trainer: 'june.whitaker@northbank.example',
};

async function signedIn(browser: Browser, email: string, viewport: { width: number; height: number }): Promise<Page> {
  // The viewer sits in another zone than the fleet: their own clock must show beside the fleet's.
  const page = await (await browser.newContext({ viewport, timezoneId: 'America/New_York' })).newPage();
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(demoPassword);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
  return page;
}

async function sample() {
  const db = openDb();
  try {
    const fleet = await db
      .selectFrom('fleet')
      .select(['id', 'timezone'])
      .where('slug', '=', 'northbank')
      .executeTakeFirstOrThrow();
    const d = await db
      .selectFrom('defect')
      .select(['id', 'inspectionId'])
      .where('fleetId', '=', fleet.id)
      .orderBy('createdAt', 'desc')
      .executeTakeFirstOrThrow();
    return { timezone: fleet.timezone, defectId: d.id, reportId: d.inspectionId };
  } finally {
    await db.destroy();
  }
}

async function checkLayout(page: Page, path: string) {
  await page.goto(path);
  await page.waitForLoadState('networkidle');
  const { scrollWidth, innerWidth } = await page.evaluate(() => ({
    scrollWidth: document.documentElement.scrollWidth,
    innerWidth: window.innerWidth,
  }));
  expect(scrollWidth, `${path} at ${innerWidth} px is ${scrollWidth} px wide`).toBeLessThanOrEqual(innerWidth);
  let checked = 0;
  for (const nav of await page.getByRole('navigation').all()) {
    if (!(await nav.isVisible())) continue;
    const links = await nav.getByRole('link').count();
    if (links < 2) continue;
    const name = (await nav.getAttribute('aria-label')) ?? 'nav';
    await expect(nav.locator('[aria-current="page"]'), `${path}: nav "${name}" shows its current tab`).toHaveCount(1);
    checked += 1;
  }
  // Every office page carries its role's nav.
  expect(checked, `${path}: navs checked`).toBeGreaterThanOrEqual(1);
}

for (const viewport of [
  { width: 390, height: 844 },
  { width: 1280, height: 800 },
]) {
  test(`office pages at ${viewport.width}×${viewport.height}: no sideways scroll, current tab marked`, async ({
    browser,
  }) => {
    test.setTimeout(180_000);
    const s = await sample();
    const pages: [keyof typeof people, string[]][] = [
      ['supervisor', ['/supervisor', '/supervisor/reports', `/supervisor/reports/${s.reportId}`]],
      ['mechanic', ['/mechanic', '/mechanic?status=closed', `/mechanic/defects/${s.defectId}`]],
      ['admin', ['/admin', '/admin/settings', '/admin/units', '/admin/users', '/admin/mail']],
      ['trainer', ['/trainer']],
    ];
    for (const [role, paths] of pages) {
      const page = await signedIn(browser, people[role], viewport);
      for (const path of paths) await checkLayout(page, path);
      await page.context().close();
    }
  });
}

test("one report's times are in the fleet's zone on every screen, with the viewer's clock beside them", async ({
  browser,
}) => {
  test.setTimeout(90_000);
  const s = await sample();
  const screens: [string, string][] = [
    [people.supervisor, `/supervisor/reports/${s.reportId}`],
    [people.mechanic, `/mechanic/defects/${s.defectId}`],
    [people.mechanic, '/mechanic?status=all'],
  ];
  for (const [who, path] of screens) {
    const page = await signedIn(browser, who, { width: 1280, height: 800 });
    await page.goto(path);
    const times = page.locator('time');
    await expect(times.first()).toBeVisible();
    const zones = new Set(await times.evaluateAll((ts) => ts.map((t) => t.getAttribute('data-zone'))));
    expect([...zones], `${path}: zones of its times`).toEqual([s.timezone]);
    // Chicago and New York read differently: the viewer's own clock is named beside the fleet's.
    await expect(times.first()).toContainText('your time');
    await page.context().close();
  }
});

test("mechanic's defect: a work order of the unit's open defects, 44 px confirmation targets, no link outside the role", async ({
  browser,
}) => {
  test.setTimeout(60_000);
  const db = openDb();
  let defectId: string;
  try {
    const row = await db
      .selectFrom('defect as a')
      .innerJoin('defect as b', (j) => j.onRef('b.unitId', '=', 'a.unitId').onRef('b.id', '!=', 'a.id'))
      .innerJoin('fleet as f', 'f.id', 'a.fleetId')
      .select('a.id')
      .where('f.slug', '=', 'northbank')
      .where('a.status', '=', 'open')
      .where('b.status', '=', 'open')
      .executeTakeFirstOrThrow();
    defectId = row.id;
  } finally {
    await db.destroy();
  }
  const page = await signedIn(browser, people.mechanic, { width: 390, height: 844 });
  await page.goto(`/mechanic/defects/${defectId}`);
  const order = page.getByTestId('work-order');
  await expect(order).toBeVisible();
  const form = page.getByRole('form', { name: 'Repair and certification' });
  for (const box of await form.locator('label:has(input[type="checkbox"]), label:has(input[type="radio"])').all()) {
    const h = (await box.boundingBox())?.height ?? 0;
    expect(h, `${await box.innerText()}: target height`).toBeGreaterThanOrEqual(44);
  }
  await expect(page.locator('a[href^="/supervisor/"]')).toHaveCount(0);
  await page.context().close();
});
