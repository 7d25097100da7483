// The built app's security headers, and that the pages still work under its content security
// policy: no violation reported by the browser on the sign-in page or the driver's walk.
import { expect, test } from '@playwright/test';
import { demoPassword } from '../fixtures/demo';
import { readError } from '../../setup/read-json';

test('every answer carries the security headers', async ({ request }) => {
  for (const url of ['/sign-in', '/api/health', '/driver', '/_next/static/not-there.js']) {
    const res = await request.get(url, { maxRedirects: 0 });
    const h = res.headers();
    const csp = h['content-security-policy'] ?? '';
    expect(csp, url).toContain("frame-ancestors 'none'");
    expect(csp, url).toContain("default-src 'self'");
    expect(csp, url).toContain("object-src 'none'");
    expect(csp, url).toContain("connect-src 'self'");
    expect(csp, url).toMatch(/img-src 'self' blob:/);
    expect(csp, url).not.toContain('unsafe-eval');
    // Scripts: our own files, or inline ones carrying this answer's nonce; never 'unsafe-inline'.
    const scripts = csp.split(';').find((d) => d.trim().startsWith('script-src')) ?? '';
    expect(scripts, url).not.toContain("'unsafe-inline'");
    expect(h['x-content-type-options'], url).toBe('nosniff');
    expect(h['x-frame-options'], url).toBe('DENY');
    expect(h['referrer-policy'], url).toBe('same-origin');
    expect(h['x-powered-by'], url).toBeUndefined();
  }
});

test('every page has a fresh script nonce, and every inline script of the page carries it', async ({ request }) => {
  const nonces = new Set<string>();
  for (let i = 0; i < 2; i++) {
    const res = await request.get('/sign-in');
    const nonce = /'nonce-([^']+)'/.exec(res.headers()['content-security-policy'] ?? '')?.[1];
    expect(nonce).toBeTruthy();
    nonces.add(nonce!);
    const html = await res.text();
    const scripts = [...html.matchAll(/<script\b([^>]*)>/g)].map((m) => m[1] ?? '');
    expect(scripts.length).toBeGreaterThan(0);
    for (const attrs of scripts) expect(attrs).toContain(`nonce="${nonce}"`);
  }
  expect(nonces.size).toBe(2);
});

test('a write from another site is refused by the running app', async ({ request }) => {
  const res = await request.post('/api/inspections', {
    headers: { origin: 'https://evil.example', 'content-type': 'application/json' },
    data: {},
  });
  expect(res.status()).toBe(403);
  expect((await readError(res)).message).toMatch(/another site/);
});

test('the pages run under the policy: no violations on sign-in and the driver home', async ({ page }) => {
  const violations: string[] = [];
  page.on('console', (m) => {
    if (/Content Security Policy|Refused to (load|execute|apply|connect)/i.test(m.text())) violations.push(m.text());
  });
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('ola.mensah@northbank.example');
  await page.getByLabel('Password').fill(demoPassword);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/(driver|supervisor)/);
  await page.goto('/driver');
  await expect(page.getByRole('link', { name: 'Start pre-trip' })).toBeVisible();
  // The font is our own, served from /_next/static.
  const font = await page.evaluate(
    () =>
      document.fonts.check('18px "Atkinson Hyperlegible Next Variable"') ||
      document.fonts.check('18px "Atkinson Hyperlegible Next"'),
  );
  expect(font).toBe(true);
  expect(violations).toEqual([]);
});

test('the running app slows an account down after repeated wrong passwords, whatever X-Forwarded-For says', async ({
  request,
}) => {
  const { createDb } = await import('../../../db/connect');
  const { makeUser } = await import('../../../db/factories');
  const db = createDb(process.env.DATABASE_URL ?? '', 1);
  const fleet = await db.selectFrom('fleet').select('id').where('slug', '=', 'northbank').executeTakeFirstOrThrow();
  const email = `locked-${Date.now().toString(36)}@northbank.example`;
  await makeUser(db, { fleetId: fleet.id, roles: ['driver'], email, password: demoPassword });
  await db.destroy();

  // Under plain `next start` the client writes X-Forwarded-For, so it is not trusted
  // (TRUSTED_PROXY_COUNT=0): a new address on every try does not buy more tries.
  const spoofed = () => ({ 'x-forwarded-for': `198.51.100.${Math.floor(Math.random() * 250) + 1}` });
  const attempt = async (password: string) => {
    const address = spoofed();
    const { csrfToken } = (await (await request.get('/api/auth/csrf', { headers: address })).json()) as {
      csrfToken: string;
    };
    const res = await request.post('/api/auth/callback/credentials', {
      form: { email, password, csrfToken, json: 'true' },
      headers: address,
      maxRedirects: 0,
    });
    const body = (await res.json().catch(() => ({}))) as { url?: string };
    return new URL(body.url ?? res.headers().location ?? 'http://x/').searchParams.get('error');
  };
  // Three free tries, then each failure makes the next try wait (a growing delay, no lock-out).
  for (let i = 0; i < 4; i++) expect(await attempt('wrong-password')).toBe('CredentialsSignin');
  expect(await attempt(demoPassword)).toMatch(/Too many failed sign-ins. Wait \d+ seconds/);
});
