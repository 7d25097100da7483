import 'server-only';
import { getDb } from '@/lib/db';
import { findInspectionDetail } from '@/lib/db/inspections';
import { findFleetMinimums, findReportRecord } from '@/lib/db/reports';
import { AppError } from '@/lib/errors';
import type { ReportDetail, ReportHashCheck } from '@/lib/schemas/reports';
import { checkInspectionDuration } from '@/lib/rules';
import { configurationOf, hashReport, listWalkZones, zoneName } from '@/lib/walk';
import { loadGrammar } from '../vocabulary/resolve-vocabulary';

/** Low-confidence threshold: a match under this score should have been confirmed by the driver. */
export const LOW_CONFIDENCE = 0.8;

const iso = (d: Date | string | null | undefined) => (d ? new Date(d).toISOString() : null);
const num = (v: unknown) => (v === null || v === undefined ? null : Number(v));

export type HashCheck = ReportHashCheck;

/**
 * Recompute the sha-256 of the report's canonical text from its rows (and the photo hashes as
 * stored) and compare it with the stored one. The integrity check also re-reads the photo bytes.
 */
export function checkReportHash(
  record: NonNullable<Awaited<ReturnType<typeof findReportRecord>>>,
  photoHashes?: ReadonlyMap<string, string>,
  signatureSha256?: string | null,
): HashCheck {
  const h = record.header;
  if (!h.contentHash || !h.finishedAt || !h.signedAt || !h.signatureName || !h.certificationText) {
    return { state: 'unsigned', stored: h.contentHash, computed: null };
  }
  const computed = hashReport(
    {
      ...h,
      finishedAt: h.finishedAt,
      signedAt: h.signedAt,
      signatureName: h.signatureName,
      certificationText: h.certificationText,
    },
    record.steps,
    {
      photos: record.attachments
        .filter((a) => a.defectId === null)
        .map((a) => ({ id: a.id, stepId: a.stepId, sha256: photoHashes?.get(a.id) ?? a.sha256 })),
      signatureSha256: signatureSha256 === undefined ? h.signatureSha256 : signatureSha256,
    },
    h.reportFormat,
  );
  return { state: computed === h.contentHash ? 'match' : 'mismatch', stored: h.contentHash, computed };
}

