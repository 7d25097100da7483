import 'server-only';
import { getDb } from '@/lib/db';
import { findDefectDetail, listDefectPhotos } from '@/lib/db/defects';
import { AppError } from '@/lib/errors';
import type { DefectDetail } from '@/lib/schemas/defects';

/** One defect of the caller's fleet with its finding and photos; another fleet's is not found. */
export async function getDefectOrThrow({ fleetId, id }: { fleetId: string; id: string }): Promise<DefectDetail> {
  const db = getDb();
  const d = await findDefectDetail(db, { fleetId, id });
  if (!d) throw new AppError('not_found', 'No such defect in your fleet.');
  const photos = await listDefectPhotos(db, { fleetId, defectId: d.id, stepId: d.stepId });
  // The unit's other open defects: the mechanic may certify them with this one as a work order.
  const others = await db
    .selectFrom('defect')
    .select(['id', 'severity', 'description'])
    .where('fleetId', '=', fleetId)
    .where('unitId', '=', d.unitId)
    .where('status', '=', 'open')
    .where('id', '!=', d.id)
    .orderBy('severity', 'asc')
    .orderBy('createdAt', 'asc')
    .execute();
  return {
    id: d.id,
    unitId: d.unitId,
    unitNumber: d.unitNumber,
    unitKind: d.unitKind,
    unitStatus: d.unitStatus,
    unitMake: d.unitMake,
    unitModel: d.unitModel,
    zone: d.zone,
    component: d.component,
    condition: d.condition,
    position: d.position,
    severity: d.severity,
    description: d.description,
    status: d.status,
    reportedAt: d.createdAt.toISOString(),
    inspectionId: d.inspectionId,
    inspectionKind: d.inspectionKind,
    inspectedAt: d.inspectedAt.toISOString(),
    odometer: d.odometer,
    location: d.location,
    driverName: d.driverName,
    timezone: d.timezone,
    unitOpenDefects: others.map((o) => ({ id: o.id, severity: o.severity, description: o.description })),
    finding: {
      heard: d.heard,
      score: d.score === null ? null : Number(d.score),
      resolution: d.resolution,
      measurementKind: d.measurementKind,
      value: d.value === null ? null : Number(d.value),
      unit: d.measurementUnit,
      limitText: d.limitText,
      source: d.source,
      verdict: d.verdict,
    },
    repair: { work: d.repairWork, parts: d.repairParts, notes: d.repairNotes },
    certification: d.certifiedAt
      ? { name: d.certifiedName, at: d.certifiedAt.toISOString(), text: d.certificationText }
      : null,
    photos: photos.map((p) => ({
      id: p.id,
      contentType: p.contentType,
      url: `/api/attachments/${p.id}`,
      // A photo the mechanic added carries the defect; the driver's is on the finding's step.
      takenBy: p.defectId === d.id ? ('mechanic' as const) : ('driver' as const),
      takenAt: p.createdAt.toISOString(),
    })),
  };
}
