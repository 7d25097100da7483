// Accessibility scan: every page of every role, at a phone and a desk size, in the day and the
// night theme, through axe-core. A serious or critical violation fails the test, naming the rule,
// the elements (CSS selectors), the page, the size and the theme. WCAG 2.2 levels A and AA
// (https://www.w3.org/TR/WCAG22/) plus axe's best-practice rules, as axe-core ships them.
import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Browser, type Page } from '@playwright/test';
import { createDb, databaseUrlFromEnv, type DB } from '../../../db/connect';
import { makeInspection, makeUnit, makeUser } from '../../../db/factories';
import { demoPassword, demoPerson } from '../fixtures/demo';

test.describe.configure({ mode: 'parallel' });

const sizes = [
  { name: 'phone', width: 390, height: 844 },
  { name: 'desk', width: 1280, height: 800 },
] as const;
const themes = ['day', 'night'] as const;

/** A state reached on the loaded page by a user's action that writes nothing (scanned after the page). */
type State = { name: string; reach: (page: Page) => Promise<void> };
type Target = { path: string; status?: number; states?: State[] };
/** Who signs in (null: nobody) and the pages to scan, found or made in the database. */
type Group = { name: string; prepare: (db: DB) => Promise<{ email: string | null; pages: Target[] }> };

const missingId = '00000000-0000-4000-8000-000000000000';

async function demoFleetId(db: DB) {
  return (await db.selectFrom('fleet').select('id').where('slug', '=', 'northbank').executeTakeFirstOrThrow()).id;
}

/** A driver of the demo fleet kept for this scan, with a walk in progress on units of its own. */
async function walkInProgress(db: DB) {
  const fleetId = await demoFleetId(db);
  const driver = await makeUser(db, {
    fleetId,
    roles: ['driver'],
    email: 'a11y.scan.driver@northbank.example',
    name: 'Avery Scan',
    password: demoPassword,
  });
  const axles = (tires: string[], position: string) =>
    JSON.stringify([{ position, tires, coldPsi: 100, chamber: '30' }]);
  const tractor = await makeUnit(db, {
    fleetId,
    kind: 'tractor',
    unitNumber: 'A11Y-T',
    make: 'Kestrel',
    model: 'scan tractor',
    year: 2022,
    axles: axles(['LF', 'RF'], 'steer'),
  });
  const trailer = await makeUnit(db, {
    fleetId,
    kind: 'trailer',
    unitNumber: 'A11Y-TR',
    make: 'Plainsman',
    model: 'scan trailer',
    year: 2021,
    axles: axles(['LO', 'LI', 'RI', 'RO'], 'trailer'),
  });
  const open = await db
    .selectFrom('inspection')
    .select('id')
    .where('driverId', '=', driver.id)
    .where('status', '=', 'draft')
    .executeTakeFirst();
  const walk =
    open ?? (await makeInspection(db, { fleetId, driverId: driver.id, tractorId: tractor.id, trailerId: trailer.id }));
  return { email: driver.email, walkId: walk.id };
}

/** The latest signed report of the demo fleet that raised a defect (the richest report page). */
async function reportWithDefect(db: DB) {
  const fleetId = await demoFleetId(db);
  const row = await db
    .selectFrom('inspection as i')
    .innerJoin('unit as u', 'u.id', 'i.tractorId')
    .select(['i.id', 'u.unitNumber'])
    .where('i.fleetId', '=', fleetId)
    .where('i.status', '=', 'submitted')
    .where((eb) => eb.exists(eb.selectFrom('defect as d').select('d.id').whereRef('d.inspectionId', '=', 'i.id')))
    .orderBy('i.finishedAt', 'desc')
    .limit(1)
    .executeTakeFirstOrThrow();
  return { reportId: row.id, tractorNumber: row.unitNumber };
}

/** One open and one certified defect when the fleet has them (their pages differ). */
async function defects(db: DB) {
  const fleetId = await demoFleetId(db);
  const pick = (open: boolean) =>
    db
      .selectFrom('defect')
      .select('id')
      .where('fleetId', '=', fleetId)
      .where('status', open ? '=' : '<>', 'open')
      .orderBy('createdAt', 'desc')
      .limit(1)
      .executeTakeFirst();
  const ids = [(await pick(true))?.id, (await pick(false))?.id].filter((x): x is string => !!x);
  expect(ids.length, 'the demo fleet has defects').toBeGreaterThan(0);
  return ids;
}

async function aUnit(db: DB) {
  const fleetId = await demoFleetId(db);
  return (
    await db
      .selectFrom('unit')
      .select('id')
      .where('fleetId', '=', fleetId)
      .where('kind', '=', 'tractor')
      .orderBy('unitNumber')
      .limit(1)
      .executeTakeFirstOrThrow()
  ).id;
}

