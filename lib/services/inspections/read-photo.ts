import 'server-only';
import { createHash } from 'node:crypto';
import sharp from 'sharp';
import { getDb } from '@/lib/db';
import { AppError } from '@/lib/errors';
import { getObjectBytes } from '@/lib/storage';
import { recordAudit } from '../platform/record-audit';

export type PhotoRead =
  | { ok: true; bytes: Uint8Array; contentType: string }
  | { ok: false; message: string; stored: string; computed: string };

const sha256Hex = (b: Uint8Array) => createHash('sha256').update(b).digest('hex');

/**
 * A stored photo (or its thumbnail), checked against the SHA-256 written with it when it was
 * uploaded. Bytes that do not match are never handed out as evidence: the answer says so, and
 * the mismatch is logged. A thumbnail stored before thumbnails had a hash of their own is made
 * again from the checked photo.
 */
export async function readPhoto({
  fleetId,
  actorId,
  id,
  size,
}: {
  fleetId: string;
  actorId: string;
  id: string;
  size: 'full' | 'thumb';
}): Promise<PhotoRead> {
  const row = await getDb()
    .selectFrom('attachment')
    .select(['id', 'objectKey', 'contentType', 'sha256', 'thumbSha256', 'inspectionId'])
    .where('fleetId', '=', fleetId)
    .where('id', '=', id)
    .executeTakeFirst();
  if (!row) throw new AppError('not_found', 'No such photo in your fleet.');
  const mismatch = async (stored: string, computed: string): Promise<PhotoRead> => {
    await recordAudit(getDb(), {
      fleetId,
      actorId,
      action: 'photo.integrity_failed',
      entity: 'attachment',
      entityId: row.id,
      detail: { size, stored, computed, objectKey: row.objectKey },
    });
    return {
      ok: false,
      stored,
      computed,
      message:
        'WARNING: this photo does not match what was stored with the report. It may have been replaced; it is not shown as evidence.',
    };
  };
  if (size === 'thumb' && row.thumbSha256) {
    const { bytes } = await getObjectBytes(row.objectKey.replace(/\.jpg$/, '.thumb.jpg'));
    const computed = sha256Hex(bytes);
    return computed === row.thumbSha256
      ? { ok: true, bytes, contentType: 'image/jpeg' }
      : mismatch(row.thumbSha256, computed);
  }
  const { bytes } = await getObjectBytes(row.objectKey);
  const computed = sha256Hex(bytes);
  if (computed !== row.sha256) return mismatch(row.sha256, computed);
  if (size === 'full') return { ok: true, bytes, contentType: row.contentType };
  const thumb = await sharp(bytes, { limitInputPixels: 50_000_000 })
    .resize({ width: 320, height: 320, fit: 'inside', withoutEnlargement: true })
    .jpeg({ quality: 70 })
    .toBuffer();
  return { ok: true, bytes: new Uint8Array(thumb), contentType: 'image/jpeg' };
}

/** What is shown in place of a photo that failed its check: a plain warning image. */
export function renderTamperedPhotoSvg(message: string): string {
  const esc = message.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
  return `<svg xmlns="http://www.w3.org/2000/svg" width="320" height="240" viewBox="0 0 320 240" role="img" aria-label="${esc}">
<rect width="320" height="240" fill="#fff" stroke="#b00020" stroke-width="12"/>
<text x="160" y="96" text-anchor="middle" font-family="sans-serif" font-size="28" font-weight="700" fill="#b00020">TAMPERED</text>
<text x="160" y="136" text-anchor="middle" font-family="sans-serif" font-size="15" fill="#000">This photo does not match</text>
<text x="160" y="158" text-anchor="middle" font-family="sans-serif" font-size="15" fill="#000">what was stored with the report.</text>
</svg>`;
}
