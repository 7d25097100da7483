import 'server-only';
import { sql } from 'kysely';
import { getDb } from '@/lib/db';
import { listDefectsToAcknowledge, type AcknowledgementDue, type DefectRecord } from '@/lib/rules';

export type PendingAcknowledgement = {
  report: { id: string; kind: string; startedAt: string; driverName: string };
  units: { id: string; unitNumber: string }[];
  defects: {
    id: string;
    unitId: string;
    unitNumber: string;
    severity: 'minor' | 'major';
    description: string;
    status: 'open' | 'repaired' | 'no_repair_needed';
    repairWork: string | null;
    certifiedName: string | null;
    certifiedAt: string | null;
    certificationText: string | null;
  }[];
  due: AcknowledgementDue;
};

/**
 * What the next driver of these units must review and sign before driving (49 CFR 396.13): for
 * each unit, its last submitted report when that report lists defects on the unit and no driver
 * has yet signed the review of it for that unit. A report shared by two units comes back once.
 */
export async function listPendingAcknowledgements({
  fleetId,
  unitIds,
}: {
  fleetId: string;
  unitIds: readonly string[];
}): Promise<PendingAcknowledgement[]> {
  if (!unitIds.length) return [];
  const db = getDb();
  const ids = [...unitIds];
  const latest: { unitId: string; inspectionId: string }[] = [];
  for (const unitId of ids) {
    const last = await db
      .selectFrom('inspection as i')
      .select(['i.id'])
      .where('i.fleetId', '=', fleetId)
      .where('i.status', '=', 'submitted')
      .where((eb) => eb.or([eb('i.tractorId', '=', unitId), eb('i.trailerId', '=', unitId)]))
      .orderBy('i.finishedAt', 'desc')
      .limit(1)
      .executeTakeFirst();
    if (last) latest.push({ unitId, inspectionId: last.id });
  }
  const pending: typeof latest = [];
  for (const l of latest) {
    const listed = await db
      .selectFrom('defect')
      .select('id')
      .where('inspectionId', '=', l.inspectionId)
      .where('unitId', '=', l.unitId)
      .limit(1)
      .executeTakeFirst();
    if (!listed) continue;
    const ack = await db
      .selectFrom('acknowledgement')
      .select('id')
      .where('fleetId', '=', fleetId)
      .where('unitId', '=', l.unitId)
      .where('reviewedInspectionId', '=', l.inspectionId)
      .executeTakeFirst();
    if (!ack) pending.push(l);
  }
  const reportIds = [...new Set(pending.map((p) => p.inspectionId))];
  const out: PendingAcknowledgement[] = [];
  for (const reportId of reportIds) {
    const units = pending.filter((p) => p.inspectionId === reportId).map((p) => p.unitId);
    const [report, defects] = await Promise.all([
      db
        .selectFrom('inspection as i')
        .innerJoin('appUser as d', 'd.id', 'i.driverId')
        .select(['i.id', 'i.kind', 'i.startedAt', 'i.ruleProfile', 'd.name as driverName'])
        .where('i.id', '=', reportId)
        .executeTakeFirstOrThrow(),
      db
        .selectFrom('defect as df')
        .innerJoin('unit as u', 'u.id', 'df.unitId')
        .select([
          'df.id',
          'df.unitId',
          'u.unitNumber',
          'df.severity',
          'df.description',
          'df.status',
          'df.repairWork',
          'df.certifiedName',
          'df.certifiedAt',
          'df.certificationText',
        ])
        .where('df.inspectionId', '=', reportId)
        .where('df.unitId', 'in', units)
        .orderBy(sql`df.severity = 'major'`, 'desc')
        .orderBy('df.createdAt')
        .execute(),
    ]);
    const records: DefectRecord[] = defects.map((d) => ({
      id: d.id,
      unitId: d.unitId,
      severity: d.severity === 'major' ? 'major' : 'minor',
      description: d.description,
      repair:
        d.status === 'open' || !d.certifiedAt
          ? null
          : {
              outcome: d.status === 'no_repair_needed' ? 'repair_unnecessary' : 'repaired',
              certifiedAt: d.certifiedAt,
              certifiedBy: d.certifiedName ?? undefined,
            },
    }));
    out.push({
      report: {
        id: report.id,
        kind: report.kind,
        startedAt: report.startedAt.toISOString(),
        driverName: report.driverName,
      },
      units: [...new Map(defects.map((d) => [d.unitId, { id: d.unitId, unitNumber: d.unitNumber }])).values()],
      defects: defects.map((d) => ({
        ...d,
        certifiedAt: d.certifiedAt ? d.certifiedAt.toISOString() : null,
      })),
      due: listDefectsToAcknowledge({ id: report.id, unitIds: units, defects: records }, ids, report.ruleProfile),
    });
  }
  return out;
}
