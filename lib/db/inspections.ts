import 'server-only';
import { jsonArrayFrom } from 'kysely/helpers/postgres';
import type { DB } from './index';

/** One inspection of the fleet with its steps and defects, or undefined (also for another fleet's). */
export async function findInspectionDetail(db: DB, { fleetId, id }: { fleetId: string; id: string }) {
  return db
    .selectFrom('inspection as i')
    .innerJoin('appUser as d', 'd.id', 'i.driverId')
    .innerJoin('unit as t', 't.id', 'i.tractorId')
    .leftJoin('unit as tr', 'tr.id', 'i.trailerId')
    .select((eb) => [
      'i.id',
      'i.kind',
      'i.status',
      'i.odometer',
      'i.location',
      'i.billOfLading',
      'i.sealNumber',
      'i.ruleProfile',
      'i.vocabularyVersionId',
      'i.startedAt',
      'i.finishedAt',
      'i.durationS',
      'i.certificationText',
      'i.signatureName',
      'i.signedAt',
      'i.contentHash',
      'i.reviewedAt',
      'i.reviewNote',
      'd.name as driverName',
      't.unitNumber as tractorNumber',
      'tr.unitNumber as trailerNumber',
      jsonArrayFrom(
        eb
          .selectFrom('inspectionStep as s')
          .select(['s.id', 's.seq', 's.zone', 's.item', 's.kind', 's.heard', 's.alternatives', 's.inputMode', 's.termKey', 's.component', 's.condition', 's.position', 's.score', 's.resolution', 's.measurementKind', 's.value', 's.unit', 's.verdict', 's.severity', 's.limitText', 's.source', 's.deviceAt'])
          .whereRef('s.inspectionId', '=', 'i.id')
          .orderBy('s.seq'),
      ).as('steps'),
      jsonArrayFrom(
        eb
          .selectFrom('defect as df')
          .select(['df.id', 'df.stepId', 'df.unitId', 'df.component', 'df.condition', 'df.position', 'df.severity', 'df.description', 'df.status', 'df.certifiedName', 'df.certifiedAt'])
          .whereRef('df.inspectionId', '=', 'i.id')
          .orderBy('df.createdAt'),
      ).as('defects'),
    ])
    .where('i.fleetId', '=', fleetId)
    .where('i.id', '=', id)
    .executeTakeFirst();
}
