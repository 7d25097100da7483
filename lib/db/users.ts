import 'server-only';
import { isRole, roles, type Role } from '@/lib/auth/roles';
import type { AdminUser } from '@/lib/schemas/users';
import { getDb, type DB } from './index';

export async function findUserForSignIn(email: string) {
  return getDb()
    .selectFrom('appUser')
    .select([
      'id',
      'fleetId',
      'email',
      'name',
      'passwordHash',
      'roles',
      'active',
      'mustChangePassword',
      'temporaryPasswordExpiresAt',
      'sessionVersion',
    ])
    .where('email', '=', email.toLowerCase())
    .executeTakeFirst();
}

export async function recordSignIn(userId: string) {
  await getDb().updateTable('appUser').set({ lastSignInAt: new Date() }).where('id', '=', userId).execute();
}

/**
 * An active user's identity, roles and fleet, with the session version their sessions must carry
 * and whether a temporary password is still to be replaced: read on every request.
 */
export async function findActiveUser(userId: string) {
  return getDb()
    .selectFrom('appUser')
    .select(['id', 'fleetId', 'email', 'name', 'roles', 'sessionVersion', 'mustChangePassword'])
    .where('id', '=', userId)
    .where('active', '=', true)
    .executeTakeFirst();
}

// ---- admin: people of one fleet (every query scoped by fleet)

const adminUserColumns = [
  'id',
  'name',
  'email',
  'roles',
  'active',
  'mustChangePassword',
  'lastSignInAt',
  'createdAt',
] as const;

type AdminUserRow = {
  id: string;
  name: string;
  email: string;
  roles: string[];
  active: boolean;
  mustChangePassword: boolean;
  lastSignInAt: Date | null;
  createdAt: Date;
};

/** A user row as the admin API returns it: dates as ISO strings, known roles only. */
export function toAdminUser(row: AdminUserRow): AdminUser {
  return {
    ...row,
    roles: row.roles.filter(isRole),
    lastSignInAt: row.lastSignInAt ? row.lastSignInAt.toISOString() : null,
    createdAt: row.createdAt.toISOString(),
  };
}

/** Everyone in a fleet, active first, then by name. */
export async function listFleetUsers(db: DB, { fleetId }: { fleetId: string }): Promise<AdminUser[]> {
  const rows = await db
    .selectFrom('appUser')
    .select(adminUserColumns)
    .where('fleetId', '=', fleetId)
    .orderBy('active', 'desc')
    .orderBy('name')
    .execute();
  return rows.map(toAdminUser);
}

/** One user of this fleet; undefined when absent or in another fleet. */
export async function findFleetUser(
  db: DB,
  { fleetId, id }: { fleetId: string; id: string },
): Promise<AdminUser | undefined> {
  const row = await db
    .selectFrom('appUser')
    .select(adminUserColumns)
    .where('fleetId', '=', fleetId)
    .where('id', '=', id)
    .executeTakeFirst();
  return row ? toAdminUser(row) : undefined;
}

/** Whether any account (in any fleet: sign-in e-mails are unique) uses this address. */
export async function isEmailTaken(db: DB, { email }: { email: string }): Promise<boolean> {
  const row = await db.selectFrom('appUser').select('id').where('email', '=', email.toLowerCase()).executeTakeFirst();
  return row !== undefined;
}

export async function insertFleetUser(
  db: DB,
  u: {
    fleetId: string;
    name: string;
    email: string;
    roles: Role[];
    passwordHash: string;
    mustChangePassword: boolean;
    temporaryPasswordExpiresAt?: Date | null;
  },
): Promise<AdminUser> {
  const row = await db
    .insertInto('appUser')
    .values({ ...u, email: u.email.toLowerCase() })
    .returning(adminUserColumns)
    .executeTakeFirstOrThrow();
  return toAdminUser(row);
}

export async function updateFleetUserRow(
  db: DB,
  { fleetId, id, set }: { fleetId: string; id: string; set: { name?: string; roles?: Role[]; active?: boolean } },
): Promise<AdminUser | undefined> {
  const row = await db
    .updateTable('appUser')
    .set(set)
    .where('fleetId', '=', fleetId)
    .where('id', '=', id)
    .returning(adminUserColumns)
    .executeTakeFirst();
  return row ? toAdminUser(row) : undefined;
}

/** How many active users of a fleet hold each role, and how many are inactive. */
export async function countFleetUsers(db: DB, { fleetId }: { fleetId: string }) {
  const rows = await db.selectFrom('appUser').select(['roles', 'active']).where('fleetId', '=', fleetId).execute();
  const byRole = Object.fromEntries(roles.map((r) => [r, 0])) as Record<Role, number>;
  let active = 0;
  for (const r of rows) {
    if (!r.active) continue;
    active += 1;
    for (const role of r.roles.filter(isRole)) byRole[role] += 1;
  }
  return { active, inactive: rows.length - active, byRole };
}

/** End every session of this user: each one carries the old version and is refused from now on. */
export async function bumpSessionVersion(db: DB, { userId }: { userId: string }): Promise<number> {
  const row = await db
    .updateTable('appUser')
    .set((eb) => ({ sessionVersion: eb('sessionVersion', '+', 1), updatedAt: new Date() }))
    .where('id', '=', userId)
    .returning('sessionVersion')
    .executeTakeFirst();
  return row?.sessionVersion ?? 0;
}
