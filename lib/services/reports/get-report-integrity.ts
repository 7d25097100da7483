import 'server-only';
import { createHash } from 'node:crypto';
import { getDb } from '@/lib/db';
import { AppError } from '@/lib/errors';
import { pickReportHeader, serializeReport, toCanonicalSteps } from '@/lib/reports/canonical-report';

export type ReportIntegrity = {
  /** True when the report is signed and its rows still hash to what was stored at signing. */
  ok: boolean;
  signed: boolean;
  stored: string | null;
  computed: string | null;
  /** One sentence for the screen: shown loudly when `ok` is false on a signed report. */
  message: string;
};

/**
 * Recompute the SHA-256 of a signed report's canonical text from the rows as they are now and
 * compare it with the hash stored when the driver signed. Any edit of the header or of a step
 * (by SQL, a restore gone wrong, a bug) makes the two differ.
 */
export async function checkReportIntegrity({
  fleetId,
  inspectionId,
}: {
  fleetId: string;
  inspectionId: string;
}): Promise<ReportIntegrity> {
  const db = getDb();
  const h = await db
    .selectFrom('inspection')
    .select([
      'id',
      'fleetId',
      'kind',
      'status',
      'driverId',
      'tractorId',
      'trailerId',
      'odometer',
      'location',
      'billOfLading',
      'sealNumber',
      'ruleProfile',
      'vocabularyVersionId',
      'startedAt',
      'finishedAt',
      'certificationText',
      'signatureName',
      'signedAt',
      'contentHash',
    ])
    .where('fleetId', '=', fleetId)
    .where('id', '=', inspectionId)
    .executeTakeFirst();
  if (!h) throw new AppError('not_found', 'No such inspection report in your fleet.');
  if (h.status !== 'submitted' || !h.finishedAt || !h.signedAt || !h.signatureName || !h.certificationText) {
    if (h.status === 'submitted') {
      return {
        ok: false,
        signed: true,
        stored: h.contentHash,
        computed: null,
        message:
          'This report is marked signed but its signature details are missing: it has been altered since signing.',
      };
    }
    return {
      ok: false,
      signed: false,
      stored: h.contentHash,
      computed: null,
      message: 'This report is not signed yet, so it has no content hash to check.',
    };
  }
  const steps = await db
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
    ])
    .where('fleetId', '=', fleetId)
    .where('inspectionId', '=', inspectionId)
    .execute();
  const text = serializeReport({
    ...pickReportHeader({
      ...h,
      finishedAt: h.finishedAt,
      signedAt: h.signedAt,
      signatureName: h.signatureName,
      certificationText: h.certificationText,
    }),
    steps: toCanonicalSteps(steps.map((s) => ({ ...s, value: s.value === null ? null : Number(s.value) }))),
  });
  const computed = createHash('sha256').update(text).digest('hex');
  const ok = !!h.contentHash && computed === h.contentHash;
  return {
    ok,
    signed: true,
    stored: h.contentHash,
    computed,
    message: ok
      ? 'The report is unchanged since the driver signed it.'
      : 'WARNING: this report does not match what the driver signed. Its records have been changed since signing; do not rely on it until this is explained.',
  };
}
