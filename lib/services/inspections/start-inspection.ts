import 'server-only';
import { getDb } from '@/lib/db';
import { findFleetSettings } from '@/lib/db/fleets';
import { findInspectionForUpdate, findPublishedVocabulary, inspectionHeaderColumns } from '@/lib/db/inspections';
import { findUsableUnit } from '@/lib/db/units';
import { AppError } from '@/lib/errors';
import { idTakenError } from '../platform/id-taken';
import { isUniqueViolation } from '../platform/record-admin-audit';
import type { StartInspectionBody } from '@/lib/schemas/inspections';
import { checkStartTime } from '@/lib/walk';
import { findUnitReview } from './find-unit-review';
import { recordAudit } from '../platform/record-audit';

type Parsed = Omit<StartInspectionBody, 'location' | 'billOfLading' | 'sealNumber'> & {
  location: string | null;
  billOfLading: string | null;
  sealNumber: string | null;
};

/**
 * Open a draft inspection with the id the device chose. Sending the same start again returns the
 * same draft. Before the walk, the driver must have acknowledged the last report of each unit
 * when it listed defects (49 CFR 396.13).
 */
export async function startInspection({ fleetId, actorId, body }: { fleetId: string; actorId: string; body: Parsed }) {
  // The id is unique across fleets: one already taken elsewhere fails the insert, and gets the
  // same answer as one taken here.
  return startInspectionRow({ fleetId, actorId, body }).catch((err: unknown) => {
    if (isUniqueViolation(err, 'inspection_pkey')) throw idTakenError();
    throw err;
  });
}

function startInspectionRow({ fleetId, actorId, body }: { fleetId: string; actorId: string; body: Parsed }) {
  return getDb()
    .transaction()
    .execute(async (trx) => {
      const existing = await findInspectionForUpdate(trx, { fleetId, id: body.id });
      if (existing) {
        if (existing.driverId !== actorId) throw idTakenError();
        return { inspection: existing, created: false };
      }
      const badTime = checkStartTime(body.startedAt, new Date());
      if (badTime) throw new AppError('invalid_body', badTime, { startedAt: [badTime] });
      const tractor = await findUsableUnit(trx, { fleetId, id: body.tractorId, kind: 'tractor' });
      if (!tractor)
        throw new AppError('invalid_body', 'Pick one of your fleet’s tractors in service.', {
          tractorId: ['Pick one of your fleet’s tractors.'],
        });
      const trailer = body.trailerId
        ? await findUsableUnit(trx, { fleetId, id: body.trailerId, kind: 'trailer' })
        : null;
      if (body.trailerId && !trailer)
        throw new AppError('invalid_body', 'Pick one of your fleet’s trailers, or no trailer.', {
          trailerId: ['Pick one of your fleet’s trailers, or no trailer.'],
        });
      const fleet = await findFleetSettings(trx, { fleetId });
      if (!fleet) throw new AppError('not_found', 'Your fleet was not found.');

      for (const unit of [tractor, trailer].filter((u): u is NonNullable<typeof u> => !!u)) {
        const review = await findUnitReview(trx, {
          fleetId,
          unitId: unit.id,
          driverId: actorId,
          profile: fleet.ruleProfile,
        });
        if (review.mustAcknowledge) {
          throw new AppError(
            'conflict',
            `Review and sign the last report of unit ${unit.unitNumber} before you start: it lists defects.`,
          );
        }
      }
      const vocabulary = await findPublishedVocabulary(trx, { fleetId });
      const inspection = await trx
        .insertInto('inspection')
        .values({
          id: body.id,
          fleetId,
          kind: body.kind,
          driverId: actorId,
          tractorId: tractor.id,
          trailerId: trailer?.id ?? null,
          odometer: body.odometer,
          location: body.location,
          billOfLading: body.billOfLading,
          sealNumber: body.sealNumber,
          ruleProfile: fleet.ruleProfile,
          vocabularyVersionId: vocabulary?.id ?? null,
          startedAt: new Date(body.startedAt),
        })
        .returning(inspectionHeaderColumns)
        .executeTakeFirstOrThrow();
      await recordAudit(trx, {
        fleetId,
        actorId,
        action: 'inspection.start',
        entity: 'inspection',
        entityId: inspection.id,
        detail: { kind: body.kind, tractor: tractor.unitNumber, trailer: trailer?.unitNumber ?? null },
      });
      return { inspection, created: true };
    });
}
