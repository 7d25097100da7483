// Defect 2 of issue 16: an admin's caught-mail listing holds only their own fleet's mail, and an
// invitation answers the same whether or not the address already has an account elsewhere.
import { randomUUID } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import * as mail from '@/app/api/mail/route';
import * as users from '@/app/api/admin/users/route';
import { listCaughtMessages } from '@/lib/services/mail/list-caught-messages';
import { makeAdminFleet, waitForMailTo } from '../admin/helpers';
import { callRoute, makeRequest } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';

const db = getTestDb();
afterAll(() => db.destroy());

const invite = (cookie: string, email: string) =>
  callRoute(
    users.POST,
    makeRequest('/api/admin/users', {
      method: 'POST',
      cookie,
      json: { name: 'Scope Person', email, roles: ['driver'] },
    }),
  );
const listMail = async (cookie: string, to?: string) => {
  const res = await callRoute(
    mail.GET,
    makeRequest(`/api/mail${to ? `?to=${encodeURIComponent(to)}` : ''}`, { cookie }),
  );
  expect(res.status).toBe(200);
  return (await res.json()) as { messages: { to: string[]; subject: string }[] };
};

describe('caught mail per fleet (issue 16, defect 2)', () => {
  it("defect 2: an admin's /api/mail lists none of another fleet's messages", async () => {
    const a = await makeAdminFleet();
    const b = await makeAdminFleet();
    const toA = `scope-a-${randomUUID().slice(0, 8)}@test.example`;
    const toB = `scope-b-${randomUUID().slice(0, 8)}@test.example`;
    expect((await invite(a.adminCookie, toA)).status).toBe(201);
    expect((await invite(b.adminCookie, toB)).status).toBe(201);
    expect(await waitForMailTo(toA)).not.toBeNull();
    expect(await waitForMailTo(toB)).not.toBeNull();

    const seenByB = (await listMail(b.adminCookie)).messages.flatMap((m) => m.to);
    expect(seenByB).toContain(toB);
    expect(seenByB).not.toContain(toA);
    // Asking for the address by name does not help either.
    expect((await listMail(b.adminCookie, toA)).messages).toEqual([]);
    // The admin mail page reads the same service, scoped the same way.
    const page = await listCaughtMessages({ fleetId: b.fleet.id });
    expect(page.messages.flatMap((m) => m.to)).not.toContain(toA);
    expect(page.messages.every((m) => m.fleetId === b.fleet.id)).toBe(true);
  });

  it('defect 2: inviting an address that has an account in another fleet answers like a fresh one', async () => {
    const a = await makeAdminFleet();
    const b = await makeAdminFleet();
    const fresh = await invite(b.adminCookie, `fresh-${randomUUID().slice(0, 8)}@test.example`);
    const taken = await invite(b.adminCookie, a.driver.email);
    expect(taken.status).toBe(fresh.status);
    const freshBody = (await fresh.json()) as Record<string, unknown>;
    const takenBody = (await taken.json()) as Record<string, unknown>;
    const shape = (v: unknown): unknown =>
      v && typeof v === 'object' && !Array.isArray(v)
        ? Object.fromEntries(Object.entries(v).map(([k, x]) => [k, shape(x)]))
        : typeof v;
    expect(shape(takenBody)).toEqual(shape(freshBody));
    expect(JSON.stringify(takenBody)).not.toMatch(/already|another fleet|exists/i);
    // Nothing moved: the person stays in their own fleet, with their own password.
    const row = await db
      .selectFrom('appUser')
      .select(['fleetId', 'passwordHash'])
      .where('email', '=', a.driver.email)
      .executeTakeFirstOrThrow();
    expect(row.fleetId).toBe(a.fleet.id);
  });

  it('defect 2: an address already in the same fleet is still a plain 409 (the admin sees their own people)', async () => {
    const a = await makeAdminFleet();
    const res = await invite(a.adminCookie, a.driver.email);
    expect(res.status).toBe(409);
  });
});
