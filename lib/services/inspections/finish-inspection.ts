import 'server-only';
import { getDb } from '@/lib/db';
import { findFleetSettings } from '@/lib/db/fleets';
import { findInspectionForUpdate, listInspectionPhotos, listInspectionSteps } from '@/lib/db/inspections';
import { findFleetUnit } from '@/lib/db/units';
import { AppError } from '@/lib/errors';
import type { FinishInspectionBody } from '@/lib/schemas/inspections';
import {
  certificationStatement,
  checkDeviceTime,
  configurationOf,
  DEFAULT_REQUIRED_READINGS,
  hashReport,
  isSameSignerName,
  isTrailerItem,
  nameFinding,
  nameReading,
  listDefectSteps,
  listOpenItems,
  listWalkZones,
  QUEUED_OFFLINE_AFTER_MS,
  REPORT_FORMAT,
  signerNameMessage,
} from '@/lib/walk';
import { renderOutOfServiceMail } from '@/lib/mail/templates';
import { deliverOutbox } from '../mail/deliver-outbox';
import { recordAudit } from '../platform/record-audit';
import { loadGrammar } from '../vocabulary/resolve-vocabulary';

export { certificationStatement };

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
      if (!isSameSignerName(body.signatureName, actorName)) {
        throw new AppError('invalid_body', signerNameMessage(actorName), {
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
      const signedAt = new Date();
      const badTime = checkDeviceTime(body.finishedAt, {
        now: signedAt,
        startedAt: inspection.startedAt,
        what: 'finish',
      });
      if (badTime) throw new AppError('invalid_body', badTime, { finishedAt: [badTime] });

      // Every item answered: OK, a defect, a reading, or "not checked" with a reason.
      const [fleet, grammar] = await Promise.all([
        findFleetSettings(trx, { fleetId }),
        loadGrammar(trx, inspection.vocabularyVersionId),
      ]);
      const kind = inspection.kind === 'post_trip' ? 'post_trip' : 'pre_trip';
      const zones = listWalkZones(grammar.zones, { kind, configuration: configurationOf(!!inspection.trailerId) });
      const open = listOpenItems(zones, steps, {
        kind,
        requiredReadings: fleet?.requiredReadings ?? DEFAULT_REQUIRED_READINGS,
      });
      if (open.length) {
        const shown = open.slice(0, 6).map((o) => `${o.zoneName}: ${o.label}`);
        throw new AppError(
          'conflict',
          `${open.length === 1 ? 'One item is' : `${open.length} items are`} still open, so the report cannot be signed: ${shown.join('; ')}${open.length > shown.length ? `; and ${open.length - shown.length} more` : ''}. Mark each OK, a defect, a reading, or not checked with a reason.`,
          { openItems: open.map((o) => o.item) },
        );
      }

      // Times are the server's where it heard them; device times only when steps waited offline.
      const queued =
        steps.some((s) => s.queuedOffline) ||
        inspection.createdAt.getTime() - inspection.startedAt.getTime() > QUEUED_OFFLINE_AFTER_MS;
      const lastHeard = steps.reduce((t, s) => Math.max(t, s.serverAt.getTime()), inspection.createdAt.getTime());
      const durationSource = queued ? ('device' as const) : ('server' as const);
      const finishedAt = queued ? new Date(body.finishedAt) : new Date(lastHeard);
      const walkStart = queued ? inspection.startedAt : inspection.createdAt;
      const photos = await listInspectionPhotos(trx, { inspectionId });
      const header = {
        ...inspection,
        finishedAt,
        certificationText: certificationStatement,
        signatureName: body.signatureName.trim(),
        signedAt,
      };
      const contentHash = hashReport(
        header,
        steps,
        { photos, signatureSha256: inspection.signatureSha256 },
        REPORT_FORMAT,
      );

      const defectSteps = listDefectSteps(steps);
      const defects = defectSteps.map((s) => {
        const componentId = s.termKey?.split(':')[0] ?? null;
        const unitId =
          inspection.trailerId && isTrailerItem(s.item, s.zone, componentId)
            ? inspection.trailerId
            : inspection.tractorId;
        const check = (s.measurementKind ?? 'reading').replace(/_/g, ' ');
        const what =
          s.kind === 'measurement'
            ? nameReading({
                component: s.component,
                check,
                value: s.value,
                unit: s.unit,
                limitText: s.limitText,
              })
            : nameFinding({ component: s.component, condition: s.condition, position: s.position });
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
          durationS: Math.max(0, Math.round((finishedAt.getTime() - walkStart.getTime()) / 1000)),
          durationSource,
          reportFormat: REPORT_FORMAT,
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
