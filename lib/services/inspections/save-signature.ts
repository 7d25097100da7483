import 'server-only';
import sharp from 'sharp';
import { getDb } from '@/lib/db';
import { findInspectionForUpdate } from '@/lib/db/inspections';
import { AppError } from '@/lib/errors';
import { putObject } from '@/lib/storage';
import { sha256Hex } from '@/lib/walk';
import { refuseLockedChange } from './refuse-locked-change';
import { sniffImageType } from './save-photo';

export const MAX_SIGNATURE_BYTES = 512 * 1024;

/**
 * The driver's drawn signature, stored before the report is signed and locked. Sending it again
 * replaces it while the report is a draft; after signing it cannot change.
 */
export async function saveSignature({
  fleetId,
  actorId,
  inspectionId,
  bytes,
}: {
  fleetId: string;
  actorId: string;
  inspectionId: string;
  bytes: Uint8Array;
}) {
  if (sniffImageType(bytes) !== 'image/png')
    throw new AppError('unsupported_media_type', 'A drawn signature is sent as a PNG image.');
  let png: Buffer;
  try {
    png = await sharp(bytes, { failOn: 'error', limitInputPixels: 4_000_000 })
      .resize({ width: 900, height: 400, fit: 'inside', withoutEnlargement: true })
      .png()
      .toBuffer();
  } catch {
    throw new AppError('unsupported_media_type', 'That signature image is damaged; sign again.');
  }
  const key = `fleet/${fleetId}/inspections/${inspectionId}/signature.png`;
  const sha256 = sha256Hex(png);
  const outcome = await getDb()
    .transaction()
    .execute(async (trx) => {
      const inspection = await findInspectionForUpdate(trx, { fleetId, id: inspectionId });
      if (!inspection) throw new AppError('not_found', 'No such inspection in your fleet.');
      if (inspection.driverId !== actorId)
        throw new AppError('forbidden', 'Only the driver of this inspection signs it.');
      if (inspection.status === 'submitted') {
        // The same signature sent again after a reconnect is fine; any other is not.
        if (inspection.signatureSha256 === sha256) return { signatureKey: key, created: false };
        return null;
      }
      await putObject(key, png, 'image/png');
      await trx
        .updateTable('inspection')
        .set({ signatureKey: key, signatureSha256: sha256 })
        .where('id', '=', inspectionId)
        .execute();
      return { signatureKey: key, created: true };
    });
  if (outcome) return outcome;
  throw await refuseLockedChange(
    { fleetId, actorId, inspectionId },
    { what: 'signature' },
    'This report is signed and locked; its signature cannot change.',
  );
}
