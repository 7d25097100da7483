import 'server-only';
import { getDb } from '@/lib/db';
import { findFleetUnit, updateFleetUnitRow } from '@/lib/db/units';
import { AppError } from '@/lib/errors';
import type { UnitDto } from '@/lib/schemas/units';
import { recordAdminAudit } from '../platform/record-admin-audit';

/**
 * Take a unit out of the fleet for good: it keeps its records and its number, and can no
 * longer be picked for a new inspection. Nothing is deleted.
 */
export async function retireUnit(opts: {
  fleetId: string;
  actorId: string;
  unitId: string;
  reason?: string | null;
}): Promise<{ unit: UnitDto }> {
  const { fleetId, actorId, unitId } = opts;
  return getDb()
    .transaction()
    .execute(async (trx) => {
      const before = await findFleetUnit(trx, { fleetId, id: unitId });
      if (!before) throw new AppError('not_found', 'There is no such unit in this fleet.');
      if (before.retiredAt) throw new AppError('conflict', `Unit ${before.unitNumber} is already retired.`);
      const unit = await updateFleetUnitRow(trx, { fleetId, id: unitId, set: { retiredAt: new Date() } });
      if (!unit) throw new AppError('not_found', 'There is no such unit in this fleet.');
      await recordAdminAudit(trx, {
        fleetId,
        actorId,
        action: 'unit.retired',
        entity: 'unit',
        entityId: unitId,
        detail: { unitNumber: unit.unitNumber, kind: unit.kind, reason: opts.reason ?? null },
      });
      return { unit };
    });
}
