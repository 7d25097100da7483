// Defect 7 of issue 16: an id already used by another fleet (ids are chosen by the device) gets
// the same clean 409 as any id already taken: never a 500, never an answer that tells the ids
// apart, and never a stored object without a row.
import { randomUUID } from 'node:crypto';
import { sql } from 'kysely';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as acknowledgements from '@/app/api/acknowledgements/route';
import * as inspections from '@/app/api/inspections/route';
import * as photos from '@/app/api/inspections/[id]/photos/[photoId]/route';
import { getObjectBytes } from '@/lib/storage';
import { makeFleetFixture, type FleetFixture } from '../../setup/fleet-fixture';
import { callRoute, makeRequest, sessionCookieFor } from '../../setup/session';
import { makeUser } from '../../../db/factories';
import { getTestDb } from '../../setup/test-db';

const db = getTestDb();
let a: FleetFixture;
let b: FleetFixture;
beforeAll(async () => {
  a = await makeFleetFixture(db, 'Ids fleet A');
  b = await makeFleetFixture(db, 'Ids fleet B');
});
afterAll(() => db.destroy());

const start = (f: FleetFixture, id: string, cookie = f.cookies.driver) =>
  callRoute(
    inspections.POST,
    makeRequest('/api/inspections', {
      method: 'POST',
      cookie,
      json: {
        id,
        kind: 'pre_trip',
        tractorId: f.tractor.id,
        trailerId: null,
        odometer: 10,
        startedAt: new Date().toISOString(),
      },
    }),
  );
const jpeg = () =>
  sharp({ create: { width: 8, height: 8, channels: 3, background: { r: 200, g: 40, b: 40 } } })
    .jpeg()
    .toBuffer();
const putPhoto = async (f: FleetFixture, inspectionId: string, photoId: string) =>
  callRoute(
    photos.PUT,
    makeRequest(`/api/inspections/${inspectionId}/photos/${photoId}`, {
      method: 'PUT',
      cookie: f.cookies.driver,
      body: new Uint8Array(await jpeg()),
      headers: { 'content-type': 'image/jpeg' },
    }),
    { id: inspectionId, photoId },
  );

describe('ids of another fleet (issue 16, defect 7)', () => {
  it("defect 7: starting with another fleet's inspection id is the same 409 as any taken id", async () => {
    const foreign = await start(a, b.inspection.id);
    expect(foreign.status).toBe(409);
    // Own fleet, another driver's id: the same answer, word for word.
    const ownId = randomUUID();
    expect((await start(a, ownId)).status).toBe(201);
    const second = await makeUser(db, { fleetId: a.fleet.id, roles: ['driver'] });
    const own = await start(a, ownId, await sessionCookieFor({ ...second, roles: ['driver'] }));
    expect(own.status).toBe(409);
    expect(await foreign.json()).toEqual(await own.json());
  });

  it("defect 7: an acknowledgement with another fleet's id is a 409, not a 500", async () => {
    // A signed report on fleet B's tractor, acknowledged in fleet B.
    await sql`update inspection set status = 'submitted', finished_at = now(), signed_at = now(), content_hash = 'x', signature_name = 'B Driver' where id = ${b.inspection.id}`.execute(
      db,
    );
    await sql`update inspection set status = 'submitted', finished_at = now(), signed_at = now(), content_hash = 'x', signature_name = 'A Driver' where id = ${a.inspection.id}`.execute(
      db,
    );
    const ackId = randomUUID();
    await db
      .insertInto('acknowledgement')
      .values({
        id: ackId,
        fleetId: b.fleet.id,
        unitId: b.tractor.id,
        reviewedInspectionId: b.inspection.id,
        driverId: b.users.driver.id,
        signatureName: b.users.driver.name,
        statement: 'reviewed',
      })
      .execute();
    const res = await callRoute(
      acknowledgements.POST,
      makeRequest('/api/acknowledgements', {
        method: 'POST',
        cookie: a.cookies.driver,
        json: {
          id: ackId,
          unitId: a.tractor.id,
          reviewedInspectionId: a.inspection.id,
          signatureName: a.users.driver.name,
        },
      }),
    );
    expect(res.status).toBe(409);
    expect(await res.json()).toEqual(await (await start(a, b.inspection.id)).json());
  });

  it("defect 7: a photo with another fleet's photo id is a 409 and stores nothing", async () => {
    const theirs = randomUUID();
    const theirWalk = randomUUID();
    expect((await start(b, theirWalk)).status).toBe(201);
    expect((await putPhoto(b, theirWalk, theirs)).status).toBe(201);
    // Fleet A: an open inspection of its own, and B's photo id.
    const mine = randomUUID();
    expect((await start(a, mine)).status).toBe(201);
    const res = await putPhoto(a, mine, theirs);
    expect(res.status).toBe(409);
    expect(await res.json()).toEqual(await (await start(a, b.inspection.id)).json());
    const key = `fleet/${a.fleet.id}/inspections/${mine}/photos/${theirs}.jpg`;
    await expect(getObjectBytes(key)).rejects.toThrow();
    await expect(getObjectBytes(key.replace(/\.jpg$/, '.thumb.jpg'))).rejects.toThrow();
    const rows = await db.selectFrom('attachment').select('fleetId').where('id', '=', theirs).execute();
    expect(rows).toEqual([{ fleetId: b.fleet.id }]);
  });

  it('defect 7: a photo for an inspection that is not ours is refused before it is decoded or stored', async () => {
    const ghost = randomUUID();
    const photoId = randomUUID();
    // Not even an image: the ownership check answers first.
    const res = await callRoute(
      photos.PUT,
      makeRequest(`/api/inspections/${ghost}/photos/${photoId}`, {
        method: 'PUT',
        cookie: a.cookies.driver,
        body: new Uint8Array([1, 2, 3, 4]),
        headers: { 'content-type': 'image/jpeg' },
      }),
      { id: ghost, photoId },
    );
    expect(res.status).toBe(404);
  });
});
