import 'server-only';
import { getDb } from './index';

export async function findUserForSignIn(email: string) {
  return getDb()
    .selectFrom('appUser')
    .select(['id', 'fleetId', 'email', 'name', 'passwordHash', 'roles', 'active'])
    .where('email', '=', email.toLowerCase())
    .executeTakeFirst();
}

export async function recordSignIn(userId: string) {
  await getDb().updateTable('appUser').set({ lastSignInAt: new Date() }).where('id', '=', userId).execute();
}

/** An active user's identity, roles and fleet: read on every API request. */
export async function findActiveUser(userId: string) {
  return getDb()
    .selectFrom('appUser')
    .select(['id', 'fleetId', 'email', 'name', 'roles'])
    .where('id', '=', userId)
    .where('active', '=', true)
    .executeTakeFirst();
}
