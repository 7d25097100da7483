import 'server-only';
import { sql } from 'kysely';
import type { ReportFilters, ReportRow, ReportSortKey } from '@/lib/schemas/reports';
import type { DB } from './index';

export type FleetMinimums = { timezone: string; minPretripMinutes: number; minPosttripMinutes: number };

const minimumSeconds = (m: FleetMinimums) =>
  sql<number>`(CASE WHEN i.kind = 'pre_trip' THEN ${m.minPretripMinutes}::int ELSE ${m.minPosttripMinutes}::int END * 60)`;

/** The filtered set of a fleet's reports, before paging (shared by the page, the count and the CSV). */
function filteredReports(db: DB, fleetId: string, f: ReportFilters, m: FleetMinimums) {
  let q = db.selectFrom('inspection as i').where('i.fleetId', '=', fleetId);
  if (f.from) q = q.where(sql<boolean>`i.started_at >= (${f.from}::date)::timestamp AT TIME ZONE ${m.timezone}`);
  if (f.to) q = q.where(sql<boolean>`i.started_at < ((${f.to}::date + 1)::timestamp AT TIME ZONE ${m.timezone})`);
  if (f.driverId) q = q.where('i.driverId', '=', f.driverId);
  if (f.unitId) {
    const unitId = f.unitId;
    q = q.where((eb) => eb.or([eb('i.tractorId', '=', unitId), eb('i.trailerId', '=', unitId)]));
  }
  if (f.kind) q = q.where('i.kind', '=', f.kind);
  // defect_count is kept by a trigger on defect (migration 20261202090000).
  if (f.hasDefects === 'yes') q = q.where('i.defectCount', '>', 0);
  if (f.hasDefects === 'no') q = q.where('i.defectCount', '=', 0);
  if (f.short === 'yes') q = q.where(sql<boolean>`i.duration_s < ${minimumSeconds(m)}`);
  if (f.short === 'no') q = q.where(sql<boolean>`i.duration_s >= ${minimumSeconds(m)}`);
  if (f.status === 'draft') q = q.where('i.status', '=', 'draft');
  if (f.status === 'reviewed') q = q.where('i.status', '=', 'submitted').where('i.reviewedAt', 'is not', null);
  if (f.status === 'unreviewed') q = q.where('i.status', '=', 'submitted').where('i.reviewedAt', 'is', null);
  return q;
}

function selectRows(db: DB, fleetId: string, f: ReportFilters, m: FleetMinimums) {
  return filteredReports(db, fleetId, f, m)
    .innerJoin('appUser as d', 'd.id', 'i.driverId')
    .innerJoin('unit as t', 't.id', 'i.tractorId')
    .leftJoin('unit as tr', 'tr.id', 'i.trailerId')
    .select([
      'i.id',
      'i.kind',
      'i.status',
      'i.startedAt',
      'i.finishedAt',
      'i.durationS',
      'i.driverId',
      'd.name as driverName',
      'i.tractorId',
      't.unitNumber as tractorNumber',
      'i.trailerId',
      'tr.unitNumber as trailerNumber',
      'i.odometer',
      'i.location',
      'i.reviewedAt',
      'i.signatureName',
      'i.signedAt',
      'i.contentHash',
      minimumSeconds(m).as('minimumS'),
      'i.majorDefectCount',
      'i.defectCount',
      'i.openDefectCount',
    ]);
}

type RawRow = Awaited<ReturnType<ReturnType<typeof selectRows>['execute']>>[number];

function toReportRow(r: RawRow): ReportRow {
  const minimumS = Number(r.minimumS);
  return {
    id: r.id,
    kind: r.kind === 'post_trip' ? 'post_trip' : 'pre_trip',
    status: r.status === 'draft' ? 'draft' : 'submitted',
    startedAt: r.startedAt.toISOString(),
    finishedAt: r.finishedAt ? r.finishedAt.toISOString() : null,
    durationS: r.durationS,
    minimumS,
    short: r.durationS !== null && r.durationS < minimumS,
    driverId: r.driverId,
    driverName: r.driverName,
    tractorId: r.tractorId,
    tractorNumber: r.tractorNumber,
    trailerId: r.trailerId,
    trailerNumber: r.trailerNumber,
    odometer: r.odometer,
    location: r.location,
    majorCount: r.majorDefectCount,
    minorCount: r.defectCount - r.majorDefectCount,
    openCount: r.openDefectCount,
    reviewedAt: r.reviewedAt ? r.reviewedAt.toISOString() : null,
  };
}

