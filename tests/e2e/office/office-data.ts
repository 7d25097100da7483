// Database look-ups for the office e2e: the seeded report to work on, found the way a supervisor
// would pick it (a report with an open major defect that is its unit's last report).
import { createHash, randomUUID } from 'node:crypto';
import { sql } from 'kysely';
import { createDb, databaseUrlFromEnv, type DB } from '../../../db/connect';
import { serializeReport, toCanonicalSteps } from '../../../lib/walk/report';

export const openDb = (): DB => createDb(databaseUrlFromEnv(), 2);

export type Target = {
  reportId: string;
  unitId: string;
  unitNumber: string;
  heard: string | null;
  openMajorIds: string[];
  openMinorIds: string[];
};

/**
 * A report of the demo fleet whose major defect is still open and that is the last report of that
 * unit. The seed leaves a few; when earlier runs have repaired them all, a new one is written
 * the way the seed writes its history.
 */
export async function findTarget(db: DB): Promise<Target> {
  const fleet = await db.selectFrom('fleet').select(['id']).where('slug', '=', 'northbank').executeTakeFirstOrThrow();
  const found = await sql<{ reportId: string; unitId: string }>`
    SELECT i.id AS report_id, df.unit_id
    FROM defect df JOIN inspection i ON i.id = df.inspection_id
    WHERE df.fleet_id = ${fleet.id} AND df.status = 'open' AND df.severity = 'major' AND i.status = 'submitted'
      AND i.id = (SELECT i2.id FROM inspection i2 WHERE i2.status = 'submitted' AND (i2.tractor_id = df.unit_id OR i2.trailer_id = df.unit_id) ORDER BY i2.finished_at DESC LIMIT 1)
      AND NOT EXISTS (SELECT 1 FROM acknowledgement a WHERE a.reviewed_inspection_id = i.id AND a.unit_id = df.unit_id)
    ORDER BY i.started_at DESC LIMIT 1`.execute(db);
  // Raw rows come back camelCased by the client's CamelCasePlugin.
  let hit = found.rows[0];
  if (!hit) hit = await writeReportWithMajor(db, fleet.id);
  const unit = await db
    .selectFrom('unit')
    .select(['unitNumber'])
    .where('id', '=', hit.unitId)
    .executeTakeFirstOrThrow();
  const openMajor = await db
    .selectFrom('defect')
    .select(['id'])
    .where('unitId', '=', hit.unitId)
    .where('status', '=', 'open')
    .where('severity', '=', 'major')
    .execute();
  const openMinor = await db
    .selectFrom('defect')
    .select(['id'])
    .where('inspectionId', '=', hit.reportId)
    .where('unitId', '=', hit.unitId)
    .where('status', '=', 'open')
    .where('severity', '=', 'minor')
    .execute();
  const step = await db
    .selectFrom('defect as df')
    .innerJoin('inspectionStep as s', 's.id', 'df.stepId')
    .select(['s.heard'])
    .where('df.inspectionId', '=', hit.reportId)
    .where('df.unitId', '=', hit.unitId)
    .where('df.severity', '=', 'major')
    .executeTakeFirstOrThrow();
  return {
    reportId: hit.reportId,
    unitId: hit.unitId,
    unitNumber: unit.unitNumber,
    heard: step.heard,
    openMajorIds: openMajor.map((d) => d.id),
    openMinorIds: openMinor.map((d) => d.id),
  };
}

async function writeReportWithMajor(db: DB, fleetId: string) {
  const driver = await db
    .selectFrom('appUser')
    .select(['id', 'name'])
    .where('fleetId', '=', fleetId)
    .where('email', '=', 'luis.ferreira@northbank.example')
    .executeTakeFirstOrThrow();
  const tractor = await db
    .selectFrom('unit')
    .select(['id'])
    .where('fleetId', '=', fleetId)
    .where('unitNumber', '=', '247')
    .executeTakeFirstOrThrow();
  const id = randomUUID();
  const startedAt = new Date(Date.now() - 2 * 3600_000);
  const finishedAt = new Date(startedAt.getTime() + 18 * 60_000);
  const at = (s: number) => new Date(startedAt.getTime() + s * 1000);
  const steps = [
    {
      id: randomUUID(),
      seq: 0,
      zone: 'front',
      item: null,
      kind: 'visit' as const,
      heard: null,
      termKey: null,
      component: null,
      condition: null,
      position: null,
      score: null,
      resolution: null,
      undoesStepId: null,
      measurementKind: null,
      value: null,
      unit: null,
      verdict: null,
      severity: null,
      deviceAt: at(10),
    },
    {
      id: randomUUID(),
      seq: 1,
      zone: 'front',
      item: null,
      kind: 'defect' as const,
      heard: 'bulge on the left steer tire',
      termKey: 'steer_tire:bulge',
      component: 'steer tire',
      condition: 'bulge',
      position: 'left',
      score: 0.93,
      resolution: 'auto' as const,
      undoesStepId: null,
      measurementKind: null,
      value: null,
      unit: null,
      verdict: null,
      severity: 'major' as const,
      deviceAt: at(60),
    },
    {
      id: randomUUID(),
      seq: 2,
      zone: 'front',
      item: null,
      kind: 'zone_ok' as const,
      heard: 'all good',
      termKey: null,
      component: null,
      condition: null,
      position: null,
      score: 1,
      resolution: 'auto' as const,
      undoesStepId: null,
      measurementKind: null,
      value: null,
      unit: null,
      verdict: null,
      severity: null,
      deviceAt: at(120),
    },
  ];
  const header = {
    id,
    fleetId,
    kind: 'pre_trip' as const,
    driverId: driver.id,
    tractorId: tractor.id,
    trailerId: null,
    odometer: 498_120,
    location: 'Millbrook Terminal, yard B',
    billOfLading: null,
    sealNumber: null,
    ruleProfile: 'us-federal',
    vocabularyVersionId: null,
    startedAt,
    finishedAt,
    certificationText:
      'I performed this inspection and the report lists every defect I found or that was reported to me.',
    signatureName: driver.name,
    signedAt: new Date(finishedAt.getTime() + 20_000),
  };
  const contentHash = createHash('sha256')
    .update(
      // Written as a report of format 1 (the inspection row's default): steps and header only.
      serializeReport({ ...header, steps: toCanonicalSteps(steps, 1) }, null, 1),
    )
    .digest('hex');
  await db
    .insertInto('inspection')
    .values({ ...header, status: 'submitted', durationS: 18 * 60, contentHash })
    .execute();
  await db
    .insertInto('inspectionStep')
    .values(steps.map((s) => ({ ...s, fleetId, inspectionId: id, alternatives: '[]', inputMode: 'voice' })))
    .execute();
  await db
    .insertInto('defect')
    .values({
      fleetId,
      inspectionId: id,
      stepId: steps[1]!.id,
      unitId: tractor.id,
      zone: 'front',
      component: 'steer tire',
      condition: 'bulge',
      position: 'left',
      severity: 'major',
      description: 'steer tire, bulge, left',
    })
    .execute();
  await db.updateTable('unit').set({ status: 'out_of_service' }).where('id', '=', tractor.id).execute();
  return { reportId: id, unitId: tractor.id };
}
