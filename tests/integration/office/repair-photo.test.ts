import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as defectRoute from '@/app/api/defects/[id]/route';
import * as repairPhotos from '@/app/api/defects/[id]/photos/[photoId]/route';
import * as finish from '@/app/api/inspections/[id]/finish/route';
import * as steps from '@/app/api/inspections/[id]/steps/route';
import * as inspections from '@/app/api/inspections/route';
import { makeFleetFixture, type FleetFixture } from '../../setup/fleet-fixture';
import { readJson } from '../../setup/read-json';
import { callRoute, makeRequest } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';
import { answerEveryItemInDb } from '../../setup/walk-answers';

const db = getTestDb();
let f: FleetFixture;
let defectId: string;
const at = () => new Date().toISOString();

beforeAll(async () => {
  f = await makeFleetFixture(db, 'Repair photo fleet');
  const id = randomUUID();
  const cookie = f.cookies.driver;
  await callRoute(
    inspections.POST,
    makeRequest('/api/inspections', {
      method: 'POST',
      cookie,
      json: { id, kind: 'pre_trip', tractorId: f.tractor.id, trailerId: null, odometer: 9, startedAt: at() },
    }),
  );
  await callRoute(
    steps.POST,
    makeRequest(`/api/inspections/${id}/steps`, {
      method: 'POST',
      cookie,
      json: {
        id: randomUUID(),
        seq: 1,
        zone: 'in_cab',
        kind: 'defect',
        termKey: 'horn:inoperative',
        inputMode: 'tap',
        deviceAt: at(),
      },
    }),
    { id },
  );
  // Every other item answered: a report signs only when none is open.
  await answerEveryItemInDb(db, { fleetId: f.fleet.id, inspectionId: id, kind: 'pre_trip', hasTrailer: false });
  await callRoute(
    finish.POST,
    makeRequest(`/api/inspections/${id}/finish`, {
      method: 'POST',
      cookie,
      json: { signatureName: f.users.driver.name, certify: true, finishedAt: at() },
    }),
    { id },
  );
  defectId = (await db.selectFrom('defect').select('id').where('inspectionId', '=', id).executeTakeFirstOrThrow()).id;
});
afterAll(() => db.destroy());

describe('repair photos', () => {
  it('a mechanic adds a photo of the repair; it shows with the defect, once however often it is sent', async () => {
    const jpeg = await sharp({ create: { width: 400, height: 300, channels: 3, background: '#336699' } })
      .withMetadata({ exif: { IFD0: { Make: 'ShopCam' } } })
      .jpeg()
      .toBuffer();
    const photoId = randomUUID();
    const put = () =>
      callRoute(
        repairPhotos.PUT,
        makeRequest(`/api/defects/${defectId}/photos/${photoId}`, {
          method: 'PUT',
          cookie: f.cookies.mechanic,
          body: jpeg,
        }),
        { id: defectId, photoId },
      );
    expect((await put()).status).toBe(201);
    expect((await put()).status).toBe(200);
    const detail = await readJson<{ photos: { id: string }[] }>(
      await callRoute(defectRoute.GET, makeRequest(`/api/defects/${defectId}`, { cookie: f.cookies.mechanic }), {
        id: defectId,
      }),
    );
    expect(detail.photos.map((p) => p.id)).toContain(photoId);
    const rows = await db
      .selectFrom('attachment')
      .select(['defectId', 'uploadedBy'])
      .where('id', '=', photoId)
      .execute();
    expect(rows).toEqual([{ defectId, uploadedBy: f.users.mechanic.id }]);
  });

  it('another fleet’s defect is not found, and a file that is not a photo is refused', async () => {
    const other = await makeFleetFixture(db, 'Other repair fleet');
    const jpeg = await sharp({ create: { width: 40, height: 30, channels: 3, background: '#000' } })
      .jpeg()
      .toBuffer();
    const photoId = randomUUID();
    const foreign = await callRoute(
      repairPhotos.PUT,
      makeRequest(`/api/defects/${defectId}/photos/${photoId}`, {
        method: 'PUT',
        cookie: other.cookies.mechanic,
        body: jpeg,
      }),
      { id: defectId, photoId },
    );
    expect(foreign.status).toBe(404);
    const text = await callRoute(
      repairPhotos.PUT,
      makeRequest(`/api/defects/${defectId}/photos/${photoId}`, {
        method: 'PUT',
        cookie: f.cookies.mechanic,
        body: Buffer.from('not a photo'),
      }),
      { id: defectId, photoId },
    );
    expect(text.status).toBe(415);
  });
});
