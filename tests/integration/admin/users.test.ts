import { randomUUID } from 'node:crypto';
import bcrypt from 'bcryptjs';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { GET as getUser, PATCH as patchUser } from '@/app/api/admin/users/[id]/route';
import { GET as listUsers, POST as inviteUser } from '@/app/api/admin/users/route';
import { GET as listUnits } from '@/app/api/admin/units/route';
import { z } from 'zod';
import { adminUserSchema } from '@/lib/schemas/users';
import { makeUser } from '../../../db/factories';
import { parseJson, readError } from '../../setup/read-json';
import { callRoute, makeRequest, sessionCookieFor } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';
import { auditRows, makeAdminFleet, waitForMailTo } from './helpers';

const db = getTestDb();
afterAll(() => db.destroy());

let ctx: Awaited<ReturnType<typeof makeAdminFleet>>;
beforeEach(async () => {
  ctx = await makeAdminFleet();
});

const userBodySchema = z.object({ user: adminUserSchema });
const invitationBodySchema = z.object({
  invitation: z.object({ email: z.string(), name: z.string(), roles: z.array(z.string()) }),
});
const userListSchema = z.object({ users: z.array(adminUserSchema) });

const invite = (json: unknown, cookie = ctx.adminCookie) =>
  callRoute(inviteUser, makeRequest('/api/admin/users', { method: 'POST', cookie, json }));
const patch = (id: string, json: unknown, cookie = ctx.adminCookie) =>
  callRoute(patchUser, makeRequest(`/api/admin/users/${id}`, { method: 'PATCH', cookie, json }), { id });

describe('inviting a user', () => {
  it('creates the account, mails a temporary password that then signs in, and audits it', async () => {
    const email = `new-${randomUUID().slice(0, 8)}@test.example`;
    const res = await invite({
      name: '  Rosa Kettering ',
      email: email.toUpperCase(),
      roles: ['mechanic', 'driver', 'driver'],
    });
    expect(res.status).toBe(201);
    const { invitation } = await parseJson(res, invitationBodySchema);
    expect(invitation).toEqual({ email, name: 'Rosa Kettering', roles: ['driver', 'mechanic'] });
    const user = await db
      .selectFrom('appUser')
      .select(['id', 'name', 'email', 'roles', 'active', 'mustChangePassword', 'lastSignInAt'])
      .where('email', '=', email)
      .executeTakeFirstOrThrow();
    expect(user).toMatchObject({
      name: 'Rosa Kettering',
      email,
      roles: ['driver', 'mechanic'],
      active: true,
      mustChangePassword: true,
      lastSignInAt: null,
    });

    const mail = await waitForMailTo(email);
    expect(mail, 'the invitation reached the catcher').not.toBeNull();
    expect(mail!.subject).toContain('RigCall');
    const password = /Temporary password:\s+(\S+)/.exec(mail!.text)?.[1];
    expect(password).toMatch(/^[a-z2-9]{4}-[a-z2-9]{4}-[a-z2-9]{4}$/);
    expect(mail!.html).toContain(password);
    expect(mail!.text).toContain('/sign-in');

    const row = await db
      .selectFrom('appUser')
      .select(['passwordHash', 'mustChangePassword', 'fleetId'])
      .where('id', '=', user.id)
      .executeTakeFirstOrThrow();
    expect(row.fleetId).toBe(ctx.fleet.id);
    expect(row.mustChangePassword).toBe(true);
    expect(await bcrypt.compare(password!, row.passwordHash)).toBe(true);
    expect(await bcrypt.compare('test-password', row.passwordHash)).toBe(false);

    const audit = await auditRows(user.id);
    expect(audit).toEqual([
      expect.objectContaining({
        action: 'user.invited',
        entity: 'app_user',
        actorId: ctx.admin.id,
        fleetId: ctx.fleet.id,
        detail: { email, name: 'Rosa Kettering', roles: ['driver', 'mechanic'] },
      }),
    ]);
    expect(JSON.stringify(audit)).not.toContain(password);
  });

  it("refuses an e-mail that already has an account in this fleet (409); another fleet's answers like a fresh one", async () => {
    const res = await invite({ name: 'Twin', email: ctx.driver.email, roles: ['driver'] });
    expect(res.status).toBe(409);
    const error = await readError(res);
    expect(error.message).toBe(`${ctx.driver.email} already has an account.`);
    expect(error.fields?.email).toEqual([`${ctx.driver.email} already has an account.`]);

    const other = await makeAdminFleet();
    const res2 = await invite({ name: 'Twin', email: other.driver.email, roles: ['driver'] });
    expect(res2.status).toBe(201);
  });

  it('explains a bad e-mail, a missing name and missing roles beside each field (422)', async () => {
    const res = await invite({ name: ' ', email: 'not-an-address', roles: [] });
    expect(res.status).toBe(422);
    const error = await readError(res);
    expect(error.code).toBe('invalid_body');
    expect(error.fields).toEqual({
      name: ["Enter the person's name."],
      email: ['Enter an e-mail address like name@company.com.'],
      roles: ['Give at least one role.'],
    });
    const res2 = await invite({ name: 'X', email: 'x@test.example', roles: ['captain'] });
    expect((await readError(res2)).fields?.['roles.0']?.[0]).toMatch(/Pick roles from the list/);
  });
});

