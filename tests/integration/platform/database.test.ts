import { sql } from 'kysely';
import { afterAll, describe, expect, it } from 'vitest';
import { makeFleet, makeUnit, makeUser } from '../../../db/factories';
import { getDb, getStepDb } from '@/lib/db';
import { getTestDb } from '../../setup/test-db';

const db = getTestDb();
afterAll(() => db.destroy());

describe('PostgreSQL through Kysely', () => {
  it('writes a fleet, a user and a unit, and reads them back camel-cased', async () => {
    const fleet = await makeFleet(db, { name: 'Gravel Road Haulers' });
    const user = await makeUser(db, { fleetId: fleet.id, roles: ['driver', 'mechanic'], name: 'Ada Test' });
    await makeUnit(db, { fleetId: fleet.id, kind: 'tractor', unitNumber: '901', year: 2020 });

    const row = await db
      .selectFrom('appUser')
      .innerJoin('fleet', 'fleet.id', 'appUser.fleetId')
      .select(['appUser.name', 'appUser.roles', 'fleet.name as fleetName', 'fleet.minPretripMinutes'])
      .where('appUser.id', '=', user.id)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({
      name: 'Ada Test',
      roles: ['driver', 'mechanic'],
      fleetName: 'Gravel Road Haulers',
      minPretripMinutes: 15,
    });

    const units = await db
      .selectFrom('unit')
      .select(['unitNumber', 'status', 'year'])
      .where('fleetId', '=', fleet.id)
      .execute();
    expect(units).toEqual([{ unitNumber: '901', status: 'in_service', year: 2020 }]);
  });

  it('commits an open walk’s steps without waiting for the disk, and everything else waiting for it', async () => {
    // Signing runs on getDb: its commit waits, and makes the steps before it durable too.
    const mode = async (d: typeof db) =>
      (await sql<{ synchronous_commit: string }>`show synchronous_commit`.execute(d)).rows[0];
    expect(await mode(getStepDb())).toEqual({ synchronousCommit: 'off' });
    expect(await mode(getDb())).toEqual({ synchronousCommit: 'on' });
  });

  it('refuses a role that does not exist', async () => {
    const fleet = await makeFleet(db);
    await expect(makeUser(db, { fleetId: fleet.id, roles: ['captain' as never] })).rejects.toThrow(
      /app_user_roles_known/,
    );
  });

  it('keeps the audit log append-only', async () => {
    const fleet = await makeFleet(db);
    const { id } = await db
      .insertInto('auditLog')
      .values({ fleetId: fleet.id, action: 'test', entity: 'fleet', entityId: fleet.id })
      .returning('id')
      .executeTakeFirstOrThrow();
    expect(typeof id).toBe('number');
    await expect(db.updateTable('auditLog').set({ action: 'forged' }).where('id', '=', id).execute()).rejects.toThrow(
      /append-only/,
    );
    await expect(db.deleteFrom('auditLog').where('id', '=', id).execute()).rejects.toThrow(/append-only/);
  });

  it('is on the test database', async () => {
    const { rows } = await sql<{ db: string }>`select current_database() as db`.execute(db);
    expect(rows[0]?.db).toMatch(/_test$/);
  });
});
