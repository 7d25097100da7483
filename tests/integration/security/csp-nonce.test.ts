// Defect 10 of issue 16 (the script policy): every page answer carries a content security policy
// whose scripts need a fresh per-request nonce, with no 'unsafe-inline' for scripts, and Next is
// handed the same nonce (on the request's policy header) for its own inline scripts. In Chromium:
// tests/e2e/faults/security-headers.spec.ts.
import { NextRequest } from 'next/server';
import { describe, expect, it } from 'vitest';
import { config, proxy } from '@/proxy';

const page = (path: string) => new NextRequest(`http://127.0.0.1:3100${path}`, { headers: { accept: 'text/html' } });
const scriptSrc = (csp: string) =>
  csp
    .split(';')
    .map((d) => d.trim())
    .find((d) => d.startsWith('script-src')) ?? '';

describe('script policy with nonces (issue 16, defect 10)', () => {
  it('defect 10: pages get a policy whose scripts need a nonce, never unsafe-inline', async () => {
    for (const path of ['/sign-in', '/driver', '/', '/change-password']) {
      const res = await proxy(page(path));
      const csp = res.headers.get('content-security-policy') ?? '';
      const scripts = scriptSrc(csp);
      expect(scripts, path).toMatch(/'nonce-[A-Za-z0-9+/=_-]{16,}'/);
      expect(scripts, path).not.toContain("'unsafe-inline'");
      expect(csp, path).toContain("object-src 'none'");
      expect(csp, path).toContain("frame-ancestors 'none'");
    }
  });

  it('defect 10: the nonce is new on every request and reaches Next on the request headers', async () => {
    const a = (await proxy(page('/sign-in'))).headers;
    const b = (await proxy(page('/sign-in'))).headers;
    const nonceOf = (h: Headers) => /'nonce-([^']+)'/.exec(h.get('content-security-policy') ?? '')?.[1];
    expect(nonceOf(a)).toBeTruthy();
    expect(nonceOf(a)).not.toBe(nonceOf(b));
    // NextResponse.next({ request: { headers } }) sends overridden request headers as x-middleware-request-*.
    expect(a.get('x-middleware-request-x-nonce')).toBe(nonceOf(a));
    expect(a.get('x-middleware-request-content-security-policy')).toContain(`'nonce-${nonceOf(a)}'`);
  });

  it('defect 10: the proxy runs for every page, not only the signed-in areas', () => {
    // The matcher is a path pattern: everything but Next's static files.
    const pattern = new RegExp(`^${config.matcher[0]!.replace('/(', '/(')}$`);
    for (const path of ['/sign-in', '/', '/change-password', '/driver/start', '/api/health'])
      expect(pattern.test(path), path).toBe(true);
    expect(pattern.test('/_next/static/chunks/main.js')).toBe(false);
  });
});
