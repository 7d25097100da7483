// Defect 6 of issue 16: sessions that can end. A server-side session version, checked on every
// request and bumped on sign-out, password change, deactivation and role change; an absolute
// lifetime of one shift from sign-in that refreshing the cookie cannot extend.
import { randomUUID } from 'node:crypto';
import { encode, type JWT } from 'next-auth/jwt';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import * as me from '@/app/api/me/route';
import * as adminUser from '@/app/api/admin/users/[id]/route';
import { authOptions, sessionMaxAgeSeconds } from '@/lib/auth/config';
import { makeUser } from '../../../db/factories';
import { makeFleetFixture, type FleetFixture } from '../../setup/fleet-fixture';
import { callRoute, makeRequest } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';

const db = getTestDb();
let f: FleetFixture;
beforeAll(async () => {
  f = await makeFleetFixture(db, 'Sessions fleet');
});
afterAll(() => db.destroy());
afterEach(() => vi.useRealTimers());

type Authorize = (c: Record<string, string>, req: { headers: Record<string, string> }) => Promise<unknown>;
const authorize = (authOptions.providers[0] as unknown as { options: { authorize: Authorize } }).options.authorize;
type JwtCallback = (p: { token: JWT; user?: unknown; trigger?: string }) => Promise<JWT> | JWT;
const jwtCallback = authOptions.callbacks!.jwt as unknown as JwtCallback;

/** Sign in the way next-auth does: authorize, then the jwt callback, then the cookie. */
async function signIn(email: string, password: string): Promise<{ token: JWT; cookie: string }> {
  const user = await authorize({ email, password }, { headers: {} });
  if (!user) throw new Error('sign-in refused');
  const token = await jwtCallback({
    token: { email, name: 'x', sub: (user as { id: string }).id } as JWT,
    user,
    trigger: 'signIn',
  });
  return { token, cookie: await cookieOf(token) };
}
/** What next-auth does on every session read: the same token, encoded again with a fresh expiry. */
async function cookieOf(token: JWT): Promise<string> {
  const jwt = await encode({ secret: process.env.NEXTAUTH_SECRET!, token, maxAge: sessionMaxAgeSeconds });
  return `next-auth.session-token=${jwt}`;
}
const status = async (cookie: string) => (await callRoute(me.GET, makeRequest('/api/me', { cookie }))).status;

async function person(roles: ('driver' | 'supervisor')[] = ['driver']) {
  const email = `sess-${randomUUID().slice(0, 8)}@test.example`;
  const u = await makeUser(db, { fleetId: f.fleet.id, roles, email, password: 'a-long-enough-password' });
  return { ...u, email, password: 'a-long-enough-password' };
}

describe('sessions that end (issue 16, defect 6)', () => {
  it('defect 6: an old cookie is refused after sign-out', async () => {
    const u = await person();
    const { token, cookie } = await signIn(u.email, u.password);
    expect(await status(cookie)).toBe(200);
    await authOptions.events?.signOut?.({ token, session: undefined as never });
    expect(await status(cookie)).toBe(401);
    // A new sign-in works again.
    expect(await status((await signIn(u.email, u.password)).cookie)).toBe(200);
  });

  it('defect 6: refreshing the cookie does not extend the session past 14 hours from sign-in', async () => {
    const u = await person();
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(Date.now() - (sessionMaxAgeSeconds + 3600) * 1000);
    const { token } = await signIn(u.email, u.password);
    vi.useRealTimers();
    // 15 hours later the session is read again: next-auth re-encodes the token with a fresh expiry.
    const refreshed = await jwtCallback({ token });
    expect(await status(await cookieOf(refreshed))).toBe(401);
    // Within the shift, a refreshed cookie still works.
    const now = await signIn(u.email, u.password);
    expect(await status(await cookieOf(await jwtCallback({ token: now.token })))).toBe(200);
  });

  it('defect 6: a role change ends the sessions of that person', async () => {
    const u = await person(['driver']);
    const { cookie } = await signIn(u.email, u.password);
    expect(await status(cookie)).toBe(200);
    const res = await callRoute(
      adminUser.PATCH,
      makeRequest(`/api/admin/users/${u.id}`, {
        method: 'PATCH',
        cookie: f.cookies.admin,
        json: { roles: ['driver', 'supervisor'] },
      }),
      { id: u.id },
    );
    expect(res.status).toBe(200);
    expect(await status(cookie)).toBe(401);
  });

  it('defect 6: deactivating and reactivating does not bring an old session back', async () => {
    const u = await person();
    const { cookie } = await signIn(u.email, u.password);
    const patch = (json: unknown) =>
      callRoute(
        adminUser.PATCH,
        makeRequest(`/api/admin/users/${u.id}`, { method: 'PATCH', cookie: f.cookies.admin, json }),
        { id: u.id },
      );
    expect((await patch({ active: false })).status).toBe(200);
    expect((await patch({ active: true })).status).toBe(200);
    expect(await status(cookie)).toBe(401);
  });

  it('defect 6: a token without a sign-in time (made before this check) is refused', async () => {
    const u = await person();
    const bare = await cookieOf({ uid: u.id, fleetId: u.fleetId, roles: ['driver'], sub: u.id });
    expect(await status(bare)).toBe(401);
  });
});
