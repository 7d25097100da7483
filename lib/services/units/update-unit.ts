import 'server-only';
import { getDb } from '@/lib/db';
import { findFleetUnit, findUnitByNumber, updateFleetUnitRow, type UnitFields } from '@/lib/db/units';
import { AppError } from '@/lib/errors';
import { findAxleProblems, type UnitDto } from '@/lib/schemas/units';
import { unitNumberTaken } from './create-unit';
import { diffFields, isUniqueViolation, recordAdminAudit } from '../platform/record-admin-audit';

/** Edit a unit's number, plate, VIN, make/model/year or axle layout. Retired units are read-only. */
export async function updateUnit(
  opts: { fleetId: string; actorId: string; unitId: string } & Partial<UnitFields>,
): Promise<{ unit: UnitDto }> {
  const { fleetId, actorId, unitId, ...change } = opts;
  try {
    return await getDb()
      .transaction()
      .execute(async (trx) => {
        const before = await findFleetUnit(trx, { fleetId, id: unitId });
        if (!before) throw new AppError('not_found', 'There is no such unit in this fleet.');
        if (before.retiredAt)
          throw new AppError('conflict', `Unit ${before.unitNumber} is retired; its record can no longer change.`);

        const axles = change.axles ?? before.axles;
        const axleProblems = findAxleProblems(before.kind, axles);
        if (Object.keys(axleProblems).length)
          throw new AppError('invalid_body', Object.values(axleProblems)[0]![0]!, axleProblems);
        const plate = change.plate !== undefined ? change.plate : before.plate;
        const jurisdiction =
          change.plateJurisdiction !== undefined ? change.plateJurisdiction : before.plateJurisdiction;
        if (plate && !jurisdiction) {
          const message = 'Pick the state or province that issued this plate.';
          throw new AppError('invalid_body', message, { plateJurisdiction: [message] });
        }

        if (change.unitNumber !== undefined && change.unitNumber !== before.unitNumber) {
          const taken = await findUnitByNumber(trx, { fleetId, unitNumber: change.unitNumber });
          if (taken) throw unitNumberTaken(change.unitNumber, taken.retiredAt !== null);
        }
        const changes = diffFields(before, change);
        if (Object.keys(changes).length === 0) return { unit: before };
        const set = Object.fromEntries(
          Object.keys(changes).map((k) => [k, change[k as keyof UnitFields]]),
        ) as Partial<UnitFields>;
        const unit = await updateFleetUnitRow(trx, { fleetId, id: unitId, set });
        if (!unit) throw new AppError('not_found', 'There is no such unit in this fleet.');
        await recordAdminAudit(trx, {
          fleetId,
          actorId,
          action: 'unit.updated',
          entity: 'unit',
          entityId: unitId,
          detail: { unitNumber: unit.unitNumber, changes },
        });
        return { unit };
      });
  } catch (err) {
    if (isUniqueViolation(err, 'unit_fleet_number_key') && change.unitNumber)
      throw unitNumberTaken(change.unitNumber, false);
    throw err;
  }
}
