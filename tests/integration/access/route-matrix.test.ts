// Every API route × every role: 401 without a session, 403 for a role that may not, 2xx for one
// that may. The last test fails when a route file exists that this table does not list.
import fs from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as health from '@/app/api/health/route';
import * as inspection from '@/app/api/inspections/[id]/route';
import * as me from '@/app/api/me/route';
import { roles, type Role } from '@/lib/auth/roles';
import { makeFleetFixture, type FleetFixture } from '../../setup/fleet-fixture';
import { callRoute, makeRequest } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';

type Case = {
  route: string; // the route file's path under app/api, as written on disk
  method: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  allowed: readonly Role[] | 'public';
  call: (f: FleetFixture, cookie?: string) => Promise<Response>;
};

const cases: Case[] = [
  { route: 'health', method: 'GET', allowed: 'public', call: (_f, cookie) => callRoute(health.GET, makeRequest('/api/health', { cookie })) },
  { route: 'me', method: 'GET', allowed: roles, call: (_f, cookie) => callRoute(me.GET, makeRequest('/api/me', { cookie })) },
  {
    route: 'inspections/[id]',
    method: 'GET',
    allowed: ['driver', 'mechanic', 'supervisor'],
    call: (f, cookie) => callRoute(inspection.GET, makeRequest(`/api/inspections/${f.inspection.id}`, { cookie }), { id: f.inspection.id }),
  },
];

// Routes that are not ours to guard: next-auth's own sign-in endpoints.
const unguarded = new Set(['auth/[...nextauth] GET', 'auth/[...nextauth] POST']);

const db = getTestDb();
let f: FleetFixture;
beforeAll(async () => {
  f = await makeFleetFixture(db, 'Matrix fleet');
});
afterAll(() => db.destroy());

describe.each(cases)('$method /api/$route', (c) => {
  if (c.allowed === 'public') {
    it('answers without a session', async () => {
      expect((await c.call(f)).status).toBe(200);
    });
    return;
  }
  const allowed = c.allowed;
  it('401 without a session', async () => {
    const res = await c.call(f);
    expect(res.status).toBe(401);
    expect((await res.json()).error.message).toMatch(/sign in/i);
  });
  it.each(roles.map((r) => [r]))('%s', async (role) => {
    const res = await c.call(f, f.cookies[role]);
    if (allowed.includes(role)) {
      expect(res.status, await res.clone().text()).toBeLessThan(300);
    } else {
      expect(res.status).toBe(403);
      expect((await res.json()).error.code).toBe('forbidden');
    }
  });
});

describe('fleet isolation', () => {
  it("another fleet's report by id is 404, exactly like an id that does not exist", async () => {
    const other = await makeFleetFixture(db, 'Other fleet');
    const theirs = await callRoute(inspection.GET, makeRequest(`/api/inspections/${other.inspection.id}`, { cookie: f.cookies.supervisor }), { id: other.inspection.id });
    const ghost = randomUUID();
    const nobody = await callRoute(inspection.GET, makeRequest(`/api/inspections/${ghost}`, { cookie: f.cookies.supervisor }), { id: ghost });
    expect(theirs.status).toBe(404);
    expect(nobody.status).toBe(404);
    expect(await theirs.json()).toEqual(await nobody.json());
  });

  it('a malformed id is a clear 422, not a server error', async () => {
    const res = await callRoute(inspection.GET, makeRequest('/api/inspections/42', { cookie: f.cookies.supervisor }), { id: '42' });
    expect(res.status).toBe(422);
    expect((await res.json()).error.message).toMatch(/record id/);
  });
});

describe('the table lists every route', () => {
  it('has a case for each exported method of each app/api route file', () => {
    const apiDir = path.resolve(__dirname, '../../../app/api');
    const found: string[] = [];
    const walk = (dir: string) => {
      for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
        const abs = path.join(dir, e.name);
        if (e.isDirectory()) walk(abs);
        else if (e.name === 'route.ts') {
          const route = path.relative(apiDir, dir).split(path.sep).join('/');
          const text = fs.readFileSync(abs, 'utf8');
          for (const m of text.matchAll(/export const (GET|POST|PATCH|PUT|DELETE)\b|export \{[^}]*\bas (GET|POST|PATCH|PUT|DELETE)\b/g)) found.push(`${route} ${m[1] ?? m[2]}`);
          for (const m of text.matchAll(/\bas (GET|POST|PATCH|PUT|DELETE)\b/g)) found.push(`${route} ${m[1]}`);
        }
      }
    };
    walk(apiDir);
    const listed = new Set([...cases.map((c) => `${c.route} ${c.method}`), ...unguarded]);
    expect([...new Set(found)].filter((r) => !listed.has(r))).toEqual([]);
  });
});
