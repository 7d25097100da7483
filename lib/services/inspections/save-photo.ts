import 'server-only';
import { createHash } from 'node:crypto';
import sharp from 'sharp';
import { getDb } from '@/lib/db';
import { findInspectionForUpdate, findStep } from '@/lib/db/inspections';
import { AppError } from '@/lib/errors';
import { startObjectBatch } from '@/lib/storage';
import { idTakenError } from '../platform/id-taken';
import { recordAudit } from '../platform/record-audit';
import { refuseLockedChange } from './refuse-locked-change';

export const MAX_PHOTO_BYTES = 15 * 1024 * 1024;
/** The largest picture decoded: a 48-megapixel phone sensor's full frame, with room to spare. */
export const maxPhotoPixels = 50_000_000;

/** The image type from the file's first bytes, whatever its name or declared type says. */
export function sniffImageType(bytes: Uint8Array): 'image/jpeg' | 'image/png' | 'image/webp' | null {
  const b = (i: number) => bytes[i] ?? -1;
  if (b(0) === 0xff && b(1) === 0xd8 && b(2) === 0xff) return 'image/jpeg';
  if (b(0) === 0x89 && b(1) === 0x50 && b(2) === 0x4e && b(3) === 0x47) return 'image/png';
  const ascii = (from: number, to: number) => String.fromCharCode(...bytes.subarray(from, to));
  if (ascii(0, 4) === 'RIFF' && ascii(8, 12) === 'WEBP') return 'image/webp';
  return null;
}

/**
 * Check a photo by its bytes and re-encode it (which drops its metadata, location included),
 * with a thumbnail.
 */
export async function encodePhoto(bytes: Uint8Array): Promise<{ type: string; full: Buffer; thumb: Buffer }> {
  const type = sniffImageType(bytes);
  if (!type)
    throw new AppError(
      'unsupported_media_type',
      'That file is not a photo RigCall can read. Send a JPEG, PNG or WebP image.',
    );
  // The size is read from the header first: an image over the pixel limit is refused before
  // anything is decoded (a small file can declare a huge picture).
  let pixels = 0;
  try {
    const meta = await sharp(bytes, { limitInputPixels: false }).metadata();
    pixels = (meta.width ?? 0) * (meta.height ?? 0);
  } catch {
    throw new AppError('unsupported_media_type', 'That photo is damaged or cut off; take it again.');
  }
  if (pixels > maxPhotoPixels)
    throw new AppError(
      'invalid_body',
      `That photo is ${Math.round(pixels / 1_000_000)} megapixels; RigCall takes photos up to ${maxPhotoPixels / 1_000_000} megapixels.`,
    );
  try {
    const image = sharp(bytes, { failOn: 'error', limitInputPixels: maxPhotoPixels }).rotate();
    const full = await image
      .clone()
      .resize({ width: 1600, height: 1600, fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 82, mozjpeg: true })
      .toBuffer();
    const thumb = await image
      .clone()
      .resize({ width: 320, height: 320, fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 70 })
      .toBuffer();
    return { type, full, thumb };
  } catch {
    throw new AppError('unsupported_media_type', 'That photo is damaged or cut off; take it again.');
  }
}

/**
 * Store a defect photo: the type is checked from the bytes, the image is re-encoded (which drops
 * its metadata, location included) and a thumbnail is made. The same photo id twice stores once.
 */
export async function savePhoto({
  fleetId,
  actorId,
  inspectionId,
  photoId,
  stepId,
  bytes,
}: {
  fleetId: string;
  actorId: string;
  inspectionId: string;
  photoId: string;
  stepId: string | null;
  bytes: Uint8Array;
}) {
  const db = getDb();
  const existing = await db
    .selectFrom('attachment')
    .select(['id', 'inspectionId', 'sizeBytes', 'sha256'])
    .where('id', '=', photoId)
    .where('fleetId', '=', fleetId)
    .executeTakeFirst();
  if (existing) {
    if (existing.inspectionId !== inspectionId) throw idTakenError();
    return { attachment: existing, created: false };
  }
  // Whose inspection it is comes first: nothing is decoded or stored for one that is not ours.
  const inspection = await db
    .selectFrom('inspection')
    .select(['id', 'driverId', 'status'])
    .where('fleetId', '=', fleetId)
    .where('id', '=', inspectionId)
    .executeTakeFirst();
  if (!inspection) throw new AppError('not_found', 'No such inspection in your fleet.');
  if (inspection.driverId !== actorId)
    throw new AppError('forbidden', 'Only the driver of this inspection adds its photos.');
  const refuse = () =>
    refuseLockedChange(
      { fleetId, actorId, inspectionId },
      { photoId, stepId, what: 'photo' },
      'This report is signed and locked; no photo can be added to it.',
    );
  if (inspection.status === 'submitted') throw await refuse();
  const { type, full, thumb } = await encodePhoto(bytes);
  const key = `fleet/${fleetId}/inspections/${inspectionId}/photos/${photoId}.jpg`;
  const sha256 = createHash('sha256').update(full).digest('hex');
  // The row is written first, in the transaction that also stores the objects: an id taken in
  // another fleet stores nothing, and a failed write removes what was stored.
  const objects = startObjectBatch();
  const write = db.transaction().execute(async (trx) => {
    const locked = await findInspectionForUpdate(trx, { fleetId, id: inspectionId });
    // Signed while the photo was being encoded: the report is locked and the photo stays out.
    if (locked?.status === 'submitted') return null;
    if (stepId && !(await findStep(trx, { inspectionId, id: stepId })))
      throw new AppError('conflict', 'The finding this photo belongs to has not arrived yet; it will be sent again.');
    const attachment = await trx
      .insertInto('attachment')
      .values({
        id: photoId,
        fleetId,
        inspectionId,
        stepId,
        objectKey: key,
        contentType: 'image/jpeg',
        sizeBytes: full.byteLength,
        sha256,
        thumbSha256: createHash('sha256').update(thumb).digest('hex'),
        uploadedBy: actorId,
      })
      .onConflict((oc) => oc.column('id').doNothing())
      .returning(['id', 'inspectionId', 'sizeBytes', 'sha256'])
      .executeTakeFirst();
    // Taken by another fleet (this fleet's own rows were looked up above).
    if (!attachment) throw idTakenError();
    await recordAudit(trx, {
      fleetId,
      actorId,
      action: 'photo.add',
      entity: 'inspection',
      entityId: inspectionId,
      detail: { photoId, stepId, bytesIn: bytes.byteLength, bytesStored: full.byteLength, sniffed: type },
    });
    await objects.put(key, full, 'image/jpeg');
    await objects.put(key.replace(/\.jpg$/, '.thumb.jpg'), thumb, 'image/jpeg');
    return { attachment, created: true };
  });
  const saved = await write.catch(async (err: unknown) => {
    await objects.discard();
    throw err;
  });
  if (!saved) throw await refuse();
  return saved;
}
