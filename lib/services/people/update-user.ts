import 'server-only';
import type { Role } from '@/lib/auth/roles';
import { getDb } from '@/lib/db';
import { bumpSessionVersion, findFleetUser, updateFleetUserRow } from '@/lib/db/users';
import { AppError } from '@/lib/errors';
import type { AdminUser } from '@/lib/schemas/users';
import { recordAdminAudit } from '../platform/record-admin-audit';

/**
 * Rename a user, change their roles, or deactivate / reactivate them. Nobody is deleted.
 * An admin cannot lock themselves out: no deactivating yourself, no dropping your own admin role.
 */
export async function updateUser(opts: {
  fleetId: string;
  actorId: string;
  userId: string;
  name?: string;
  roles?: Role[];
  active?: boolean;
}): Promise<{ user: AdminUser }> {
  const { fleetId, actorId, userId } = opts;
  const self = userId === actorId;
  if (self && opts.active === false) {
    throw new AppError('conflict', 'You cannot deactivate your own account. Another admin can do it.', {
      active: ['You cannot deactivate your own account.'],
    });
  }
  if (self && opts.roles && !opts.roles.includes('admin')) {
    throw new AppError('conflict', 'You cannot remove your own admin role. Another admin can do it.', {
      roles: ['You cannot remove your own admin role.'],
    });
  }
  return getDb()
    .transaction()
    .execute(async (trx) => {
      const before = await findFleetUser(trx, { fleetId, id: userId });
      if (!before) throw new AppError('not_found', 'There is no such user in this fleet.');
      const set: { name?: string; roles?: Role[]; active?: boolean } = {};
      if (opts.name !== undefined && opts.name !== before.name) set.name = opts.name;
      if (opts.roles !== undefined && opts.roles.join(',') !== before.roles.join(',')) set.roles = opts.roles;
      if (opts.active !== undefined && opts.active !== before.active) set.active = opts.active;
      if (Object.keys(set).length === 0) return { user: before };

      const user = await updateFleetUserRow(trx, { fleetId, id: userId, set });
      if (!user) throw new AppError('not_found', 'There is no such user in this fleet.');
      const audit = (action: string, detail: Record<string, unknown>) =>
        recordAdminAudit(trx, {
          fleetId,
          actorId,
          action,
          entity: 'app_user',
          entityId: userId,
          detail: { email: before.email, ...detail },
        });
      if (set.name !== undefined) await audit('user.renamed', { from: before.name, to: set.name });
      if (set.roles !== undefined) await audit('user.roles_changed', { from: before.roles, to: set.roles });
      if (set.active !== undefined) await audit(set.active ? 'user.reactivated' : 'user.deactivated', {});
      // New roles or a deactivation end the person's sessions: they sign in again and get what
      // they now hold (and a reactivation does not bring an old session back).
      if (set.roles !== undefined || set.active !== undefined) await bumpSessionVersion(trx, { userId });
      return { user };
    });
}
