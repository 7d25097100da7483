import 'server-only';
import { getDb } from '@/lib/db';
import { findUnitByNumber, insertFleetUnit, type UnitFields } from '@/lib/db/units';
import { AppError } from '@/lib/errors';
import type { UnitDto, UnitKind } from '@/lib/schemas/units';
import { isUniqueViolation, recordAdminAudit } from '../platform/record-admin-audit';

export function unitNumberTaken(unitNumber: string, retired: boolean): AppError {
  const message = retired
    ? `Unit number ${unitNumber} belonged to a retired unit; numbers are not reused. Pick another.`
    : `Unit number ${unitNumber} is already in use in this fleet.`;
  return new AppError('conflict', message, { unitNumber: [message] });
}

/** Add a tractor or trailer to the fleet. */
export async function createUnit(
  opts: { fleetId: string; actorId: string; kind: UnitKind } & UnitFields,
): Promise<{ unit: UnitDto }> {
  const { fleetId, actorId, ...fields } = opts;
  try {
    return await getDb()
      .transaction()
      .execute(async (trx) => {
        const taken = await findUnitByNumber(trx, { fleetId, unitNumber: fields.unitNumber });
        if (taken) throw unitNumberTaken(fields.unitNumber, taken.retiredAt !== null);
        const unit = await insertFleetUnit(trx, { fleetId, ...fields });
        await recordAdminAudit(trx, {
          fleetId,
          actorId,
          action: 'unit.created',
          entity: 'unit',
          entityId: unit.id,
          detail: { kind: unit.kind, unitNumber: unit.unitNumber, vin: unit.vin, axles: unit.axles.length },
        });
        return { unit };
      });
  } catch (err) {
    if (isUniqueViolation(err, 'unit_fleet_number_key')) throw unitNumberTaken(fields.unitNumber, false);
    throw err;
  }
}
