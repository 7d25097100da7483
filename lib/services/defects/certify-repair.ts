import 'server-only';
import { getDb } from '@/lib/db';
import { listUnitDefectsForStatus, lockDefect } from '@/lib/db/defects';
import { AppError } from '@/lib/errors';
import { renderBackInServiceMail } from '@/lib/mail/templates';
import { getUnitServiceStatus, type DefectRecord } from '@/lib/rules';
import { repairCertificationStatement, type CertifyRepairBody } from '@/lib/schemas/defects';
import { isSameSignerName, signerNameMessage } from '@/lib/walk';
import { appUrl, sendUnitStatusMail } from '../mail/send-unit-status-mail';

type Row = { id: string; unitId: string; severity: string; status: string; certifiedAt: Date | null };

const toRecord = (d: Row): DefectRecord => ({
  id: d.id,
  unitId: d.unitId,
  severity: d.severity === 'major' ? 'major' : 'minor',
  repair:
    d.status === 'open'
      ? null
      : {
          outcome: d.status === 'no_repair_needed' ? 'repair_unnecessary' : 'repaired',
          certifiedAt: d.certifiedAt ?? new Date(),
        },
});

/**
 * The mechanic records the repair (or that none is needed) and certifies it, 49 CFR 396.11(a)(3).
 * The unit's status then follows its open major defects: back in service only when none is open,
 * and that change is mailed to maintenance and the supervisor.
 */
export async function certifyRepair({
  fleetId,
  actorId,
  actorName,
  id,
  body,
}: {
  fleetId: string;
  actorId: string;
  /** The signed-in mechanic's name: the certification is signed with it and no other. */
  actorName: string;
  id: string;
  body: CertifyRepairBody;
}) {
  if (!isSameSignerName(body.certifiedName, actorName))
    throw new AppError('invalid_body', signerNameMessage(actorName), { certifiedName: [`Type ${actorName}.`] });
  const at = new Date();
  // A work order: this defect and any other open ones of the same unit, signed once.
  const ids = [...new Set([id, ...(body.togetherWith ?? [])])];
  const result = await getDb()
    .transaction()
    .execute(async (trx) => {
      const locked = [];
      for (const one of ids) {
        const defect = await lockDefect(trx, { fleetId, id: one });
        if (!defect)
          throw new AppError(
            'not_found',
            one === id ? 'No such defect in your fleet.' : `No such defect in your fleet: ${one}.`,
          );
        if (defect.status !== 'open')
          throw new AppError(
            'conflict',
            ids.length > 1
              ? `“${defect.description}” is already certified; take it out of the work order. A certification is part of the record and is not changed.`
              : 'This defect is already certified; a certification is part of the record and is not changed.',
          );
        locked.push(defect);
      }
      const defect = locked[0]!;
      const stranger = locked.find((d) => d.unitId !== defect.unitId);
      if (stranger)
        throw new AppError(
          'invalid_body',
          `A work order covers one unit: “${stranger.description}” is on another unit. Certify it from its own unit.`,
          { togetherWith: ['every defect must be on the same unit'] },
        );
      const { unit, defects } = await listUnitDefectsForStatus(trx, { fleetId, unitId: defect.unitId });
      const before = getUnitServiceStatus(unit.id, defects.map(toRecord));

      await trx
        .updateTable('defect')
        .set({
          status: body.outcome,
          repairWork: body.work || null,
          repairParts: body.parts || null,
          repairNotes: body.notes || null,
          certifiedBy: actorId,
          certifiedName: body.certifiedName,
          certificationText: repairCertificationStatement[body.outcome],
          certifiedAt: at,
        })
        .where('id', 'in', ids)
        .where('fleetId', '=', fleetId)
        .execute();
      const after = getUnitServiceStatus(
        unit.id,
        defects.map((d) => toRecord(ids.includes(d.id) ? { ...d, status: body.outcome, certifiedAt: at } : d)),
      );
      const nextStatus = after.outOfService ? 'out_of_service' : 'in_service';
      const changed = nextStatus !== unit.status;
      if (changed)
        await trx
          .updateTable('unit')
          .set({ status: nextStatus, statusChangedAt: at })
          .where('id', '=', unit.id)
          .execute();
      await trx
        .insertInto('auditLog')
        .values([
          ...ids.map((one) => ({
            fleetId,
            actorId,
            action: 'defect.certified',
            entity: 'defect',
            entityId: one,
            detail: JSON.stringify({
              outcome: body.outcome,
              certifiedName: body.certifiedName,
              ...(ids.length > 1 ? { workOrder: ids } : {}),
            }),
          })),
          ...(changed
            ? [
                {
                  fleetId,
                  actorId,
                  action: `unit.${nextStatus}`,
                  entity: 'unit',
                  entityId: unit.id,
                  detail: JSON.stringify({ afterDefect: id }),
                },
              ]
            : []),
        ])
        .execute();
      const closedMajors = defects.filter(
        (d) =>
          d.severity === 'major' &&
          (ids.includes(d.id) || d.status !== 'open') &&
          before.openMajor.some((m) => m.id === d.id),
      );
      return {
        unit: { id: unit.id, unitNumber: unit.unitNumber, status: nextStatus, changed },
        openMajor: after.openMajor.length,
        openMinor: after.openMinor.length,
        closedMajors,
        inspectionId: defect.inspectionId,
      };
    });

  let mailed: Awaited<ReturnType<typeof sendUnitStatusMail>> | null = null;
  if (result.unit.changed && result.unit.status === 'in_service') {
    const fleet = await getDb().selectFrom('fleet').select('name').where('id', '=', fleetId).executeTakeFirstOrThrow();
    mailed = await sendUnitStatusMail({
      fleetId,
      kind: 'back_in_service',
      mail: renderBackInServiceMail({
        fleetName: fleet.name,
        unitNumber: result.unit.unitNumber,
        defects: result.closedMajors.map((d) => ({
          severity: 'major' as const,
          description: d.description,
          certifiedName: ids.includes(d.id) ? body.certifiedName : d.certifiedName,
          outcome: ids.includes(d.id) ? body.outcome : d.status,
        })),
        certifiedName: body.certifiedName,
        certifiedAt: at.toISOString(),
        defectUrl: appUrl(`/mechanic/defects/${id}`),
      }),
    });
  }
  return {
    id,
    certifiedIds: ids,
    status: body.outcome,
    certifiedName: body.certifiedName,
    certifiedAt: at.toISOString(),
    unit: {
      id: result.unit.id,
      unitNumber: result.unit.unitNumber,
      status: result.unit.status,
      changed: result.unit.changed,
    },
    openMajor: result.openMajor,
    openMinor: result.openMinor,
    mailed: mailed?.sent ?? false,
  };
}