const groups: Group[] = [
  {
    name: 'signed out',
    prepare: () =>
      Promise.resolve({
        email: null,
        pages: [
          { path: '/' },
          { path: '/sign-in' },
          { path: '/sign-in?signedOut=1' },
          { path: '/not-allowed' },
          { path: '/no-such-page', status: 404 },
        ],
      }),
  },
  {
    name: 'driver',
    prepare: async (db) => {
      const { tractorNumber } = await reportWithDefect(db);
      return {
        email: demoPerson('driver').email,
        pages: [
          { path: '/driver' },
          {
            path: '/driver/start',
            states: [
              {
                // A tractor whose last report raised a defect: its review (and signature) is asked for.
                name: 'last report to review',
                reach: async (page) => {
                  await page
                    .getByRole('group', { name: 'Tractor' })
                    .getByRole('button', { name: new RegExp(`^${tractorNumber}\\b`) })
                    .click();
                  await page.getByRole('button', { name: 'Continue' }).click();
                  await expect(
                    page.getByRole('button', { name: /^Start the walk|I reviewed it/ }).first(),
                  ).toBeVisible();
                },
              },
            ],
          },
          { path: '/driver/start?kind=post_trip' },
        ],
      };
    },
  },
  {
    name: 'driver on a walk',
    prepare: async (db) => {
      const { email, walkId } = await walkInProgress(db);
      return {
        email,
        pages: [
          {
            path: `/driver/inspections/${walkId}/walk`,
            states: [
              {
                name: 'review and sign',
                reach: async (page) => {
                  await page.getByRole('button', { name: 'Review & sign' }).click();
                  await expect(page.getByRole('heading', { level: 1, name: 'Review and sign' })).toBeVisible();
                },
              },
            ],
          },
        ],
      };
    },
  },
  {
    name: 'mechanic',
    prepare: async (db) => ({
      email: demoPerson('mechanic').email,
      pages: [{ path: '/mechanic' }, ...(await defects(db)).map((id) => ({ path: `/mechanic/defects/${id}` }))],
    }),
  },
  {
    name: 'supervisor',
    prepare: async (db) => ({
      email: demoPerson('supervisor').email,
      pages: [
        { path: '/supervisor' },
        { path: '/supervisor/dashboard' },
        { path: '/supervisor/reports' },
        { path: `/supervisor/reports/${(await reportWithDefect(db)).reportId}` },
        { path: `/supervisor/reports/${missingId}`, status: 404 },
      ],
    }),
  },
  {
    name: 'trainer',
    prepare: () =>
      Promise.resolve({
        email: demoPerson('trainer').email,
        pages: [
          { path: '/trainer' },
          { path: '/trainer/editor' },
          { path: '/trainer/inbox' },
          { path: '/trainer/bench' },
          { path: '/trainer/evaluation' },
        ],
      }),
  },
  {
    name: 'admin',
    prepare: async (db) => ({
      email: demoPerson('admin').email,
      pages: [
        { path: '/admin' },
        {
          path: '/admin/users',
          states: [
            {
              name: 'invitation refused beside its fields',
              reach: async (page) => {
                const form = page.getByRole('region', { name: 'Invite someone' });
                await form.getByRole('button', { name: 'Send invitation' }).click();
                await expect(form.getByText("Enter the person's name.")).toBeVisible();
              },
            },
          ],
        },
        { path: '/admin/units' },
        {
          path: '/admin/units/new',
          states: [
            {
              name: 'an empty unit refused beside its fields',
              reach: async (page) => {
                await page.getByRole('button', { name: 'Add this unit' }).click();
                await expect(page.locator('[aria-invalid="true"]').first()).toBeVisible();
              },
            },
          ],
        },
        { path: `/admin/units/${await aUnit(db)}` },
        { path: '/admin/settings' },
        { path: '/admin/mail' },
      ],
    }),
  },
];

async function signedInPage(browser: Browser, email: string | null, size: (typeof sizes)[number]) {
  const context = await browser.newContext({ viewport: { width: size.width, height: size.height } });
  const page = await context.newPage();
  if (email) {
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill(demoPassword);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
  }
  return page;
}

/** The theme as the switch sets it (the attribute and the stored choice), without a reload. */
async function setTheme(page: Page, theme: (typeof themes)[number]) {
  await page.evaluate((t) => {
    document.documentElement.dataset.theme = t;
    document.cookie = `rigcall-theme=${t}; path=/; max-age=31536000; samesite=lax`;
  }, theme);
  // Two frames, so the new colours are computed before axe reads them.
  await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r))));
}

async function scan(page: Page, where: string) {
  const result = await new AxeBuilder({ page }).analyze();
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .flatMap((v) =>
      v.nodes.map((n) => {
        const detail = [...n.any, ...n.all, ...n.none]
          .map((c) => c.message)
          .filter(Boolean)
          .join('; ');
        return `${v.impact} ${v.id} on ${where}: ${n.target.join(' ')}${detail ? ` (${detail})` : ''}`;
      }),
    );
}

for (const group of groups) {
  for (const size of sizes) {
    test(`${group.name} pages at ${size.width}×${size.height}, day and night: no serious or critical axe violation`, async ({
      browser,
    }) => {
      test.setTimeout(180_000);
      const db = createDb(databaseUrlFromEnv(), 1);
      let plan: Awaited<ReturnType<Group['prepare']>>;
      try {
        plan = await group.prepare(db);
      } finally {
        await db.destroy();
      }
      const page = await signedInPage(browser, plan.email, size);
      const found: string[] = [];
      for (const target of plan.pages) {
        const res = await page.goto(target.path, { waitUntil: 'networkidle' });
        // The page itself, not a redirect to the sign-in or not-allowed page.
        expect(res?.status(), target.path).toBe(target.status ?? 200);
        expect(new URL(page.url()).pathname + new URL(page.url()).search).toBe(target.path);
        for (const state of [null, ...(target.states ?? [])]) {
          if (state) {
            await state.reach(page);
            await page.waitForLoadState('networkidle');
          }
          for (const theme of themes) {
            await setTheme(page, theme);
            const where = `${target.path}${state ? ` [${state.name}]` : ''} (${size.width}×${size.height}, ${theme})`;
            found.push(...(await scan(page, where)));
          }
        }
      }
      await page.context().close();
      expect(found, `serious or critical violations:\n${found.join('\n')}`).toEqual([]);
    });
  }
}
