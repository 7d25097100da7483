// RigCall installs to the home screen and opens in a dead spot: the web app manifest (its start,
// scope and icons, each a real PNG of the size it claims), the service worker registered for the
// whole origin, what it keeps on the phone after a driver signs in, and the offline page.
import { expect, test, type APIRequestContext } from '@playwright/test';
import { signIn } from '../fixtures/walk-helpers';

test.use({ serviceWorkers: 'allow' });
test.describe.configure({ mode: 'serial' });

type Manifest = {
  name: string;
  short_name: string;
  start_url: string;
  scope: string;
  display: string;
  theme_color: string;
  background_color: string;
  icons: { src: string; sizes: string; type: string; purpose?: string }[];
};

// Width and height from a PNG's IHDR chunk (PNG specification, 11.2.2: bytes 16–23 of the file).
async function pngSize(request: APIRequestContext, src: string) {
  const res = await request.get(src);
  expect(res.status(), src).toBe(200);
  expect(res.headers()['content-type']).toBe('image/png');
  const bytes = await res.body();
  expect(bytes.subarray(1, 4).toString('latin1')).toBe('PNG');
  return `${bytes.readUInt32BE(16)}x${bytes.readUInt32BE(20)}`;
}

test('the manifest names the app, its start and scope, our colours and icons of the sizes it claims', async ({
  page,
  request,
}) => {
  await page.goto('/');
  const href = await page.locator('link[rel="manifest"]').getAttribute('href');
  expect(href).toBe('/manifest.webmanifest');
  const res = await request.get(href!);
  expect(res.status()).toBe(200);
  expect(res.headers()['content-type']).toContain('application/manifest+json');
  const m = (await res.json()) as Manifest;
  expect(m.name).toBe('RigCall');
  expect(m.start_url).toBe('/go');
  expect(m.scope).toBe('/');
  expect(m.display).toBe('standalone');
  // The asphalt of app/globals.css (17 19 22).
  expect(m.theme_color).toBe('#111316');
  expect(m.background_color).toBe('#111316');
  // Installability in Chromium asks for a 192 px and a 512 px icon (web.dev "Add a web app manifest").
  const sizes = [];
  for (const icon of m.icons) {
    expect(icon.type).toBe('image/png');
    expect(await pngSize(request, icon.src)).toBe(icon.sizes);
    sizes.push(`${icon.sizes} ${icon.purpose ?? 'any'}`);
  }
  expect(sizes).toEqual(expect.arrayContaining(['192x192 any', '512x512 any', '512x512 maskable']));
});

test('the service worker controls the whole origin and keeps the shell, the fonts and the driver data', async ({
  page,
  context,
}) => {
  await signIn(page, 'dana.okafor@northbank.example');
  const reg = await page.evaluate(async () => {
    const r = await navigator.serviceWorker.ready;
    return { scope: r.scope, script: r.active?.scriptURL ?? null };
  });
  const origin = new URL(page.url()).origin;
  expect(reg.scope).toBe(`${origin}/`);
  expect(reg.script).toBe(`${origin}/serwist/sw.js`);

  // The connection line in the driver's header.
  await expect(page.getByTestId('connection-status')).toHaveText(/Online/);

  // Precached at install: the offline page, a font, and the scripts this page ran.
  await expect
    .poll(async () => page.evaluate(async () => (await caches.keys()).length), { timeout: 20_000 })
    .toBeGreaterThan(0);
  const kept = await page.evaluate(async () => {
    const urls: string[] = [];
    for (const name of await caches.keys()) {
      for (const req of await (await caches.open(name)).keys()) urls.push(`${name} ${new URL(req.url).pathname}`);
    }
    const scripts = [...document.querySelectorAll('script[src]')].map(
      (s) => new URL((s as HTMLScriptElement).src).pathname,
    );
    return { urls, scripts };
  });
  expect(kept.urls.some((u) => / \/offline$/.test(u))).toBe(true);
  expect(kept.urls.some((u) => /\.woff2$/.test(u))).toBe(true);
  for (const script of kept.scripts)
    expect(
      kept.urls.some((u) => u.endsWith(` ${script}`)),
      script,
    ).toBe(true);

  // Kept after sign-in for a dead spot: the units, a unit's review, the start screen.
  await expect
    .poll(
      async () =>
        page.evaluate(async () => {
          const c = await caches.open('rigcall-driver-data');
          const paths = (await c.keys()).map((r) => new URL(r.url).pathname);
          return {
            units: paths.includes('/api/units'),
            review: paths.some((p) => /^\/api\/units\/[^/]+\/review$/.test(p)),
            start: !!(await caches.match('/driver/start', { cacheName: 'rigcall-pages' })),
          };
        }),
      { timeout: 30_000 },
    )
    .toEqual({ units: true, review: true, start: true });

  // No connection: the kept home and start screens open; a screen never kept gets the offline page.
  await context.setOffline(true);
  await page.goto('/driver');
  await expect(page.getByTestId('signed-in-as')).toContainText('Dana');
  await expect(page.getByTestId('connection-status')).toHaveText(/No signal/);
  await page.goto('/driver/start');
  await expect(page.getByRole('group', { name: 'Tractor' })).toBeVisible();
  await page.goto('/mechanic');
  await expect(page.getByRole('heading', { name: 'No connection' })).toBeVisible();
  await context.setOffline(false);
});
