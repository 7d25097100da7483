import 'server-only';
import { sql } from 'kysely';
import type { DefectQueueRow } from '@/lib/schemas/defects';
import type { DB } from './index';

const queueColumns = [
  'df.id',
  'df.unitId',
  'u.unitNumber',
  'u.kind as unitKind',
  'u.status as unitStatus',
  'df.zone',
  'df.component',
  'df.condition',
  'df.position',
  'df.severity',
  'df.description',
  'df.status',
  'df.createdAt',
  'df.inspectionId',
  'd.name as driverName',
  'df.certifiedName',
  'df.certifiedAt',
] as const;

/** The fleet's defects for the mechanic's queue: unit, then major before minor, oldest first. */
export async function listDefectRows(
  db: DB,
  {
    fleetId,
    status,
    severity,
    unitId,
  }: { fleetId: string; status: 'open' | 'closed' | 'all'; severity?: 'minor' | 'major'; unitId?: string },
): Promise<DefectQueueRow[]> {
  let q = db
    .selectFrom('defect as df')
    .innerJoin('unit as u', 'u.id', 'df.unitId')
    .innerJoin('inspection as i', 'i.id', 'df.inspectionId')
    .innerJoin('appUser as d', 'd.id', 'i.driverId')
    .select(queueColumns)
    .select((eb) =>
      eb
        .selectFrom('attachment as a')
        .select((e) => e.fn.countAll<number>().as('n'))
        .where((e) => e.or([e('a.defectId', '=', e.ref('df.id')), e('a.stepId', '=', e.ref('df.stepId'))]))
        .as('photoCount'),
    )
    .where('df.fleetId', '=', fleetId);
  if (status === 'open') q = q.where('df.status', '=', 'open');
  if (status === 'closed') q = q.where('df.status', '<>', 'open');
  if (severity) q = q.where('df.severity', '=', severity);
  if (unitId) q = q.where('df.unitId', '=', unitId);
  const rows = await q
    .orderBy(sql`u.status = 'out_of_service'`, 'desc')
    .orderBy('u.unitNumber')
    .orderBy(sql`df.severity = 'major'`, 'desc')
    .orderBy('df.createdAt', status === 'closed' ? 'desc' : 'asc')
    .limit(500)
    .execute();
  return rows.map((r) => ({
    ...r,
    reportedAt: r.createdAt.toISOString(),
    certifiedAt: r.certifiedAt ? r.certifiedAt.toISOString() : null,
    photoCount: Number(r.photoCount ?? 0),
  }));
}

/** One defect of the fleet with its finding step, report and unit; undefined for another fleet's. */
export async function findDefectDetail(db: DB, { fleetId, id }: { fleetId: string; id: string }) {
  return db
    .selectFrom('defect as df')
    .innerJoin('unit as u', 'u.id', 'df.unitId')
    .innerJoin('inspection as i', 'i.id', 'df.inspectionId')
    .innerJoin('appUser as d', 'd.id', 'i.driverId')
    .innerJoin('inspectionStep as s', 's.id', 'df.stepId')
    .innerJoin('fleet as fl', 'fl.id', 'df.fleetId')
    .select([
      ...queueColumns,
      'fl.timezone',
      'df.stepId',
      'df.repairWork',
      'df.repairParts',
      'df.repairNotes',
      'df.certificationText',
      'i.kind as inspectionKind',
      'i.startedAt as inspectedAt',
      'i.odometer',
      'i.location',
      's.heard',
      's.score',
      's.resolution',
      's.measurementKind',
      's.value',
      's.unit as measurementUnit',
      's.limitText',
      's.source',
      's.verdict',
      'u.make as unitMake',
      'u.model as unitModel',
    ])
    .where('df.fleetId', '=', fleetId)
    .where('df.id', '=', id)
    .executeTakeFirst();
}

export async function listDefectPhotos(
  db: DB,
  { fleetId, defectId, stepId }: { fleetId: string; defectId: string; stepId: string },
) {
  return db
    .selectFrom('attachment')
    .select(['id', 'objectKey', 'contentType', 'createdAt', 'defectId'])
    .where('fleetId', '=', fleetId)
    .where((eb) => eb.or([eb('defectId', '=', defectId), eb('stepId', '=', stepId)]))
    .orderBy('createdAt')
    .execute();
}

/** Lock a defect row for certification. */
export async function lockDefect(db: DB, { fleetId, id }: { fleetId: string; id: string }) {
  return db
    .selectFrom('defect')
    .select(['id', 'unitId', 'status', 'severity', 'description', 'inspectionId'])
    .where('fleetId', '=', fleetId)
    .where('id', '=', id)
    .forUpdate()
    .executeTakeFirst();
}

/** All defects of one unit as the service-status rule needs them (the unit row locked first). */
export async function listUnitDefectsForStatus(db: DB, { fleetId, unitId }: { fleetId: string; unitId: string }) {
  const unit = await db
    .selectFrom('unit')
    .select(['id', 'unitNumber', 'status'])
    .where('fleetId', '=', fleetId)
    .where('id', '=', unitId)
    .forUpdate()
    .executeTakeFirstOrThrow();
  const defects = await db
    .selectFrom('defect')
    .select(['id', 'unitId', 'severity', 'status', 'description', 'certifiedAt', 'certifiedName'])
    .where('fleetId', '=', fleetId)
    .where('unitId', '=', unitId)
    .where((eb) => eb.or([eb('status', '=', 'open'), eb('certifiedAt', '>', sql<Date>`now() - interval '30 days'`)]))
    .execute();
  return { unit, defects };
}
