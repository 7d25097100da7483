// Defect 10 of issue 16 (the server-side parts; the nonce-based script policy is checked in
// Chromium by tests/e2e/faults/security-headers.spec.ts): a write is same-origin only against the
// configured public URL, never against X-Forwarded-Host; the app refuses to start with the
// placeholder secret of .env.example; /api/health shows its version only to a signed-in user.
import { spawnSync } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as health from '@/app/api/health/route';
import * as inspections from '@/app/api/inspections/route';
import { makeFleetFixture, type FleetFixture } from '../../setup/fleet-fixture';
import { callRoute, makeRequest } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';

const db = getTestDb();
let f: FleetFixture;
beforeAll(async () => {
  f = await makeFleetFixture(db, 'Hardening fleet');
});
afterAll(() => db.destroy());

const root = path.resolve(__dirname, '../../..');

/** Load the app's configuration in a fresh process with these variables, as the server would. */
function loadEnvWith(vars: Record<string, string>) {
  return spawnSync(
    process.execPath,
    [
      path.join(root, 'node_modules/tsx/dist/cli.mjs'),
      '-e',
      "import('./lib/env.ts').then((m) => { m.getEnv(); console.log('configured'); })",
    ],
    {
      cwd: root,
      // The server's import conditions, so that lib/env (server-only) loads as it does in Next.
      env: { ...process.env, NODE_OPTIONS: '--conditions=react-server', ...vars },
      encoding: 'utf8',
      timeout: 60_000,
    },
  );
}

describe('configuration and headers (issue 16, defect 10)', () => {
  it('defect 10: the placeholder secret from .env.example (or another known one) stops the app', () => {
    for (const secret of ['replace-with-32-random-bytes', 'changeme-changeme-changeme', 'secretsecretsecretsecret']) {
      const out = loadEnvWith({ NEXTAUTH_SECRET: secret });
      expect(out.status, secret).not.toBe(0);
      expect(out.stderr, secret).toMatch(/NEXTAUTH_SECRET.*placeholder|NEXTAUTH_SECRET.*random/i);
    }
    const good = loadEnvWith({ NEXTAUTH_SECRET: 'k3Jq9vX2mP7rT5wY8zB1nC4dF6gH0aLs' });
    expect(good.stdout).toContain('configured');
  }, 120_000);

  it('defect 10: a cross-site write that claims our host in X-Forwarded-Host is refused', async () => {
    const res = await callRoute(
      inspections.POST,
      makeRequest('/api/inspections', {
        method: 'POST',
        cookie: f.cookies.driver,
        headers: { origin: 'https://evil.example', 'x-forwarded-host': 'evil.example', 'x-forwarded-proto': 'https' },
        json: {
          id: randomUUID(),
          kind: 'pre_trip',
          tractorId: f.tractor.id,
          trailerId: null,
          odometer: 1,
          startedAt: new Date().toISOString(),
        },
      }),
    );
    expect(res.status).toBe(403);
  });

  it('defect 10: /api/health tells an anonymous caller whether it is up, not which version it runs', async () => {
    const anonymous = await callRoute(health.GET, makeRequest('/api/health'));
    expect(anonymous.status).toBe(200);
    const body = (await anonymous.json()) as Record<string, unknown>;
    expect(body.ok).toBe(true);
    expect(body).not.toHaveProperty('version');
    const signedIn = (await (
      await callRoute(health.GET, makeRequest('/api/health', { cookie: f.cookies.admin }))
    ).json()) as Record<string, unknown>;
    expect(signedIn.version).toMatch(/^\d+\.\d+\.\d+/);
  });
});
