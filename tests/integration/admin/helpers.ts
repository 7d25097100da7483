// Shared set-up for the admin integration tests: a fresh fleet with an admin and a driver.
import { randomUUID } from 'node:crypto';
import { makeFleet, makeUnit, makeUser } from '../../../db/factories';
import { computeVinCheckDigit } from '../../../lib/schemas/units';
import { sessionCookieFor } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';

export async function makeAdminFleet() {
  const db = getTestDb();
  const fleet = await makeFleet(db);
  const admin = await makeUser(db, { fleetId: fleet.id, roles: ['admin'], name: 'Admin Tester' });
  const driver = await makeUser(db, { fleetId: fleet.id, roles: ['driver'], name: 'Driver Tester' });
  return {
    fleet,
    admin,
    driver,
    adminCookie: await sessionCookieFor({ ...admin, roles: ['admin'] }),
    driverCookie: await sessionCookieFor({ ...driver, roles: ['driver'] }),
  };
}

export const makeTractor = (fleetId: string, over: { unitNumber?: string } = {}) =>
  makeUnit(getTestDb(), {
    fleetId,
    kind: 'tractor',
    unitNumber: over.unitNumber ?? `T${randomUUID().slice(0, 6).toUpperCase()}`,
    axles: JSON.stringify(tractorAxles),
  });

export const tractorAxles = [
  { position: 'steer', tires: ['LF', 'RF'], coldPsi: 110, chamber: '24' },
  { position: 'drive', tires: ['L2O', 'L2I', 'R2I', 'R2O'], coldPsi: 100, chamber: '30L' },
  { position: 'drive', tires: ['L3O', 'L3I', 'R3I', 'R3O'], coldPsi: 100, chamber: '30L' },
];

export const trailerAxles = [
  { position: 'trailer', tires: ['L1O', 'L1I', 'R1I', 'R1O'], coldPsi: 100, chamber: '30L' },
  { position: 'trailer', tires: ['L2O', 'L2I', 'R2I', 'R2O'], coldPsi: 100, chamber: '30L' },
];

/** A VIN with a correct check digit in position 9, built from 16 other characters. */
export function makeVin(seed = randomUUID().replace(/-/g, '').toUpperCase()): string {
  const chars = seed
    .replace(/[^A-HJ-NPR-Z0-9]/g, '')
    .padEnd(16, '7')
    .slice(0, 16);
  const draft = `${chars.slice(0, 8)}0${chars.slice(8)}`;
  return `${draft.slice(0, 8)}${computeVinCheckDigit(draft)}${draft.slice(9)}`;
}

export function catcherUrl(): string {
  const url = process.env.MAIL_CATCHER_URL;
  if (!url) throw new Error('MAIL_CATCHER_URL is not set');
  return url;
}

export type CaughtMessage = { id: string; subject: string; to: string[]; text: string; html: string };

/** The newest message the catcher holds for this address, with its bodies. */
export async function waitForMailTo(to: string, ms = 5000): Promise<CaughtMessage | null> {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    const res = await fetch(`${catcherUrl()}/messages?to=${encodeURIComponent(to)}`);
    const { messages } = (await res.json()) as { messages: { id: string }[] };
    if (messages[0]) return (await (await fetch(`${catcherUrl()}/messages/${messages[0].id}`)).json()) as CaughtMessage;
    await new Promise((r) => setTimeout(r, 100));
  }
  return null;
}

export async function auditRows(entityId: string) {
  return getTestDb()
    .selectFrom('auditLog')
    .select(['action', 'entity', 'entityId', 'actorId', 'fleetId', 'detail'])
    .where('entityId', '=', entityId)
    .orderBy('id')
    .execute();
}