describe('changing a user', () => {
  it('changes roles and deactivates, one audit row per change, and never deletes', async () => {
    const res = await patch(ctx.driver.id, { roles: ['driver', 'supervisor'], active: false, name: 'Driver Renamed' });
    expect(res.status).toBe(200);
    expect((await parseJson(res, userBodySchema)).user).toMatchObject({
      roles: ['driver', 'supervisor'],
      active: false,
      name: 'Driver Renamed',
    });
    const actions = (await auditRows(ctx.driver.id)).map((r) => r.action);
    expect(actions).toEqual(['user.renamed', 'user.roles_changed', 'user.deactivated']);

    // The row is still there, and the deactivated user's session no longer opens the API.
    expect(
      await db.selectFrom('appUser').select('active').where('id', '=', ctx.driver.id).executeTakeFirstOrThrow(),
    ).toEqual({ active: false });
    const stale = await sessionCookieFor({ ...ctx.driver, roles: ['driver', 'supervisor'] });
    expect((await callRoute(listUnits, makeRequest('/api/admin/units', { cookie: stale }))).status).toBe(401);

    const back = await patch(ctx.driver.id, { active: true });
    expect((await parseJson(back, userBodySchema)).user.active).toBe(true);
    expect((await auditRows(ctx.driver.id)).at(-1)?.action).toBe('user.reactivated');
  });

  it('writes nothing when nothing changes', async () => {
    const res = await patch(ctx.driver.id, { roles: ['driver'] });
    expect(res.status).toBe(200);
    expect(await auditRows(ctx.driver.id)).toEqual([]);
  });

  it('stops an admin from deactivating themselves or dropping their own admin role (409)', async () => {
    const res = await patch(ctx.admin.id, { active: false });
    expect(res.status).toBe(409);
    expect((await readError(res)).message).toMatch(/cannot deactivate your own account/);
    const res2 = await patch(ctx.admin.id, { roles: ['supervisor'] });
    expect(res2.status).toBe(409);
    expect((await readError(res2)).message).toMatch(/cannot remove your own admin role/);
    // Adding a role to yourself is fine.
    const res3 = await patch(ctx.admin.id, { roles: ['admin', 'supervisor'] });
    expect(res3.status).toBe(200);
    const row = await db
      .selectFrom('appUser')
      .select(['active', 'roles'])
      .where('id', '=', ctx.admin.id)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({ active: true, roles: ['supervisor', 'admin'] });
  });

  it('refuses an empty change (422)', async () => {
    const res = await patch(ctx.driver.id, {});
    expect(res.status).toBe(422);
    expect((await readError(res)).message).toMatch(/Nothing to change/);
  });
});

describe('another fleet', () => {
  it("lists only this fleet's people", async () => {
    const other = await makeAdminFleet();
    const res = await callRoute(listUsers, makeRequest('/api/admin/users', { cookie: ctx.adminCookie }));
    const { users } = await parseJson(res, userListSchema);
    expect(users.map((u) => u.id).sort()).toEqual([ctx.admin.id, ctx.driver.id].sort());
    expect(users.some((u) => u.id === other.driver.id)).toBe(false);
  });

  it("gets 404 for another fleet's user by id, and changes nothing", async () => {
    const other = await makeAdminFleet();
    const victim = await makeUser(db, { fleetId: other.fleet.id, roles: ['driver'], name: 'Other Fleet Driver' });
    const read = await callRoute(getUser, makeRequest(`/api/admin/users/${victim.id}`, { cookie: ctx.adminCookie }), {
      id: victim.id,
    });
    expect(read.status).toBe(404);
    const res = await patch(victim.id, { active: false, roles: ['admin'] });
    expect(res.status).toBe(404);
    expect((await readError(res)).message).not.toContain(victim.name);
    const row = await db
      .selectFrom('appUser')
      .select(['active', 'roles', 'fleetId'])
      .where('id', '=', victim.id)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({ active: true, roles: ['driver'], fleetId: other.fleet.id });
    expect(await auditRows(victim.id)).toEqual([]);
  });
});
