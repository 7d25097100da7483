// Who may get in and what a signed report refuses: sign-in throttling per account and per
// address, expired sessions, cross-site writes, the lock on a signed report, the content hash.
import { randomUUID } from 'node:crypto';
import { sql } from 'kysely';
import { encode } from 'next-auth/jwt';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as me from '@/app/api/me/route';
import * as inspections from '@/app/api/inspections/route';
import { authOptions, sessionMaxAgeSeconds } from '@/lib/auth/config';
import { signInLimits } from '@/lib/auth/rate-limit';
import { checkReportIntegrity } from '@/lib/services/reports/get-report-integrity';
import { makeUser } from '../../../db/factories';
import { makeFleetFixture, type FleetFixture } from '../../setup/fleet-fixture';
import { callRoute, makeRequest } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';
import { makeSignedReport, postStep } from './walk-helpers';
import { readError } from '../../setup/read-json';

const db = getTestDb();
let f: FleetFixture;
beforeAll(async () => {
  f = await makeFleetFixture(db, 'Security fleet');
});
afterAll(() => db.destroy());

type Authorize = (c: Record<string, string>, req: { headers: Record<string, string> }) => Promise<unknown>;
const authorize = (authOptions.providers[0] as unknown as { options: { authorize: Authorize } }).options.authorize;
const address = () =>
  `10.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`;
const tryPassword = (email: string, password: string, ip: string) =>
  authorize({ email, password }, { headers: { 'x-forwarded-for': `203.0.113.9, ${ip}` } });

describe('sign-in throttling', () => {
  // More in sign-in-throttle.test.ts (the address, the growing delay, the pair behind a proxy).
  it('after the free tries, even the right password waits, and the count lives in the database', async () => {
    const email = `throttle-${randomUUID().slice(0, 8)}@test.example`;
    await makeUser(db, { fleetId: f.fleet.id, roles: ['driver'], email, password: 'right-password' });
    for (let i = 0; i <= signInLimits.pair.free; i++) expect(await tryPassword(email, 'wrong', address())).toBeNull();
    await expect(tryPassword(email, 'right-password', address())).rejects.toThrow(
      /too many failed sign-ins.*wait \d+ seconds/i,
    );
    // In the database, so every app instance sees it; without a trusted proxy, keyed on the account.
    const row = await db
      .selectFrom('signInThrottle')
      .select('failures')
      .where('key', '=', `account:${email}`)
      .executeTakeFirstOrThrow();
    expect(row.failures).toBe(signInLimits.pair.free + 1);
  });

  it('a good sign-in before the delay starts clears the count', async () => {
    const email = `reset-${randomUUID().slice(0, 8)}@test.example`;
    await makeUser(db, { fleetId: f.fleet.id, roles: ['driver'], email, password: 'right-password' });
    const ip = address();
    for (let i = 0; i < signInLimits.pair.free; i++) await tryPassword(email, 'wrong', ip);
    expect(await tryPassword(email, 'right-password', ip)).toMatchObject({ email });
    expect(await tryPassword(email, 'wrong', ip)).toBeNull();
    expect(await tryPassword(email, 'right-password', ip)).toMatchObject({ email });
  });

  it('a count left alone for the quiet spell starts again', async () => {
    const email = `window-${randomUUID().slice(0, 8)}@test.example`;
    await makeUser(db, { fleetId: f.fleet.id, roles: ['driver'], email, password: 'right-password' });
    for (let i = 0; i < signInLimits.pair.free + 3; i++) await tryPassword(email, 'wrong', address()).catch(() => null);
    await sql`update sign_in_throttle set updated_at = now() - interval '16 minutes' where key = ${`account:${email}`}`.execute(
      db,
    );
    expect(await tryPassword(email, 'right-password', address())).toMatchObject({ email });
  });
});

describe('sessions', () => {
  it('last one shift (14 hours) and are refused once expired', async () => {
    expect(authOptions.session?.maxAge).toBe(sessionMaxAgeSeconds);
    expect(sessionMaxAgeSeconds).toBe(14 * 3600);
    const u = f.users.driver;
    const expired = await encode({
      secret: process.env.NEXTAUTH_SECRET!,
      maxAge: -60,
      token: { uid: u.id, fleetId: u.fleetId, roles: ['driver'], sub: u.id } as never,
    });
    const res = await callRoute(me.GET, makeRequest('/api/me', { cookie: `next-auth.session-token=${expired}` }));
    expect(res.status).toBe(401);
    const fresh = await callRoute(me.GET, makeRequest('/api/me', { cookie: f.cookies.driver }));
    expect(fresh.status).toBe(200);
  });

  it('a deactivated user is out at once, session or not', async () => {
    const u = await makeUser(db, { fleetId: f.fleet.id, roles: ['driver'] });
    const { sessionCookieFor } = await import('../../setup/session');
    const cookie = await sessionCookieFor(u);
    expect((await callRoute(me.GET, makeRequest('/api/me', { cookie }))).status).toBe(200);
    await db.updateTable('appUser').set({ active: false }).where('id', '=', u.id).execute();
    expect((await callRoute(me.GET, makeRequest('/api/me', { cookie }))).status).toBe(401);
  });
});

