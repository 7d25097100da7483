import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { GET as getFleet, PATCH as patchFleet } from '@/app/api/admin/fleet/route';
import { fleetSettingsSchema } from '@/lib/schemas/fleet';
import { parseJson, readError } from '../../setup/read-json';
import { callRoute, makeRequest } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';
import { auditRows, makeAdminFleet } from './helpers';

const db = getTestDb();
afterAll(() => db.destroy());

let ctx: Awaited<ReturnType<typeof makeAdminFleet>>;
beforeEach(async () => {
  ctx = await makeAdminFleet();
});

const fleetBodySchema = z.object({ fleet: fleetSettingsSchema });

const patch = (json: unknown, cookie = ctx.adminCookie) =>
  callRoute(patchFleet, makeRequest('/api/admin/fleet', { method: 'PATCH', cookie, json }));

describe('fleet settings', () => {
  it('reads the defaults of a new fleet', async () => {
    const res = await callRoute(getFleet, makeRequest('/api/admin/fleet', { cookie: ctx.adminCookie }));
    expect(res.status).toBe(200);
    expect((await parseJson(res, fleetBodySchema)).fleet).toMatchObject({
      id: ctx.fleet.id,
      minPretripMinutes: 15,
      minPosttripMinutes: 5,
      tirePressureTargets: { steer: 110, drive: 100, trailer: 100 },
      ruleProfile: 'us-federal',
      maintenanceEmail: null,
      supervisorEmail: null,
    });
  });

  it('changes the settings and records each change with before and after', async () => {
    const res = await patch({
      minPretripMinutes: 20,
      tirePressureTargets: { steer: 115, drive: 100, trailer: 95 },
      ruleProfile: 'ca-nsc13',
      maintenanceEmail: 'Shop@Test.Example',
      supervisorEmail: '',
    });
    expect(res.status).toBe(200);
    expect((await parseJson(res, fleetBodySchema)).fleet).toMatchObject({
      minPretripMinutes: 20,
      ruleProfile: 'ca-nsc13',
      maintenanceEmail: 'shop@test.example',
      supervisorEmail: null,
    });
    const [row, ...more] = await auditRows(ctx.fleet.id);
    expect(more).toEqual([]);
    expect(row).toMatchObject({
      action: 'fleet.settings_changed',
      entity: 'fleet',
      actorId: ctx.admin.id,
      detail: {
        changes: {
          minPretripMinutes: { from: 15, to: 20 },
          tirePressureTargets: {
            from: { steer: 110, drive: 100, trailer: 100 },
            to: { steer: 115, drive: 100, trailer: 95 },
          },
          ruleProfile: { from: 'us-federal', to: 'ca-nsc13' },
          maintenanceEmail: { from: null, to: 'shop@test.example' },
        },
      },
    });
  });

  it('explains out-of-range values beside each field (422) and keeps the old ones', async () => {
    const res = await patch({
      minPretripMinutes: 300,
      minPosttripMinutes: -1,
      tirePressureTargets: { steer: 20, drive: 100.5, trailer: 200 },
      ruleProfile: 'mars',
      maintenanceEmail: 'shop',
    });
    expect(res.status).toBe(422);
    const { fields } = await readError(res);
    expect(fields).toMatchObject({
      minPretripMinutes: ['Keep the minimum pre-trip time at 240 minutes (4 hours) or less.'],
      minPosttripMinutes: ['Minutes cannot be negative.'],
      'tirePressureTargets.steer': ['A steer target below 50 psi is not a truck tire pressure.'],
      'tirePressureTargets.drive': ['Enter the drive target as whole psi.'],
      'tirePressureTargets.trailer': ['A trailer target above 150 psi is more than truck tires are built for.'],
      ruleProfile: ['Pick one of the rule profiles in the list.'],
    });
    expect(fields?.maintenanceEmail).toContain('Enter an e-mail address like name@company.com.');
    const row = await db
      .selectFrom('fleet')
      .select(['minPretripMinutes', 'ruleProfile'])
      .where('id', '=', ctx.fleet.id)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({ minPretripMinutes: 15, ruleProfile: 'us-federal' });
    expect(await auditRows(ctx.fleet.id)).toEqual([]);
  });

  it('sets the fleet time zone from IANA names and refuses a zone it does not know (422)', async () => {
    const ok = await patch({ timezone: 'America/Halifax' });
    expect(ok.status).toBe(200);
    expect((await parseJson(ok, fleetBodySchema)).fleet.timezone).toBe('America/Halifax');
    const bad = await patch({ timezone: 'Mars/Olympus_Mons' });
    expect(bad.status).toBe(422);
    expect((await readError(bad)).fields?.timezone).toEqual([
      'Pick the time zone from the list (a name such as America/Chicago).',
    ]);
    const row = await db
      .selectFrom('fleet')
      .select('timezone')
      .where('id', '=', ctx.fleet.id)
      .executeTakeFirstOrThrow();
    expect(row.timezone).toBe('America/Halifax');
  });

  it("touches only the admin's own fleet", async () => {
    const other = await makeAdminFleet();
    await patch({ minPretripMinutes: 30 });
    const theirs = await db
      .selectFrom('fleet')
      .select('minPretripMinutes')
      .where('id', '=', other.fleet.id)
      .executeTakeFirstOrThrow();
    expect(theirs.minPretripMinutes).toBe(15);
  });
});
