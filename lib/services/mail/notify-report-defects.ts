import 'server-only';
import { getDb } from '@/lib/db';
import { AppError } from '@/lib/errors';
import { renderOutOfServiceMail, renderRepairNeededMail } from '@/lib/mail/templates';
import { appUrl, sendUnitStatusMail } from './send-unit-status-mail';

/**
 * Mail the shop about a report's open defects, one message a unit: out of service when a major
 * defect is open on it, repair needed otherwise. For reports whose first notice was missed.
 */
export async function notifyReportDefects({
  fleetId,
  actorName,
  id,
}: {
  fleetId: string;
  actorName: string;
  id: string;
}) {
  const db = getDb();
  const report = await db
    .selectFrom('inspection as i')
    .innerJoin('fleet as f', 'f.id', 'i.fleetId')
    .innerJoin('appUser as d', 'd.id', 'i.driverId')
    .select(['i.id', 'f.name as fleetName', 'd.name as driverName'])
    .where('i.fleetId', '=', fleetId)
    .where('i.id', '=', id)
    .executeTakeFirst();
  if (!report) throw new AppError('not_found', 'No such inspection report in your fleet.');
  const open = await db
    .selectFrom('defect as df')
    .innerJoin('unit as u', 'u.id', 'df.unitId')
    .select(['df.id', 'df.unitId', 'u.unitNumber', 'df.severity', 'df.description'])
    .where('df.fleetId', '=', fleetId)
    .where('df.inspectionId', '=', id)
    .where('df.status', '=', 'open')
    .execute();
  if (!open.length) throw new AppError('conflict', 'This report has no open defect to send to the shop.');
  const byUnit = new Map<string, typeof open>();
  for (const d of open) byUnit.set(d.unitNumber, [...(byUnit.get(d.unitNumber) ?? []), d]);
  const sent: { unitNumber: string; kind: string; sent: boolean }[] = [];
  // Units out of service first, then by unit number: the shop reads the worst news first.
  const hasMajor = (list: typeof open) => Number(list.some((d) => d.severity === 'major'));
  const ordered = [...byUnit].sort(([a, listA], [b, listB]) => hasMajor(listB) - hasMajor(listA) || a.localeCompare(b));
  for (const [unitNumber, defects] of ordered) {
    const list = defects.map((d) => ({
      severity: d.severity,
      description: d.description,
      unitNumber,
    }));
    const major = list.some((d) => d.severity === 'major');
    const inspectionUrl = appUrl(`/supervisor/reports/${id}`);
    const mail = major
      ? renderOutOfServiceMail({
          fleetName: report.fleetName,
          unitNumber,
          defects: list,
          inspectionUrl,
          driverName: report.driverName,
        })
      : renderRepairNeededMail({
          fleetName: report.fleetName,
          unitNumber,
          defects: list,
          inspectionUrl,
          requestedBy: actorName,
        });
    const r = await sendUnitStatusMail({ fleetId, kind: major ? 'out_of_service' : 'repair_needed', mail });
    sent.push({ unitNumber, kind: major ? 'out_of_service' : 'repair_needed', sent: r.sent });
  }
  return { sent };
}
