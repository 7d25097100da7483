import 'server-only';
import { getDb } from '@/lib/db';
import { findFleet, findFleetSettings } from '@/lib/db/fleets';
import { countFleetUnits } from '@/lib/db/units';
import { countFleetUsers } from '@/lib/db/users';
import { AppError } from '@/lib/errors';
import type { AdminSummary } from '@/lib/schemas/admin';

/** What the admin overview shows: people by role, units by state, the current settings. */
export async function getAdminSummary({ fleetId }: { fleetId: string }): Promise<AdminSummary> {
  const db = getDb();
  const [fleet, place, users, units, recent] = await Promise.all([
    findFleetSettings(db, { fleetId }),
    findFleet(db, { fleetId }),
    countFleetUsers(db, { fleetId }),
    countFleetUnits(db, { fleetId }),
    db
      .selectFrom('auditLog')
      .leftJoin('appUser', 'appUser.id', 'auditLog.actorId')
      .select(['auditLog.id', 'auditLog.action', 'auditLog.detail', 'auditLog.createdAt', 'appUser.name as actorName'])
      .where('auditLog.fleetId', '=', fleetId)
      .where('auditLog.entity', 'in', ['app_user', 'unit', 'fleet'])
      .orderBy('auditLog.createdAt', 'desc')
      .orderBy('auditLog.id', 'desc')
      .limit(8)
      .execute(),
  ]);
  if (!fleet) throw new AppError('not_found', 'This fleet no longer exists.');
  return {
    fleet,
    timezone: place?.timezone ?? 'UTC',
    users,
    units,
    recent: recent.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() })),
  };
}
