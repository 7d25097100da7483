import 'server-only';
import { createHash } from 'node:crypto';
import { getDb } from '@/lib/db';
import { findFleet } from '@/lib/db/fleets';
import { findInspectionForUpdate, listInspectionSteps } from '@/lib/db/inspections';
import { findFleetUnit } from '@/lib/db/units';
import { AppError } from '@/lib/errors';
import { isTrailerItem } from '@/lib/inspection/build-check';
import { listDefectSteps } from '@/lib/inspection/walk-progress';
import { pickReportHeader, serializeReport, toCanonicalSteps } from '@/lib/reports/canonical-report';
import type { FinishInspectionBody } from '@/lib/schemas/inspections';
import { renderOutOfServiceMail } from '@/lib/mail/templates';
import { deliverOutbox } from '../mail/deliver-outbox';
import { recordAudit } from '../platform/record-audit';

export const certificationStatement =
  'I performed this inspection and the report lists every defect I found or that was reported to me.';

const sameName = (a: string, b: string) =>
  a.trim().replace(/\s+/g, ' ').toLowerCase() === b.trim().replace(/\s+/g, ' ').toLowerCase();

/**
 * Sign and lock the report: defects are created from what the walk recorded (less what was
 * taken back), the content hash is stored, a unit with a major defect goes out of service, and
 * maintenance and the supervisor are mailed. Signing the same report again returns it unchanged.
 */
export async function finishInspection({
  fleetId,
  actorId,
  actorName,
  inspectionId,
  body,
  appUrl,
}: {
  fleetId: string;
  actorId: string;
  actorName: string;
  inspectionId: string;
  body: FinishInspectionBody;
  appUrl: string;
}) {
  const result = await getDb()
    .transaction()
    .execute(async (trx) => {
      const inspection = await findInspectionForUpdate(trx, { fleetId, id: inspectionId });
      if (!inspection) throw new AppError('not_found', 'No such inspection in your fleet.');
      if (inspection.driverId !== actorId)
        throw new AppError('forbidden', 'Only the driver who did this inspection signs it.');
      if (inspection.status === 'submitted') return { inspectionId, alreadySigned: true, outOfService: [] as string[] };
      if (!sameName(body.signatureName, actorName)) {
        throw new AppError('invalid_body', `Sign with your name as it is on your account: ${actorName}.`, {
          signatureName: [`Type ${actorName}.`],
        });
      }
      const steps = await listInspectionSteps(trx, { inspectionId });
      if (body.stepIds) {
        // The phone names every step it recorded; one the server lacks (never arrived, or lost
        // before it reached the disk) is sent again before the report can lock.
        const held = new Set(steps.map((s) => s.id));
        const missing = [...new Set(body.stepIds)].filter((id) => !held.has(id));
        if (missing.length) {
          throw new AppError(
            'conflict',
            `${missing.length === 1 ? 'One step' : `${missing.length} steps`} recorded on this phone ${missing.length === 1 ? 'has' : 'have'} not reached RigCall’s server yet. The phone sends ${missing.length === 1 ? 'it' : 'them'} again; the report locks once ${missing.length === 1 ? 'it is' : 'they are'} in.`,
            { stepIds: missing.slice(0, 500) },
          );
        }
      }
      const finishedAt = new Date(body.finishedAt) < inspection.startedAt ? new Date() : new Date(body.finishedAt);
      const signedAt = new Date();
      const header = pickReportHeader({
        ...inspection,
        finishedAt,
        certificationText: certificationStatement,
        signatureName: body.signatureName.trim(),
        signedAt,
      });
      const canonical = serializeReport({ ...header, steps: toCanonicalSteps(steps) });
      const contentHash = createHash('sha256').update(canonical).digest('hex');

      const defectSteps = listDefectSteps(steps);
      const defects = defectSteps.map((s) => {
        const componentId = s.termKey?.split(':')[0] ?? null;
        const unitId =
          inspection.trailerId && isTrailerItem(s.item, s.zone, componentId)
            ? inspection.trailerId
            : inspection.tractorId;
        const reading = (v: unknown, unit: string | null) =>
          unit === '32nds' ? `${String(v)}/32 in` : `${String(v)} ${unit ?? ''}`.trim();
        const check = (s.measurementKind ?? 'reading').replace(/_/g, ' ');
        const what =
          s.kind === 'measurement'
            ? `${s.component ?? ''} ${check}: ${reading(s.value, s.unit)}${s.limitText ? ` (limit ${reading(s.limitText.split(' ')[0], s.limitText.split(' ').slice(1).join(' '))})` : ''}`.trim()
            : [s.component, s.condition, s.position].filter(Boolean).join(', ');
        return {
          fleetId,
          inspectionId,
          stepId: s.id,
          unitId,
          zone: s.zone,
          component: s.component ?? check,
          condition: s.condition ?? (s.kind === 'measurement' ? `${check} fails the limit` : 'reported'),
          position: s.position,
          severity: s.severity === 'minor' ? ('minor' as const) : ('major' as const),
          description: what,
          createdAt: s.deviceAt,
        };
      });
      if (defects.length)
        await trx
          .insertInto('defect')
          .values(defects)
          .onConflict((oc) => oc.column('stepId').doNothing())
          .execute();

      await trx
        .updateTable('inspection')
        .set({
          status: 'submitted',
          finishedAt,
          durationS: Math.max(0, Math.round((finishedAt.getTime() - inspection.startedAt.getTime()) / 1000)),
          certificationText: certificationStatement,
          signatureName: header.signatureName,
          signedAt,
          contentHash,
        })
        .where('id', '=', inspectionId)
        .execute();

      const majorUnits = [...new Set(defects.filter((d) => d.severity === 'major').map((d) => d.unitId))];
      const outOfService: string[] = [];
      for (const unitId of majorUnits) {
        await trx
          .updateTable('unit')
          .set({ status: 'out_of_service', statusChangedAt: signedAt })
          .where('id', '=', unitId)
          .where('fleetId', '=', fleetId)
          .execute();
        const unit = await findFleetUnit(trx, { fleetId, id: unitId });
        outOfService.push(unit?.unitNumber ?? unitId);
      }
      if (majorUnits.length) {
        const fleet = await trx
          .selectFrom('fleet')
          .select(['name', 'maintenanceEmail', 'supervisorEmail'])
          .where('id', '=', fleetId)
          .executeTakeFirstOrThrow();
        const to = [fleet.maintenanceEmail, fleet.supervisorEmail].filter((x): x is string => !!x);
        if (to.length) {
          const inspectionUrl = `${appUrl}/supervisor/reports/${inspectionId}`;
          for (const [i, unitId] of majorUnits.entries()) {
            const mail = renderOutOfServiceMail({
              fleetName: fleet.name,
              unitNumber: outOfService[i]!,
              defects: defects
                .filter((d) => d.unitId === unitId)
                .map((d) => ({ severity: d.severity, description: d.description })),
              inspectionUrl,
              driverName: actorName,
            });
            await trx
              .insertInto('mailOutbox')
              .values({
                fleetId,
                kind: 'out_of_service',
                toAddresses: to,
                subject: mail.subject,
                textBody: mail.text,
                htmlBody: mail.html,
              })
              .execute();
          }
        }
      }
      await recordAudit(trx, {
        fleetId,
        actorId,
        action: 'inspection.sign',
        entity: 'inspection',
        entityId: inspectionId,
        detail: { contentHash, defects: defects.length, outOfService },
      });
      return { inspectionId, alreadySigned: false, outOfService };
    });
  await deliverOutbox({ fleetId });
  return result;
}