describe('cross-site writes', () => {
  const startBody = () => ({
    id: randomUUID(),
    kind: 'pre_trip',
    tractorId: f.tractor.id,
    trailerId: null,
    odometer: 1,
    startedAt: new Date().toISOString(),
  });
  const post = (headers: Record<string, string>) =>
    callRoute(
      inspections.POST,
      makeRequest('/api/inspections', { method: 'POST', cookie: f.cookies.driver, json: startBody(), headers }),
    );

  it('refuses a write from another origin, with a message, and writes nothing', async () => {
    const before = await db
      .selectFrom('inspection')
      .select((eb) => eb.fn.countAll<number>().as('n'))
      .where('fleetId', '=', f.fleet.id)
      .executeTakeFirstOrThrow();
    const attempts: Record<string, string>[] = [
      { origin: 'https://evil.example' },
      { origin: 'null' },
      { 'sec-fetch-site': 'cross-site', origin: 'http://127.0.0.1:3100' },
      { 'sec-fetch-site': 'same-site' },
    ];
    for (const headers of attempts) {
      const res = await post(headers);
      expect(res.status, JSON.stringify(headers)).toBe(403);
      expect((await readError(res)).message).toMatch(/another site/);
    }
    const after = await db
      .selectFrom('inspection')
      .select((eb) => eb.fn.countAll<number>().as('n'))
      .where('fleetId', '=', f.fleet.id)
      .executeTakeFirstOrThrow();
    expect(Number(after.n)).toBe(Number(before.n));
  });

  it('accepts a write from our own pages, and a client that is not a browser', async () => {
    expect((await post({ origin: 'http://127.0.0.1:3100', 'sec-fetch-site': 'same-origin' })).status).toBe(201);
    const bare = new Request('http://127.0.0.1:3100/api/inspections', {
      method: 'POST',
      headers: { cookie: f.cookies.driver, 'content-type': 'application/json' },
      body: JSON.stringify(startBody()),
    });
    expect((await callRoute(inspections.POST, bare)).status).toBe(201);
  });

  it('reads are not affected', async () => {
    expect(
      (
        await callRoute(
          me.GET,
          makeRequest('/api/me', { cookie: f.cookies.driver, headers: { 'sec-fetch-site': 'cross-site' } }),
        )
      ).status,
    ).toBe(200);
  });
});

describe('a signed report', () => {
  it('refuses any new step with 409 and logs the attempt', async () => {
    const { id } = await makeSignedReport(db, f);
    const stepId = randomUUID();
    const res = await postStep(f, id, {
      id: stepId,
      seq: 9,
      zone: 'rear',
      kind: 'defect',
      termKey: 'horn:inoperative',
    });
    expect(res.status).toBe(409);
    expect((await readError(res)).message).toMatch(/signed and locked/);
    const logged = await db
      .selectFrom('auditLog')
      .select(['action', 'actorId', 'detail'])
      .where('entityId', '=', id)
      .where('action', '=', 'inspection.change_refused')
      .execute();
    expect(logged).toHaveLength(1);
    expect(logged[0]!.actorId).toBe(f.users.driver.id);
    expect(
      await db.selectFrom('inspectionStep').select('id').where('id', '=', stepId).executeTakeFirst(),
    ).toBeUndefined();
  });

  it('checks out when untouched, and says so loudly when a row was changed behind its back', async () => {
    const { id, stepIds } = await makeSignedReport(db, f);
    const clean = await checkReportIntegrity({ fleetId: f.fleet.id, inspectionId: id });
    expect(clean).toMatchObject({ ok: true, signed: true });
    expect(clean.computed).toBe(clean.stored);

    // Someone with database access turns the defect into an OK.
    await sql`update inspection_step set kind = 'ok', severity = null where id = ${stepIds[2]!}`.execute(db);
    const tampered = await checkReportIntegrity({ fleetId: f.fleet.id, inspectionId: id });
    expect(tampered.ok).toBe(false);
    expect(tampered.computed).not.toBe(tampered.stored);
    expect(tampered.message).toMatch(/^WARNING: this report does not match what the driver signed/);
  });

  it('a changed header, an added step or a deleted step are caught too', async () => {
    for (const tamper of [
      (id: string) => sql`update inspection set odometer = odometer + 1 where id = ${id}`,
      (id: string) => sql`update inspection set signature_name = 'Someone Else' where id = ${id}`,
      (id: string, steps: string[]) => sql`delete from inspection_step where id = ${steps[0]!}`,
    ]) {
      const { id, stepIds } = await makeSignedReport(db, f);
      await tamper(id, stepIds).execute(db);
      expect((await checkReportIntegrity({ fleetId: f.fleet.id, inspectionId: id })).ok).toBe(false);
    }
  });

  it("another fleet's report is not found", async () => {
    const { id } = await makeSignedReport(db, f);
    const other = await makeFleetFixture(db, 'Other security fleet');
    await expect(checkReportIntegrity({ fleetId: other.fleet.id, inspectionId: id })).rejects.toMatchObject({
      code: 'not_found',
    });
  });
});
