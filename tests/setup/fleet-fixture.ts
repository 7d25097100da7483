import { makeFleet, makeInspection, makeUnit, makeUser } from '../../db/factories';
import { roles, type Role } from '../../lib/auth/roles';
import { sessionCookieFor } from './session';
import type { DB } from '../../db/connect';

export type FleetFixture = Awaited<ReturnType<typeof makeFleetFixture>>;

/** A fresh fleet with one user per role (and their session cookies), a tractor, a trailer and a report. */
export async function makeFleetFixture(db: DB, name = 'Fixture fleet') {
  const fleet = await makeFleet(db, { name });
  const users = {} as Record<Role, Awaited<ReturnType<typeof makeUser>>>;
  const cookies = {} as Record<Role, string>;
  for (const role of roles) {
    users[role] = await makeUser(db, { fleetId: fleet.id, roles: [role], name: `${name} ${role}` });
    cookies[role] = await sessionCookieFor(users[role]);
  }
  const tractor = await makeUnit(db, { fleetId: fleet.id, kind: 'tractor' });
  const trailer = await makeUnit(db, { fleetId: fleet.id, kind: 'trailer' });
  const inspection = await makeInspection(db, {
    fleetId: fleet.id,
    driverId: users.driver.id,
    tractorId: tractor.id,
    trailerId: trailer.id,
  });
  return { fleet, users, cookies, tractor, trailer, inspection };
}