// Every order ends on (started_at, id) in the same direction, so that paging is stable and the
// indexes of migration 20261202090000 serve the common orders without sorting.
const sortColumns = {
  startedAt: [],
  durationS: [sql.ref('i.duration_s')],
  driverName: [sql.ref('d.name')],
  tractorNumber: [sql.ref('t.unit_number')],
  kind: [sql.ref('i.kind')],
  defects: [sql.ref('i.major_defect_count'), sql.ref('i.defect_count')],
} satisfies Record<ReportSortKey, unknown[]>;

export type ListReportsArgs = {
  fleetId: string;
  filters: ReportFilters;
  minimums: FleetMinimums;
  sort: ReportSortKey;
  dir: 'asc' | 'desc';
  limit: number;
  offset: number;
};

function ordered(db: DB, a: Omit<ListReportsArgs, 'limit' | 'offset'>) {
  let q = selectRows(db, a.fleetId, a.filters, a.minimums);
  for (const c of sortColumns[a.sort]) q = q.orderBy(c, a.dir);
  return q.orderBy('i.startedAt', a.dir).orderBy('i.id', a.dir);
}

/** One page of a fleet's reports, filtered and sorted on the server. */
export async function listReportRows(db: DB, a: ListReportsArgs): Promise<ReportRow[]> {
  const rows = await ordered(db, a).limit(a.limit).offset(a.offset).execute();
  return rows.map(toReportRow);
}

export async function countReportRows(
  db: DB,
  a: Pick<ListReportsArgs, 'fleetId' | 'filters' | 'minimums'>,
): Promise<number> {
  const r = await filteredReports(db, a.fleetId, a.filters, a.minimums)
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .executeTakeFirstOrThrow();
  return Number(r.n);
}

/** Every filtered report in order, streamed in batches (for the CSV export). */
export async function* iterateReportRows(
  db: DB,
  a: Omit<ListReportsArgs, 'limit' | 'offset'>,
  batch = 1000,
): AsyncGenerator<ReportRow[]> {
  for (let offset = 0; ; offset += batch) {
    const rows = await ordered(db, a).limit(batch).offset(offset).execute();
    if (rows.length) yield rows.map(toReportRow);
    if (rows.length < batch) return;
  }
}

/** The SQL of the page query, for EXPLAIN in the benchmark. */
export function compileReportPageQuery(db: DB, a: ListReportsArgs) {
  return ordered(db, a).limit(a.limit).offset(a.offset).compile();
}

export async function findFleetMinimums(db: DB, { fleetId }: { fleetId: string }) {
  return db
    .selectFrom('fleet')
    .select([
      'id',
      'name',
      'timezone',
      'minPretripMinutes',
      'minPosttripMinutes',
      'maintenanceEmail',
      'supervisorEmail',
      'ruleProfile',
    ])
    .where('id', '=', fleetId)
    .executeTakeFirst();
}

export async function findReportForReview(db: DB, { fleetId, id }: { fleetId: string; id: string }) {
  return db
    .selectFrom('inspection')
    .select(['id', 'status', 'reviewedAt'])
    .where('fleetId', '=', fleetId)
    .where('id', '=', id)
    .executeTakeFirst();
}

export async function updateReportReview(
  db: DB,
  a: { fleetId: string; id: string; reviewedBy: string; note: string | null; at: Date },
) {
  return db
    .updateTable('inspection')
    .set({ reviewedAt: a.at, reviewedBy: a.reviewedBy, reviewNote: a.note })
    .where('fleetId', '=', a.fleetId)
    .where('id', '=', a.id)
    .returning(['id', 'reviewedAt', 'reviewNote'])
    .executeTakeFirstOrThrow();
}

