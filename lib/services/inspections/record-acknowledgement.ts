import 'server-only';
import { getDb } from '@/lib/db';
import { findFleetSettings } from '@/lib/db/fleets';
import { findFleetUnit } from '@/lib/db/units';
import { AppError } from '@/lib/errors';
import { idTakenError } from '../platform/id-taken';
import { isUniqueViolation } from '../platform/record-admin-audit';
import type { AcknowledgeBody } from '@/lib/schemas/inspections';
import { isSameSignerName, signerNameMessage } from '@/lib/walk';
import { findUnitReview } from './find-unit-review';
import { recordAudit } from '../platform/record-audit';

export const acknowledgementStatement =
  'I reviewed the last inspection report of this unit and the repair certification of its defects.';

/** The driver's signature that they reviewed the unit's last report (49 CFR 396.13(c)). Idempotent by id. */
export async function recordAcknowledgement({
  fleetId,
  actorId,
  actorName,
  body,
}: {
  fleetId: string;
  actorId: string;
  actorName: string;
  body: AcknowledgeBody;
}) {
  return recordAcknowledgementRow({ fleetId, actorId, actorName, body }).catch((err: unknown) => {
    // An id taken in another fleet fails the insert: the same answer as any taken id.
    if (isUniqueViolation(err, 'acknowledgement_pkey')) throw idTakenError();
    throw err;
  });
}

function recordAcknowledgementRow({
  fleetId,
  actorId,
  actorName,
  body,
}: {
  fleetId: string;
  actorId: string;
  actorName: string;
  body: AcknowledgeBody;
}) {
  return getDb()
    .transaction()
    .execute(async (trx) => {
      const existing = await trx
        .selectFrom('acknowledgement')
        .select(['id', 'reviewedInspectionId', 'unitId', 'acknowledgedAt'])
        .where('id', '=', body.id)
        .where('fleetId', '=', fleetId)
        .executeTakeFirst();
      if (existing) return { acknowledgement: existing, created: false };
      const unit = await findFleetUnit(trx, { fleetId, id: body.unitId });
      if (!unit) throw new AppError('not_found', 'No such unit in your fleet.');
      const fleet = await findFleetSettings(trx, { fleetId });
      const review = await findUnitReview(trx, {
        fleetId,
        unitId: unit.id,
        driverId: actorId,
        profile: fleet?.ruleProfile ?? 'us-federal',
      });
      if (!review.report || review.report.id !== body.reviewedInspectionId) {
        throw new AppError(
          'conflict',
          `That is no longer the last report of unit ${unit.unitNumber}; review the newest one.`,
        );
      }
      if (!isSameSignerName(body.signatureName, actorName)) {
        throw new AppError('invalid_body', signerNameMessage(actorName), {
          signatureName: [`Type ${actorName}.`],
        });
      }
      const acknowledgement = await trx
        .insertInto('acknowledgement')
        .values({
          id: body.id,
          fleetId,
          unitId: unit.id,
          reviewedInspectionId: body.reviewedInspectionId,
          driverId: actorId,
          signatureName: body.signatureName.trim(),
          statement: acknowledgementStatement,
        })
        .returning(['id', 'reviewedInspectionId', 'unitId', 'acknowledgedAt'])
        .executeTakeFirstOrThrow();
      await recordAudit(trx, {
        fleetId,
        actorId,
        action: 'report.acknowledge',
        entity: 'inspection',
        entityId: body.reviewedInspectionId,
        detail: { unit: unit.unitNumber, uncertified: review.uncertified },
      });
      return { acknowledgement, created: true };
    });
}
