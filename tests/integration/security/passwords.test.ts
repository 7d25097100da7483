// Defect 1 of issue 16: a temporary password is replaced. A change-password route (current + new,
// a length and common-password policy), nothing else reachable until a temporary password is
// changed, invitations that expire, a single-use expiring "forgot password" link whose token is
// stored hashed, and every password change ends the other sessions.
import { createHash, randomUUID } from 'node:crypto';
import bcrypt from 'bcryptjs';
import { encode, type JWT } from 'next-auth/jwt';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as me from '@/app/api/me/route';
import * as units from '@/app/api/units/route';
import * as password from '@/app/api/password/route';
import * as forgot from '@/app/api/password/forgot/route';
import * as reset from '@/app/api/password/reset/route';
import * as users from '@/app/api/admin/users/route';
import { authOptions, sessionMaxAgeSeconds } from '@/lib/auth/config';
import { makeUser } from '../../../db/factories';
import { waitForMailTo } from '../admin/helpers';
import { makeFleetFixture, type FleetFixture } from '../../setup/fleet-fixture';
import { readError } from '../../setup/read-json';
import { callRoute, makeRequest } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';

const db = getTestDb();
let f: FleetFixture;
beforeAll(async () => {
  f = await makeFleetFixture(db, 'Passwords fleet');
});
afterAll(() => db.destroy());

type Authorize = (c: Record<string, string>, req: { headers: Record<string, string> }) => Promise<unknown>;
const authorize = (authOptions.providers[0] as unknown as { options: { authorize: Authorize } }).options.authorize;
type JwtCallback = (p: { token: JWT; user?: unknown; trigger?: string }) => Promise<JWT> | JWT;
const jwtCallback = authOptions.callbacks!.jwt as unknown as JwtCallback;

async function signIn(email: string, pw: string): Promise<string> {
  const user = await authorize({ email, password: pw }, { headers: {} });
  if (!user) throw new Error('sign-in refused');
  const token = await jwtCallback({
    token: { email, sub: (user as { id: string }).id } as JWT,
    user,
    trigger: 'signIn',
  });
  return `next-auth.session-token=${await encode({ secret: process.env.NEXTAUTH_SECRET!, token, maxAge: sessionMaxAgeSeconds })}`;
}
const get = async (fn: typeof me.GET, path: string, cookie: string) => callRoute(fn, makeRequest(path, { cookie }));
const change = (cookie: string, json: unknown) =>
  callRoute(password.PUT, makeRequest('/api/password', { method: 'PUT', cookie, json }));
/** The session cookie a response sets, as a Cookie header. */
const setCookieOf = (res: Response) => {
  const c = res.headers.getSetCookie().find((x) => x.startsWith('next-auth.session-token='));
  return c ? c.split(';')[0]! : null;
};

async function invitee() {
  const email = `pw-${randomUUID().slice(0, 8)}@test.example`;
  const res = await callRoute(
    users.POST,
    makeRequest('/api/admin/users', {
      method: 'POST',
      cookie: f.cookies.admin,
      json: { name: 'Pat Newcomer', email, roles: ['driver'] },
    }),
  );
  expect(res.status).toBe(201);
  const mail = await waitForMailTo(email);
  const temporary = /Temporary password:\s+(\S+)/.exec(mail!.text)![1]!;
  return { email, temporary };
}