/** Drivers and units of a fleet, for the table's filter pickers. */
export async function listReportFilterOptions(db: DB, { fleetId }: { fleetId: string }) {
  const [drivers, units] = await Promise.all([
    db
      .selectFrom('appUser')
      .select(['id', 'name'])
      .where('fleetId', '=', fleetId)
      .where(sql<boolean>`'driver' = ANY(roles)`)
      .orderBy('name')
      .execute(),
    db
      .selectFrom('unit')
      .select(['id', 'unitNumber', 'kind'])
      .where('fleetId', '=', fleetId)
      .orderBy('kind')
      .orderBy('unitNumber')
      .execute(),
  ]);
  return {
    drivers,
    units: units.map((u) => ({
      id: u.id,
      unitNumber: u.unitNumber,
      kind: u.kind,
    })),
  };
}

/** What a report's detail, PDF and hash check need beyond the inspection detail itself. */
export async function findReportRecord(db: DB, { fleetId, id }: { fleetId: string; id: string }) {
  const header = await db
    .selectFrom('inspection as i')
    .leftJoin('appUser as rv', 'rv.id', 'i.reviewedBy')
    .leftJoin('vocabularyVersion as vv', 'vv.id', 'i.vocabularyVersionId')
    .innerJoin('unit as t', 't.id', 'i.tractorId')
    .leftJoin('unit as tr', 'tr.id', 'i.trailerId')
    .select([
      'i.id',
      'i.fleetId',
      'i.kind',
      'i.driverId',
      'i.tractorId',
      'i.trailerId',
      'i.odometer',
      'i.location',
      'i.billOfLading',
      'i.sealNumber',
      'i.ruleProfile',
      'i.vocabularyVersionId',
      'i.startedAt',
      'i.finishedAt',
      'i.certificationText',
      'i.signatureName',
      'i.signedAt',
      'i.contentHash',
      'i.reportFormat',
      'i.signatureSha256',
      'i.signatureKey',
      'i.durationS',
      'i.durationSource',
      'rv.name as reviewerName',
      'vv.label as vocabularyLabel',
      't.plate as tractorPlate',
      't.plateJurisdiction as tractorPlateJurisdiction',
      't.vin as tractorVin',
      't.make as tractorMake',
      't.model as tractorModel',
      't.status as tractorStatus',
      'tr.plate as trailerPlate',
      'tr.plateJurisdiction as trailerPlateJurisdiction',
      'tr.make as trailerMake',
      'tr.model as trailerModel',
      'tr.status as trailerStatus',
    ])
    .where('i.fleetId', '=', fleetId)
    .where('i.id', '=', id)
    .executeTakeFirst();
  if (!header) return undefined;
  const [steps, defects, attachments, acknowledgements] = await Promise.all([
    db
      .selectFrom('inspectionStep')
      .select([
        'id',
        'seq',
        'zone',
        'item',
        'kind',
        'heard',
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
        'deviceAt',
        'serverAt',
        'notCheckedReason',
        'note',
        'queuedOffline',
      ])
      .where('fleetId', '=', fleetId)
      .where('inspectionId', '=', id)
      .orderBy('seq')
      .execute(),
    db
      .selectFrom('defect as df')
      .innerJoin('unit as u', 'u.id', 'df.unitId')
      .select([
        'df.id',
        'df.stepId',
        'df.unitId',
        'u.unitNumber',
        'df.zone',
        'df.component',
        'df.condition',
        'df.position',
        'df.severity',
        'df.description',
        'df.status',
        'df.repairWork',
        'df.repairParts',
        'df.repairNotes',
        'df.certifiedName',
        'df.certificationText',
        'df.certifiedAt',
      ])
      .where('df.fleetId', '=', fleetId)
      .where('df.inspectionId', '=', id)
      .orderBy('df.createdAt')
      .execute(),
    db
      .selectFrom('attachment')
      .select(['id', 'stepId', 'defectId', 'objectKey', 'contentType', 'createdAt', 'sha256'])
      .where('fleetId', '=', fleetId)
      .where('inspectionId', '=', id)
      .orderBy('createdAt')
      .execute(),
    db
      .selectFrom('acknowledgement as a')
      .innerJoin('unit as u', 'u.id', 'a.unitId')
      .select(['a.id', 'a.unitId', 'u.unitNumber', 'a.signatureName', 'a.statement', 'a.acknowledgedAt'])
      .where('a.fleetId', '=', fleetId)
      .where('a.reviewedInspectionId', '=', id)
      .orderBy('a.acknowledgedAt')
      .execute(),
  ]);
  return { header, steps, defects, attachments, acknowledgements };
}
