// Defect 5 of issue 16: stored photo bytes are checked against the SHA-256 kept with them on
// every read (a swapped photo shows as tampered evidence), and the local object store refuses
// anonymous and wrongly signed requests, as a hosted bucket does.
import { randomUUID } from 'node:crypto';
import { PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as attachments from '@/app/api/attachments/[id]/route';
import * as inspections from '@/app/api/inspections/route';
import * as photos from '@/app/api/inspections/[id]/photos/[photoId]/route';
import { getObjectBytes, putObject } from '@/lib/storage';
import { makeFleetFixture, type FleetFixture } from '../../setup/fleet-fixture';
import { callRoute, makeRequest } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';

const db = getTestDb();
let f: FleetFixture;
beforeAll(async () => {
  f = await makeFleetFixture(db, 'Photo integrity fleet');
});
afterAll(() => db.destroy());

const endpoint = () => process.env.S3_ENDPOINT!;
const bucket = () => process.env.S3_BUCKET!;
const jpeg = (r: number) =>
  sharp({ create: { width: 16, height: 16, channels: 3, background: { r, g: 90, b: 30 } } })
    .jpeg()
    .toBuffer();

async function storedPhoto() {
  const inspectionId = randomUUID();
  const start = await callRoute(
    inspections.POST,
    makeRequest('/api/inspections', {
      method: 'POST',
      cookie: f.cookies.driver,
      json: {
        id: inspectionId,
        kind: 'pre_trip',
        tractorId: f.tractor.id,
        trailerId: null,
        odometer: 5,
        startedAt: new Date().toISOString(),
      },
    }),
  );
  expect(start.status).toBe(201);
  const photoId = randomUUID();
  const put = await callRoute(
    photos.PUT,
    makeRequest(`/api/inspections/${inspectionId}/photos/${photoId}`, {
      method: 'PUT',
      cookie: f.cookies.driver,
      body: new Uint8Array(await jpeg(200)),
      headers: { 'content-type': 'image/jpeg' },
    }),
    { id: inspectionId, photoId },
  );
  expect(put.status).toBe(201);
  const row = await db
    .selectFrom('attachment')
    .select(['objectKey'])
    .where('id', '=', photoId)
    .executeTakeFirstOrThrow();
  return { photoId, key: row.objectKey };
}
const read = (id: string, size: 'full' | 'thumb' = 'full') =>
  callRoute(attachments.GET, makeRequest(`/api/attachments/${id}?size=${size}`, { cookie: f.cookies.supervisor }), {
    id,
  });

describe('photo evidence (issue 16, defect 5)', () => {
  it('defect 5: a photo whose stored bytes were swapped is shown as tampered, not served as evidence', async () => {
    const { photoId, key } = await storedPhoto();
    const clean = await read(photoId);
    expect(clean.status).toBe(200);
    expect(clean.headers.get('content-type')).toBe('image/jpeg');
    // Someone with write access to the bucket swaps the photo and its thumbnail.
    await putObject(key, new Uint8Array(await jpeg(10)), 'image/jpeg');
    await putObject(key.replace(/\.jpg$/, '.thumb.jpg'), new Uint8Array(await jpeg(10)), 'image/jpeg');
    for (const size of ['full', 'thumb'] as const) {
      const res = await read(photoId, size);
      expect(res.status, size).toBe(409);
      expect(res.headers.get('x-rigcall-integrity'), size).toBe('mismatch');
      expect(res.headers.get('content-type'), size).toMatch(/^image\/svg\+xml/);
      expect(await res.text(), size).toMatch(/does not match/i);
    }
    const logged = await db
      .selectFrom('auditLog')
      .select('action')
      .where('entityId', '=', photoId)
      .where('action', '=', 'photo.integrity_failed')
      .execute();
    expect(logged.length).toBeGreaterThan(0);
  });

  it('defect 5: the object store refuses anonymous requests', async () => {
    const { key } = await storedPhoto();
    const put = await fetch(`${endpoint()}/${bucket()}/${key}`, {
      method: 'PUT',
      body: 'swapped',
      headers: { 'content-type': 'image/jpeg' },
    });
    expect(put.status).toBe(403);
    const get = await fetch(`${endpoint()}/${bucket()}/${key}`);
    expect(get.status).toBe(403);
    const list = await fetch(`${endpoint()}/${bucket()}`);
    expect(list.status).toBe(403);
    // The app's own signed client still reads it.
    expect((await getObjectBytes(key)).bytes.byteLength).toBeGreaterThan(100);
  });

  it('defect 5: the object store refuses a request signed with another key or secret', async () => {
    for (const credentials of [
      { accessKeyId: process.env.S3_ACCESS_KEY_ID!, secretAccessKey: 'not-the-secret' },
      { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' }, // the store's well-known default key
    ]) {
      const wrong = new S3Client({ region: 'us-east-1', endpoint: endpoint(), forcePathStyle: true, credentials });
      await expect(
        wrong.send(new PutObjectCommand({ Bucket: bucket(), Key: `probe/${randomUUID()}`, Body: 'x' })),
        credentials.accessKeyId,
      ).rejects.toThrow();
      wrong.destroy();
    }
  });
});
