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
          .select([
            's.id',
            's.seq',
            's.zone',
            's.item',
            's.kind',
            's.heard',
            's.alternatives',
            's.inputMode',
            's.termKey',
            's.component',
            's.condition',
            's.position',
            's.score',
            's.resolution',
            's.measurementKind',
            's.value',
            's.unit',
            's.verdict',
            's.severity',
            's.limitText',
            's.source',
            's.deviceAt',
          ])
          .whereRef('s.inspectionId', '=', 'i.id')
          .orderBy('s.seq'),
      ).as('steps'),
      jsonArrayFrom(
        eb
          .selectFrom('defect as df')
          .select([
            'df.id',
            'df.stepId',
            'df.unitId',
            'df.component',
            'df.condition',
            'df.position',
            'df.severity',
            'df.description',
            'df.status',
            'df.certifiedName',
            'df.certifiedAt',
          ])
          .whereRef('df.inspectionId', '=', 'i.id')
          .orderBy('df.createdAt'),
      ).as('defects'),
    ])
    .where('i.fleetId', '=', fleetId)
    .where('i.id', '=', id)
    .executeTakeFirst();
}

/** The columns of an inspection's header that the start route answers with. */
export const inspectionHeaderColumns = [
  'id',
  'fleetId',
  'kind',
  'status',
  'driverId',
  'tractorId',
  'trailerId',
  'odometer',
  'location',
  'billOfLading',
  'sealNumber',
  'ruleProfile',
  'vocabularyVersionId',
  'startedAt',
  'finishedAt',
  'signatureName',
  'signedAt',
  'certificationText',
  'contentHash',
] as const;

/** The header of one inspection of this fleet, locked for update inside a transaction. */
export async function findInspectionForUpdate(db: DB, { fleetId, id }: { fleetId: string; id: string }) {
  return db
    .selectFrom('inspection')
    .select([...inspectionHeaderColumns, 'createdAt', 'signatureKey', 'signatureSha256'])
    .where('fleetId', '=', fleetId)
    .where('id', '=', id)
    .forUpdate()
    .executeTakeFirst();
}

export const stepColumns = [
  'id',
  'seq',
  'zone',
  'item',
  'kind',
  'heard',
  'alternatives',
  'inputMode',
  'termKey',
  'component',
  'condition',
  'position',
  'score',
  'resolution',
  'undoesStepId',
  'measurementKind',
  'value',
  'unit',
  'verdict',
  'severity',
  'limitText',
  'source',
  'deviceAt',
  'serverAt',
  'notCheckedReason',
  'note',
  'queuedOffline',
] as const;

export async function findStep(db: DB, { inspectionId, id }: { inspectionId: string; id: string }) {
  return db
    .selectFrom('inspectionStep')
    .select(stepColumns)
    .where('inspectionId', '=', inspectionId)
    .where('id', '=', id)
    .executeTakeFirst();
}

export async function listInspectionSteps(db: DB, { inspectionId }: { inspectionId: string }) {
  return db
    .selectFrom('inspectionStep')
    .select(stepColumns)
    .where('inspectionId', '=', inspectionId)
    .orderBy('seq')
    .orderBy('id')
    .execute();
}

/** The photos of an inspection as its hash covers them: id, the finding they belong to, their SHA-256. */
export async function listInspectionPhotos(db: DB, { inspectionId }: { inspectionId: string }) {
  return (
    db
      .selectFrom('attachment')
      .select(['id', 'stepId', 'sha256', 'objectKey'])
      .where('inspectionId', '=', inspectionId)
      // A mechanic's repair photo belongs to the defect, added after signing on purpose.
      .where('defectId', 'is', null)
      .orderBy('id')
      .execute()
  );
}

/** The newest published vocabulary of the fleet: new inspections record that they use it. */
export async function findPublishedVocabulary(db: DB, { fleetId }: { fleetId: string }) {
  return db
    .selectFrom('vocabularyVersion')
    .select(['id', 'label'])
    .where('fleetId', '=', fleetId)
    .where('status', '=', 'published')
    .orderBy('publishedAt', 'desc')
    .limit(1)
    .executeTakeFirst();
}

/** The driver's own inspections, newest first: drafts to resume and the last few reports. */
export async function listDriverInspections(
  db: DB,
  { fleetId, driverId, limit }: { fleetId: string; driverId: string; limit: number },
) {
  return db
    .selectFrom('inspection as i')
    .innerJoin('unit as t', 't.id', 'i.tractorId')
    .leftJoin('unit as tr', 'tr.id', 'i.trailerId')
    .select([
      'i.id',
      'i.kind',
      'i.status',
      'i.startedAt',
      'i.finishedAt',
      't.unitNumber as tractorNumber',
      'tr.unitNumber as trailerNumber',
    ])
    .select((eb) =>
      eb
        .selectFrom('defect as d')
        .select((x) => x.fn.countAll<number>().as('n'))
        .whereRef('d.inspectionId', '=', 'i.id')
        .as('defectCount'),
    )
    .where('i.fleetId', '=', fleetId)
    .where('i.driverId', '=', driverId)
    .orderBy('i.startedAt', 'desc')
    .limit(limit)
    .execute();
}

/** The last submitted report that covered this unit (as tractor or trailer), with its defects on this unit. */
export async function findLastUnitReport(db: DB, { fleetId, unitId }: { fleetId: string; unitId: string }) {
  return db
    .selectFrom('inspection as i')
    .innerJoin('appUser as d', 'd.id', 'i.driverId')
    .select((eb) => [
      'i.id',
      'i.kind',
      'i.finishedAt',
      'i.tractorId',
      'i.trailerId',
      'd.name as driverName',
      jsonArrayFrom(
        eb
          .selectFrom('defect as df')
          .select([
            'df.id',
            'df.unitId',
            'df.component',
            'df.condition',
            'df.position',
            'df.severity',
            'df.description',
            'df.status',
            'df.repairWork',
            'df.certifiedName',
            'df.certificationText',
            'df.certifiedAt',
          ])
          .whereRef('df.inspectionId', '=', 'i.id')
          .where('df.unitId', '=', unitId)
          .orderBy('df.createdAt'),
      ).as('defects'),
    ])
    .where('i.fleetId', '=', fleetId)
    .where('i.status', '=', 'submitted')
    .where((eb) => eb.or([eb('i.tractorId', '=', unitId), eb('i.trailerId', '=', unitId)]))
    .orderBy('i.finishedAt', 'desc')
    .limit(1)
    .executeTakeFirst();
}

export async function hasAcknowledged(
  db: DB,
  {
    fleetId,
    reviewedInspectionId,
    unitId,
    driverId,
  }: { fleetId: string; reviewedInspectionId: string; unitId: string; driverId: string },
) {
  const row = await db
    .selectFrom('acknowledgement')
    .select('id')
    .where('fleetId', '=', fleetId)
    .where('reviewedInspectionId', '=', reviewedInspectionId)
    .where('unitId', '=', unitId)
    .where('driverId', '=', driverId)
    .executeTakeFirst();
  return !!row;
}
