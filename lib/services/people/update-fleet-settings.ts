import 'server-only';
import { getDb } from '@/lib/db';
import { findFleetSettings, updateFleetSettingsRow, type FleetSettingsChange } from '@/lib/db/fleets';
import { AppError } from '@/lib/errors';
import type { FleetSettings } from '@/lib/schemas/fleet';
import { diffFields, recordAdminAudit } from '../platform/record-admin-audit';

/** Change the fleet's minimum inspection times, default tire pressures, rule profile or mail addresses. */
export async function updateFleetSettings(
  opts: { fleetId: string; actorId: string } & FleetSettingsChange,
): Promise<{ fleet: FleetSettings }> {
  const { fleetId, actorId, ...change } = opts;
  return getDb()
    .transaction()
    .execute(async (trx) => {
      const before = await findFleetSettings(trx, { fleetId });
      if (!before) throw new AppError('not_found', 'This fleet no longer exists.');
      const changes = diffFields(before, change);
      if (Object.keys(changes).length === 0) return { fleet: before };
      const set = Object.fromEntries(
        Object.keys(changes).map((k) => [k, change[k as keyof FleetSettingsChange]]),
      ) as FleetSettingsChange;
      const fleet = await updateFleetSettingsRow(trx, { fleetId, set });
      if (!fleet) throw new AppError('not_found', 'This fleet no longer exists.');
      await recordAdminAudit(trx, {
        fleetId,
        actorId,
        action: 'fleet.settings_changed',
        entity: 'fleet',
        entityId: fleetId,
        detail: { changes },
      });
      return { fleet };
    });
}
