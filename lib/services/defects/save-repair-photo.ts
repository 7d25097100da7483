import 'server-only';
import { createHash } from 'node:crypto';
import { getDb } from '@/lib/db';
import { AppError } from '@/lib/errors';
import { startObjectBatch } from '@/lib/storage';
import { idTakenError } from '../platform/id-taken';
import { recordAudit } from '../platform/record-audit';
import { encodePhoto } from '../inspections/save-photo';

/** The mechanic's photo of a repair, kept with the defect. The same photo id twice stores once. */
export async function saveRepairPhoto({
  fleetId,
  actorId,
  defectId,
  photoId,
  bytes,
}: {
  fleetId: string;
  actorId: string;
  defectId: string;
  photoId: string;
  bytes: Uint8Array;
}) {
  const db = getDb();
  const defect = await db
    .selectFrom('defect')
    .select(['id', 'inspectionId'])
    .where('fleetId', '=', fleetId)
    .where('id', '=', defectId)
    .executeTakeFirst();
  if (!defect) throw new AppError('not_found', 'No such defect in your fleet.');
  const existing = await db
    .selectFrom('attachment')
    .select(['id', 'defectId', 'sizeBytes', 'sha256'])
    .where('id', '=', photoId)
    .where('fleetId', '=', fleetId)
    .executeTakeFirst();
  if (existing) {
    if (existing.defectId !== defectId) throw idTakenError();
    return { attachment: existing, created: false };
  }
  const { full, thumb, type } = await encodePhoto(bytes);
  const key = `fleet/${fleetId}/defects/${defectId}/photos/${photoId}.jpg`;
  const sha256 = createHash('sha256').update(full).digest('hex');
  // The row first, the objects inside its transaction: an id taken in another fleet stores
  // nothing, and a failed write removes what was stored.
  const objects = startObjectBatch();
  const write = db.transaction().execute(async (trx) => {
    const attachment = await trx
      .insertInto('attachment')
      .values({
        id: photoId,
        fleetId,
        inspectionId: defect.inspectionId,
        defectId,
        objectKey: key,
        contentType: 'image/jpeg',
        sizeBytes: full.byteLength,
        sha256,
        thumbSha256: createHash('sha256').update(thumb).digest('hex'),
        uploadedBy: actorId,
      })
      .onConflict((oc) => oc.column('id').doNothing())
      .returning(['id', 'defectId', 'sizeBytes', 'sha256'])
      .executeTakeFirst();
    if (!attachment) throw idTakenError();
    await recordAudit(trx, {
      fleetId,
      actorId,
      action: 'repair_photo.add',
      entity: 'defect',
      entityId: defectId,
      detail: { photoId, sniffed: type, bytesStored: full.byteLength },
    });
    await objects.put(key, full, 'image/jpeg');
    await objects.put(key.replace(/\.jpg$/, '.thumb.jpg'), thumb, 'image/jpeg');
    return { attachment, created: true };
  });
  return write.catch(async (err: unknown) => {
    await objects.discard();
    throw err;
  });
}
