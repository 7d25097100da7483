import 'server-only';
import type { DB } from '@/lib/db';
import { findLastUnitReport, hasAcknowledged } from '@/lib/db/inspections';
import { listDefectsToAcknowledge, type DefectRecord } from '@/lib/rules';

export type UnitReview = {
  unitId: string;
  report: NonNullable<Awaited<ReturnType<typeof findLastUnitReport>>> | null;
  /** The driver must review and sign this report before driving (49 CFR 396.13). */
  mustAcknowledge: boolean;
  acknowledged: boolean;
  /** Defects on the report with no repair certification: the unit must not be driven. */
  uncertified: number;
  mayOperate: boolean;
  source: string;
};

/** What a driver must review before driving a unit: its last report, if that report lists defects. */
export async function findUnitReview(
  db: DB,
  { fleetId, unitId, driverId, profile }: { fleetId: string; unitId: string; driverId: string; profile: string },
): Promise<UnitReview> {
  const report = (await findLastUnitReport(db, { fleetId, unitId })) ?? null;
  const records: DefectRecord[] = (report?.defects ?? []).map((d) => ({
    id: d.id,
    unitId: d.unitId,
    severity: d.severity === 'minor' ? 'minor' : 'major',
    repair:
      d.status === 'open' || !d.certifiedAt
        ? null
        : { outcome: d.status === 'no_repair_needed' ? 'repair_unnecessary' : 'repaired', certifiedAt: d.certifiedAt },
  }));
  const due = listDefectsToAcknowledge(
    report ? { id: report.id, unitIds: [unitId], defects: records } : null,
    [unitId],
    profile,
  );
  const acknowledged = report
    ? await hasAcknowledged(db, { fleetId, reviewedInspectionId: report.id, unitId, driverId })
    : false;
  return {
    unitId,
    report,
    mustAcknowledge: due.signatureRequired && !acknowledged,
    acknowledged,
    uncertified: due.uncertified.length,
    mayOperate: due.mayOperate,
    source: due.source,
  };
}
