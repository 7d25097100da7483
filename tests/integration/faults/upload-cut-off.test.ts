// An upload cut off half-way (the body stream breaks, or only half a JPEG arrives): a clear
// refusal, nothing stored; the same photo sent again is stored once, and the walk finishes.
import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as photos from '@/app/api/inspections/[id]/photos/[photoId]/route';
import { makeFleetFixture, type FleetFixture } from '../../setup/fleet-fixture';
import { callRoute, makeRequest } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';
import { postStep, signWalk, startWalk } from '../security/walk-helpers';
import { readError } from '../../setup/read-json';
import { answerEveryItem } from '../../setup/walk-answers';

const db = getTestDb();
let f: FleetFixture;
let jpeg: Buffer;
beforeAll(async () => {
  f = await makeFleetFixture(db, 'Upload fault fleet');
  // A photo with some detail, so that half of it is really half an image.
  jpeg = await sharp({
    create: {
      width: 1600,
      height: 1200,
      channels: 3,
      background: '#777777',
      noise: { type: 'gaussian', mean: 120, sigma: 40 },
    },
  })
    .jpeg({ quality: 85 })
    .toBuffer();
});
afterAll(() => db.destroy());

/** A PUT whose body stream sends the first half of the bytes, then breaks. */
function brokenUpload(inspectionId: string, photoId: string, stepId: string) {
  const half = jpeg.subarray(0, Math.floor(jpeg.length / 2));
  let sent = false;
  const body = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (!sent) {
        sent = true;
        controller.enqueue(new Uint8Array(half));
        return;
      }
      controller.error(new Error('socket hang up'));
    },
  });
  const req = new Request(`http://127.0.0.1:3100/api/inspections/${inspectionId}/photos/${photoId}?stepId=${stepId}`, {
    method: 'PUT',
    headers: {
      cookie: f.cookies.driver,
      origin: 'http://127.0.0.1:3100',
      'content-type': 'image/jpeg',
      'content-length': String(jpeg.length),
    },
    body,
    duplex: 'half',
  } as RequestInit);
  return callRoute(photos.PUT, req, { id: inspectionId, photoId });
}

const upload = (inspectionId: string, photoId: string, stepId: string, bytes: Uint8Array<ArrayBuffer>) =>
  callRoute(
    photos.PUT,
    makeRequest(`/api/inspections/${inspectionId}/photos/${photoId}?stepId=${stepId}`, {
      method: 'PUT',
      cookie: f.cookies.driver,
      headers: { 'content-type': 'image/jpeg' },
      body: bytes,
    }),
    { id: inspectionId, photoId },
  );

const attachmentsOf = (inspectionId: string) =>
  db.selectFrom('attachment').select(['id', 'stepId', 'sizeBytes']).where('inspectionId', '=', inspectionId).execute();

describe('an upload cut off half-way', () => {
  it('is refused with a clear message, stores nothing, and the retry stores the photo once', async () => {
    const inspectionId = randomUUID();
    expect((await startWalk(f, inspectionId)).status).toBe(201);
    const stepId = randomUUID();
    expect(
      (
        await postStep(f, inspectionId, {
          id: stepId,
          seq: 1,
          zone: 'in_cab',
          kind: 'defect',
          termKey: 'horn:inoperative',
        })
      ).status,
    ).toBe(201);
    const photoId = randomUUID();

    const broken = await brokenUpload(inspectionId, photoId, stepId);
    expect(broken.status).toBe(422);
    expect((await readError(broken)).message).toBe(
      'The upload was cut off before it finished. Nothing was saved; send the photo again.',
    );
    expect(await attachmentsOf(inspectionId)).toEqual([]);

    // Only the first half of the file arrived, as a complete request.
    const halfFile = await upload(
      inspectionId,
      photoId,
      stepId,
      new Uint8Array(jpeg.subarray(0, Math.floor(jpeg.length / 2))),
    );
    expect(halfFile.status).toBeGreaterThanOrEqual(400);
    expect(halfFile.status).toBeLessThan(500);
    expect((await readError(halfFile)).message).toMatch(/photo|image/i);
    expect(await attachmentsOf(inspectionId)).toEqual([]);

    // The device sends it again, whole, and once more after a lost answer.
    expect((await upload(inspectionId, photoId, stepId, new Uint8Array(jpeg))).status).toBe(201);
    expect((await upload(inspectionId, photoId, stepId, new Uint8Array(jpeg))).status).toBe(200);
    const stored = await attachmentsOf(inspectionId);
    expect(stored).toHaveLength(1);
    expect(stored[0]).toMatchObject({ id: photoId, stepId });

    // The walk finishes: one step, one photo, signed.
    expect(
      (await postStep(f, inspectionId, { id: randomUUID(), seq: 2, zone: 'in_cab', kind: 'zone_ok' })).status,
    ).toBe(201);
    // Every other item answered, as a report signs only when none is open.
    const answers = answerEveryItem({ kind: 'pre_trip', hasTrailer: false, fromSeq: 3 });
    for (const body of answers) expect((await postStep(f, inspectionId, body)).status).toBe(201);
    expect((await signWalk(f, inspectionId)).status).toBe(200);
    const steps = await db
      .selectFrom('inspectionStep')
      .select('seq')
      .where('inspectionId', '=', inspectionId)
      .orderBy('seq')
      .execute();
    expect(steps.map((s) => s.seq)).toEqual([1, 2, ...answers.map((a) => a.seq)]);
    const report = await db
      .selectFrom('inspection')
      .select('status')
      .where('id', '=', inspectionId)
      .executeTakeFirstOrThrow();
    expect(report.status).toBe('submitted');
  });
});
