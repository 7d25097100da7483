import 'server-only';
import { createHash } from 'node:crypto';
import { getDb } from '@/lib/db';
import { AppError } from '@/lib/errors';
import { putObject } from '@/lib/storage';
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
    if (existing.defectId !== defectId) throw new AppError('conflict', 'That photo id belongs to another record.');
    return { attachment: existing, created: false };
  }
  const { full, thumb, type } = await encodePhoto(bytes);
  const key = `fleet/${fleetId}/defects/${defectId}/photos/${photoId}.jpg`;
  await putObject(key, full, 'image/jpeg');
  await putObject(key.replace(/\.jpg$/, '.thumb.jpg'), thumb, 'image/jpeg');
  const sha256 = createHash('sha256').update(full).digest('hex');
  return db.transaction().execute(async (trx) => {
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
        uploadedBy: actorId,
      })
      .onConflict((oc) => oc.column('id').doNothing())
      .returning(['id', 'defectId', 'sizeBytes', 'sha256'])
      .executeTakeFirst();
    await recordAudit(trx, {
      fleetId,
      actorId,
      action: 'repair_photo.add',
      entity: 'defect',
      entityId: defectId,
      detail: { photoId, sniffed: type, bytesStored: full.byteLength },
    });
    return {
      attachment: attachment ?? { id: photoId, defectId, sizeBytes: full.byteLength, sha256 },
      created: !!attachment,
    };
  });
}