describe('passwords (issue 16, defect 1)', () => {
  it('defect 1: a temporary password opens nothing but the change-password route', async () => {
    const { email, temporary } = await invitee();
    const cookie = await signIn(email, temporary);
    const blocked = await get(units.GET, '/api/units', cookie);
    expect(blocked.status).toBe(403);
    expect((await readError(blocked)).message).toMatch(/temporary password.*change it/i);
    // Changing it is allowed, and afterwards everything the role allows is open.
    const res = await change(cookie, { currentPassword: temporary, newPassword: 'gravel road at dawn 42' });
    expect(res.status).toBe(200);
    const fresh = setCookieOf(res);
    expect(fresh, 'the session that changed the password carries on with a new cookie').not.toBeNull();
    expect((await get(units.GET, '/api/units', fresh!)).status).toBe(200);
    const row = await db
      .selectFrom('appUser')
      .select(['mustChangePassword', 'passwordHash'])
      .where('email', '=', email)
      .executeTakeFirstOrThrow();
    expect(row.mustChangePassword).toBe(false);
    expect(await bcrypt.compare('gravel road at dawn 42', row.passwordHash)).toBe(true);
    // The temporary password is refused from now on.
    expect(await authorize({ email, password: temporary }, { headers: {} })).toBeNull();
  });

  it('defect 1: every password change ends the other sessions', async () => {
    const email = `pw2-${randomUUID().slice(0, 8)}@test.example`;
    await makeUser(db, { fleetId: f.fleet.id, roles: ['driver'], email, password: 'first long password' });
    const phone = await signIn(email, 'first long password');
    const tablet = await signIn(email, 'first long password');
    expect((await get(me.GET, '/api/me', tablet)).status).toBe(200);
    const res = await change(phone, {
      currentPassword: 'first long password',
      newPassword: 'second longer passphrase',
    });
    expect(res.status).toBe(200);
    expect((await get(me.GET, '/api/me', tablet)).status).toBe(401);
    expect((await get(me.GET, '/api/me', phone)).status).toBe(401);
    expect((await get(me.GET, '/api/me', setCookieOf(res)!)).status).toBe(200);
  });

  it('defect 1: a wrong current password, a short or common new one are refused with a reason', async () => {
    const email = `pw3-${randomUUID().slice(0, 8)}@test.example`;
    await makeUser(db, { fleetId: f.fleet.id, roles: ['driver'], email, password: 'the current password' });
    const cookie = await signIn(email, 'the current password');
    const wrong = await change(cookie, {
      currentPassword: 'not it at all',
      newPassword: 'a perfectly fine passphrase',
    });
    expect(wrong.status).toBe(422);
    expect((await readError(wrong)).fields?.currentPassword?.[0]).toMatch(/not your current password/i);
    for (const weak of ['short', 'password1234', '123456789012', 'aaaaaaaaaaaaaa', email, 'the current password']) {
      const res = await change(cookie, { currentPassword: 'the current password', newPassword: weak });
      expect(res.status, weak).toBe(422);
      expect((await readError(res)).fields?.newPassword?.[0], weak).toBeTruthy();
    }
  });

  it('defect 1: an invitation (its temporary password) expires after 72 hours', async () => {
    const { email, temporary } = await invitee();
    const row = await db
      .selectFrom('appUser')
      .select(sql<number>`extract(epoch from (temporary_password_expires_at - now()))`.as('left'))
      .where('email', '=', email)
      .executeTakeFirstOrThrow();
    expect(Number(row.left)).toBeGreaterThan(71.9 * 3600);
    expect(Number(row.left)).toBeLessThanOrEqual(72 * 3600);
    await sql`update app_user set temporary_password_expires_at = now() - interval '1 minute' where email = ${email}`.execute(
      db,
    );
    await expect(authorize({ email, password: temporary }, { headers: {} })).rejects.toThrow(
      /temporary password has expired/i,
    );
  });

  it('defect 1: forgot password mails a single-use link whose token is stored only as a hash', async () => {
    const email = `pw4-${randomUUID().slice(0, 8)}@test.example`;
    await makeUser(db, { fleetId: f.fleet.id, roles: ['driver'], email, password: 'forgotten long password' });
    const other = await signIn(email, 'forgotten long password');
    const ask = (address: string) =>
      callRoute(forgot.POST, makeRequest('/api/password/forgot', { method: 'POST', json: { email: address } }));
    const known = await ask(email);
    const unknown = await ask(`nobody-${randomUUID().slice(0, 8)}@test.example`);
    expect(unknown.status).toBe(known.status);
    expect(await unknown.json()).toEqual(await known.json());

    const mail = await waitForMailTo(email);
    const link = /(http\S+\/reset-password\?token=([A-Za-z0-9_-]+))/.exec(mail!.text);
    expect(link).not.toBeNull();
    const token = link![2]!;
    const stored = await db
      .selectFrom('passwordReset')
      .selectAll()
      .where(
        'userId',
        '=',
        (await db.selectFrom('appUser').select('id').where('email', '=', email).executeTakeFirstOrThrow()).id,
      )
      .execute();
    expect(stored).toHaveLength(1);
    expect(JSON.stringify(stored)).not.toContain(token);
    expect(stored[0]!.tokenHash).toBe(createHash('sha256').update(token).digest('hex'));

    const use = (newPassword: string) =>
      callRoute(reset.POST, makeRequest('/api/password/reset', { method: 'POST', json: { token, newPassword } }));
    expect((await use('a brand new passphrase')).status).toBe(200);
    expect(await authorize({ email, password: 'a brand new passphrase' }, { headers: {} })).toMatchObject({ email });
    expect((await get(me.GET, '/api/me', other)).status).toBe(401);
    // Single use.
    const again = await use('yet another passphrase');
    expect(again.status).toBe(422);
    expect((await readError(again)).message).toMatch(/link.*used or expired/i);
  });

  it('defect 1: a reset link expires', async () => {
    const email = `pw5-${randomUUID().slice(0, 8)}@test.example`;
    await makeUser(db, { fleetId: f.fleet.id, roles: ['driver'], email, password: 'forgotten long password' });
    await callRoute(forgot.POST, makeRequest('/api/password/forgot', { method: 'POST', json: { email } }));
    const token = /reset-password\?token=([A-Za-z0-9_-]+)/.exec((await waitForMailTo(email))!.text)![1]!;
    await sql`update password_reset set expires_at = now() - interval '1 second' where token_hash = ${createHash('sha256').update(token).digest('hex')}`.execute(
      db,
    );
    const res = await callRoute(
      reset.POST,
      makeRequest('/api/password/reset', { method: 'POST', json: { token, newPassword: 'a brand new passphrase' } }),
    );
    expect(res.status).toBe(422);
  });
});