/** A report with everything the supervisor's detail screen and the PDF show. */
export async function getReportDetail({
  fleetId,
  id,
  withPhotoUrls = true,
}: {
  fleetId: string;
  id: string;
  withPhotoUrls?: boolean;
}): Promise<ReportDetail> {
  const db = getDb();
  const [detail, record, fleet] = await Promise.all([
    findInspectionDetail(db, { fleetId, id }),
    findReportRecord(db, { fleetId, id }),
    findFleetMinimums(db, { fleetId }),
  ]);
  if (!detail || !record || !fleet) throw new AppError('not_found', 'No such inspection report in your fleet.');

  const minimumMinutes = detail.kind === 'post_trip' ? fleet.minPosttripMinutes : fleet.minPretripMinutes;
  // The walk's length as the server measured it at signing (device times only for a walk queued offline).
  const walkEnd = detail.finishedAt ? new Date(detail.finishedAt) : null;
  const duration = walkEnd
    ? checkInspectionDuration(
        record.header.durationS !== null
          ? new Date(walkEnd.getTime() - record.header.durationS * 1000)
          : detail.startedAt,
        walkEnd,
        { minimumPretripMinutes: minimumMinutes },
      )
    : null;
  const grammar = await loadGrammar(db, detail.vocabularyVersionId);

  const photos = record.attachments.map((a) => ({
    id: a.id,
    stepId: a.stepId,
    defectId: a.defectId,
    contentType: a.contentType,
    url: withPhotoUrls ? `/api/attachments/${a.id}` : null,
    objectKey: a.objectKey,
  }));

  const steps = detail.steps.map((s) => ({
    ...s,
    score: num(s.score),
    value: num(s.value),
    deviceAt: iso(s.deviceAt)!,
    alternatives: Array.isArray(s.alternatives)
      ? (s.alternatives as unknown[]).map((x) => (typeof x === 'string' ? x : JSON.stringify(x)))
      : [],
    photos: photos.filter((p) => p.stepId === s.id),
  }));

  // Zone by zone, in the order walked; time in a zone runs until the next zone's first step.
  const order: string[] = [];
  for (const s of steps) if (!order.includes(s.zone)) order.push(s.zone);
  const zones = order.map((zoneId, i) => {
    const own = steps.filter((s) => s.zone === zoneId);
    const first = Date.parse(own[0]!.deviceAt);
    const nextZone = order[i + 1];
    const nextFirst = nextZone ? steps.find((s) => s.zone === nextZone)?.deviceAt : iso(detail.finishedAt);
    const seconds = nextFirst ? Math.max(0, Math.round((Date.parse(nextFirst) - first) / 1000)) : null;
    return { id: zoneId, name: zoneName(grammar.zones, zoneId), seconds, steps: own };
  });
  const expected = listWalkZones(grammar.zones, {
    kind: detail.kind === 'post_trip' ? 'post_trip' : 'pre_trip',
    configuration: configurationOf(detail.trailerNumber !== null),
  });
  const skippedZones = expected.filter((z) => !order.includes(z.id));
  const lowConfidenceUnconfirmed = steps.filter(
    (s) => s.kind === 'defect' && s.score !== null && s.score < LOW_CONFIDENCE && s.resolution === 'auto',
  ).length;

  const h = record.header;
  return {
    id: detail.id,
    kind: detail.kind,
    status: detail.status,
    driverName: detail.driverName,
    tractor: {
      id: h.tractorId,
      number: detail.tractorNumber,
      plate: h.tractorPlate,
      plateJurisdiction: h.tractorPlateJurisdiction,
      vin: h.tractorVin,
      make: h.tractorMake,
      model: h.tractorModel,
      status: h.tractorStatus,
    },
    trailer: h.trailerId
      ? {
          id: h.trailerId,
          number: detail.trailerNumber,
          plate: h.trailerPlate,
          plateJurisdiction: h.trailerPlateJurisdiction,
          make: h.trailerMake,
          model: h.trailerModel,
          status: h.trailerStatus,
        }
      : null,
    odometer: detail.odometer,
    location: detail.location,
    billOfLading: detail.billOfLading,
    sealNumber: detail.sealNumber,
    ruleProfile: detail.ruleProfile,
    vocabulary: { id: detail.vocabularyVersionId, label: h.vocabularyLabel },
    startedAt: iso(detail.startedAt)!,
    finishedAt: iso(detail.finishedAt),
    durationS: detail.durationS,
    duration: duration
      ? {
          minutes: duration.minutes,
          minimumMinutes: duration.minimumMinutes,
          short: duration.short,
          source: duration.source,
          clock: record.header.durationSource ?? 'device',
        }
      : null,
    certificationText: detail.certificationText,
    signatureName: detail.signatureName,
    signedAt: iso(detail.signedAt),
    hash: checkReportHash(record),
    review: { reviewedAt: iso(detail.reviewedAt), reviewerName: h.reviewerName, note: detail.reviewNote },
    zones,
    skippedZones,
    lowConfidenceUnconfirmed,
    defects: record.defects.map((d) => ({
      ...d,
      certifiedAt: iso(d.certifiedAt),
      photos: photos.filter((p) => p.defectId === d.id || p.stepId === d.stepId),
    })),
    acknowledgements: record.acknowledgements.map((a) => ({ ...a, acknowledgedAt: iso(a.acknowledgedAt)! })),
    photoCount: photos.length,
    fleetName: fleet.name,
    timezone: fleet.timezone,
  };
}
