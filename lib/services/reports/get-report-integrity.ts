import 'server-only';
import { getDb } from '@/lib/db';
import { findReportRecord } from '@/lib/db/reports';
import { AppError } from '@/lib/errors';
import { getObjectBytes } from '@/lib/storage';
import { sha256Hex } from '@/lib/walk';
import { checkReportHash } from './get-report-detail';

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
 * compare it with the hash stored when the driver signed, each photo hashed again from its stored
 * bytes. Any edit of the header, a step or a photo (by SQL, a restore gone wrong, a bug) makes the
 * two differ.
 */
export async function checkReportIntegrity({
  fleetId,
  inspectionId,
}: {
  fleetId: string;
  inspectionId: string;
}): Promise<ReportIntegrity> {
  const db = getDb();
  const record = await findReportRecord(db, { fleetId, id: inspectionId });
  if (!record) throw new AppError('not_found', 'No such inspection report in your fleet.');
  const h = record.header;
  const status = await db
    .selectFrom('inspection')
    .select('status')
    .where('id', '=', inspectionId)
    .executeTakeFirstOrThrow();
  if (status.status !== 'submitted' || !h.finishedAt || !h.signedAt || !h.signatureName || !h.certificationText) {
    if (status.status === 'submitted') {
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
  // Each photo's SHA-256 from the bytes in the object store, not from the row that names it.
  const photoHashes = new Map<string, string>();
  let missing = 0;
  for (const a of record.attachments.filter((x) => x.defectId === null)) {
    try {
      photoHashes.set(a.id, sha256Hex((await getObjectBytes(a.objectKey)).bytes));
    } catch {
      missing += 1;
      photoHashes.set(a.id, 'missing');
    }
  }
  // The drawn signature too, from its stored bytes.
  let signatureSha256: string | null = null;
  if (h.signatureKey && h.signatureSha256) {
    try {
      signatureSha256 = sha256Hex((await getObjectBytes(h.signatureKey)).bytes);
    } catch {
      missing += 1;
      signatureSha256 = 'missing';
    }
  }
  const { computed } = checkReportHash(record, photoHashes, h.signatureSha256 ? signatureSha256 : null);
  const ok = !!h.contentHash && computed === h.contentHash;
  return {
    ok,
    signed: true,
    stored: h.contentHash,
    computed,
    message: ok
      ? 'The report is unchanged since the driver signed it.'
      : missing
        ? `WARNING: ${missing === 1 ? 'a photo or the signature' : `${missing} photos or the signature`} of this report cannot be read from storage, so it cannot be shown to match what the driver signed.`
        : 'WARNING: this report does not match what the driver signed. Its records or photos have been changed since signing; do not rely on it until this is explained.',
  };
}
