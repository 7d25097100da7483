// The signed report says exactly what was inspected: each refusal below is what a driver or
// mechanic sees when the record would otherwise say more than happened.
import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as fleetSettings from '@/app/api/admin/fleet/route';
import * as certification from '@/app/api/defects/[id]/certification/route';
import * as finish from '@/app/api/inspections/[id]/finish/route';
import * as photos from '@/app/api/inspections/[id]/photos/[photoId]/route';
import * as signature from '@/app/api/inspections/[id]/signature/route';
import * as steps from '@/app/api/inspections/[id]/steps/route';
import * as inspections from '@/app/api/inspections/route';
import * as report from '@/app/api/reports/[id]/route';
import { checkReportIntegrity } from '@/lib/services/reports/get-report-integrity';
import { getSupervisorBoard } from '@/lib/services/units/get-supervisor-board';
import { getObjectBytes, putObject } from '@/lib/storage';
import { makeUnit } from '../../../db/factories';
import { makeFleetFixture, type FleetFixture } from '../../setup/fleet-fixture';
import { readError, readJson } from '../../setup/read-json';
import { callRoute, makeRequest } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';
import { answerEveryItem } from '../../setup/walk-answers';

type StepAnswer = { step: Record<string, unknown> };

const db = getTestDb();
let f: FleetFixture;
const iso = (offsetMs = 0) => new Date(Date.now() + offsetMs).toISOString();

beforeAll(async () => {
  f = await makeFleetFixture(db, 'Evidence fleet');
});
afterAll(() => db.destroy());

const start = (id: string, over: Record<string, unknown> = {}) =>
  callRoute(
    inspections.POST,
    makeRequest('/api/inspections', {
      method: 'POST',
      cookie: f.cookies.driver,
      json: {
        id,
        kind: 'pre_trip',
        tractorId: f.tractor.id,
        trailerId: null,
        odometer: 2000,
        startedAt: iso(),
        ...over,
      },
    }),
  );
const step = (inspectionId: string, body: Record<string, unknown>) =>
  callRoute(
    steps.POST,
    makeRequest(`/api/inspections/${inspectionId}/steps`, {
      method: 'POST',
      cookie: f.cookies.driver,
      json: { inputMode: 'tap', deviceAt: iso(), ...body },
    }),
    { id: inspectionId },
  );
const sign = (inspectionId: string, over: Record<string, unknown> = {}) =>
  callRoute(
    finish.POST,
    makeRequest(`/api/inspections/${inspectionId}/finish`, {
      method: 'POST',
      cookie: f.cookies.driver,
      json: { signatureName: f.users.driver.name, certify: true, finishedAt: iso(), ...over },
    }),
    { id: inspectionId },
  );
const putPhoto = (inspectionId: string, photoId: string, bytes: Buffer, stepId?: string) =>
  callRoute(
    photos.PUT,
    makeRequest(`/api/inspections/${inspectionId}/photos/${photoId}${stepId ? `?stepId=${stepId}` : ''}`, {
      method: 'PUT',
      cookie: f.cookies.driver,
      body: new Uint8Array(bytes),
      headers: { 'content-type': 'application/octet-stream' },
    }),
    { id: inspectionId, photoId },
  );
const jpeg = (colour: string) =>
  sharp({ create: { width: 320, height: 240, channels: 3, background: colour } })
    .jpeg()
    .toBuffer();
const png = () =>
  sharp({ create: { width: 400, height: 150, channels: 4, background: '#ffffff' } })
    .png()
    .toBuffer();

async function refusalsLogged(inspectionId: string) {
  const rows = await db
    .selectFrom('auditLog')
    .select('detail')
    .where('entityId', '=', inspectionId)
    .where('action', '=', 'inspection.change_refused')
    .execute();
  return rows.length;
}

describe('signing while items are open', () => {
  it('ten taps of "All good here" leave the air-brake readings open: refused, each open item named', async () => {
    const id = randomUUID();
    expect((await start(id)).status).toBe(201);
    const all = answerEveryItem({ kind: 'pre_trip', hasTrailer: false, fromSeq: 0 }).filter(
      (b) => b.kind === 'zone_ok',
    );
    for (const b of all) expect((await step(id, b)).status).toBe(201);
    const refused = await sign(id);
    expect(refused.status).toBe(409);
    const error = await readError(refused);
    expect(error.message).toBe(
      '6 items are still open, so the report cannot be signed: air-brake tests: air pressure build-up time; air-brake tests: governor cut-out; air-brake tests: governor cut-in; air-brake tests: leakage, brakes released; air-brake tests: leakage, brakes applied; air-brake tests: low-air warning. Mark each OK, a defect, a reading, or not checked with a reason.',
    );
    expect(error.fields?.openItems).toEqual([
      'air.buildup',
      'air.cutout',
      'air.cutin',
      'air.static_leak',
      'air.applied_leak',
      'air.low_air',
    ]);
    const row = await db.selectFrom('inspection').select('status').where('id', '=', id).executeTakeFirstOrThrow();
    expect(row.status).toBe('draft');
  });

  it('a required reading is a number or "not checked" with a reason from the list; then it signs', async () => {
    const id = randomUUID();
    expect((await start(id)).status).toBe(201);
    const answered = answerEveryItem({ kind: 'pre_trip', hasTrailer: false, fromSeq: 0 });
    const buildup = answered.find((b) => b.item === 'air.buildup')!;
    for (const b of answered.filter((x) => x !== buildup)) expect((await step(id, b)).status).toBe(201);
    const noReason = await step(id, { ...buildup, id: randomUUID(), kind: 'not_checked', reading: null });
    expect(noReason.status).toBe(422);
    expect((await readError(noReason)).fields?.notCheckedReason).toEqual(['Pick why the item was not checked.']);
    const otherNoNote = await step(id, {
      ...buildup,
      id: randomUUID(),
      kind: 'not_checked',
      reading: null,
      notCheckedReason: 'other',
    });
    expect((await readError(otherNoNote)).fields?.note).toEqual(['Write a short note for “other”.']);
    // "All good" is not an answer to a reading: an OK on a reading item is refused.
    const okOnReading = await step(id, { ...buildup, id: randomUUID(), kind: 'ok', reading: null });
    expect(okOnReading.status).toBe(422);
    expect((await readError(okOnReading)).message).toBe(
      'An item that needs a reading is answered by the number or by “not checked”.',
    );
    expect((await sign(id)).status).toBe(409);
    const skipped = await step(id, {
      ...buildup,
      id: randomUUID(),
      kind: 'not_checked',
      reading: null,
      notCheckedReason: 'no_gauge',
    });
    expect(skipped.status).toBe(201);
    expect((await readJson<StepAnswer>(skipped)).step).toMatchObject({
      kind: 'not_checked',
      notCheckedReason: 'no_gauge',
    });
    expect((await sign(id)).status).toBe(200);
  });
});

describe('times are the server’s', () => {
  it('refuses a start time in the future or from last century', async () => {
    const ahead = await start(randomUUID(), { startedAt: iso(20 * 60_000) });
    expect(ahead.status).toBe(422);
    expect((await readError(ahead)).message).toBe(
      'The phone’s clock is ahead of RigCall’s by 20 minutes, so the start time cannot be right. Set the phone to the network time and try again.',
    );
    const old = await start(randomUUID(), { startedAt: '1999-06-01T08:00:00Z' });
    expect(old.status).toBe(422);
    expect((await readError(old)).message).toMatch(/more than a day ago/);
  });

  it('refuses step and finish times from a clock that runs ahead, or from before the start', async () => {
    const id = randomUUID();
    expect((await start(id)).status).toBe(201);
    const future = await step(id, {
      id: randomUUID(),
      seq: 0,
      zone: 'front',
      kind: 'visit',
      deviceAt: '2999-01-01T00:00:00Z',
    });
    expect(future.status).toBe(422);
    expect((await readError(future)).message).toMatch(
      /^The phone’s clock is ahead of RigCall’s by \d+ minutes, so the step time cannot be right\./,
    );
    const before = await step(id, { id: randomUUID(), seq: 0, zone: 'front', kind: 'visit', deviceAt: iso(-3600_000) });
    expect(before.status).toBe(422);
    expect((await readError(before)).message).toMatch(/^The step time is before the inspection started/);
    for (const b of answerEveryItem({ kind: 'pre_trip', hasTrailer: false, fromSeq: 1 }))
      expect((await step(id, b)).status).toBe(201);
    const lateFinish = await sign(id, { finishedAt: iso(20 * 60_000) });
    expect(lateFinish.status).toBe(422);
    expect((await readError(lateFinish)).message).toMatch(/so the finish time cannot be right/);
  });

  it('a two-second walk is short on the server’s clock, whatever the phone says', async () => {
    const id = randomUUID();
    expect((await start(id)).status).toBe(201);
    for (const b of answerEveryItem({ kind: 'pre_trip', hasTrailer: false, fromSeq: 0 }))
      expect((await step(id, b)).status).toBe(201);
    expect((await sign(id, { finishedAt: iso(4 * 60_000) })).status).toBe(200);
    const row = await db
      .selectFrom('inspection')
      .select(['durationS', 'durationSource'])
      .where('id', '=', id)
      .executeTakeFirstOrThrow();
    expect(row.durationSource).toBe('server');
    expect(row.durationS).toBeLessThan(60);
    const detail = await callRoute(report.GET, makeRequest(`/api/reports/${id}`, { cookie: f.cookies.supervisor }), {
      id,
    });
    expect((await readJson<{ duration: { short: boolean; clock: string } }>(detail)).duration).toMatchObject({
      short: true,
      clock: 'server',
    });
  });
});

describe('the same step id twice', () => {
  it('with the same payload answers the stored row; with another, 409 naming the conflict', async () => {
    const id = randomUUID();
    expect((await start(id)).status).toBe(201);
    const body = {
      id: randomUUID(),
      seq: 0,
      zone: 'front',
      kind: 'defect',
      termKey: 'horn:inoperative',
      inputMode: 'voice',
    };
    const first = await step(id, body);
    expect(first.status).toBe(201);
    const again = await step(id, body);
    expect(again.status).toBe(200);
    expect((await readJson<StepAnswer>(again)).step).toEqual((await readJson<StepAnswer>(first)).step);
    const other = await step(id, { ...body, termKey: 'headlight:inoperative' });
    expect(other.status).toBe(409);
    expect((await readError(other)).message).toBe(
      `Step ${body.id} is already recorded with other content (defect in front); a step id names one step only. Send the new entry with a new id.`,
    );
  });
});

describe('once signed, nothing is added', () => {
  const id = randomUUID();
  let findingId: string;
  let photoId: string;

  beforeAll(async () => {
    expect((await start(id)).status).toBe(201);
    findingId = randomUUID();
    expect(
      (
        await step(id, {
          id: findingId,
          seq: 0,
          zone: 'front',
          kind: 'defect',
          termKey: 'steer_tire:bulge',
          inputMode: 'voice',
        })
      ).status,
    ).toBe(201);
    photoId = randomUUID();
    expect((await putPhoto(id, photoId, await jpeg('#884422'), findingId)).status).toBe(201);
    const pad = await png();
    const sig = await callRoute(
      signature.PUT,
      makeRequest(`/api/inspections/${id}/signature`, {
        method: 'PUT',
        cookie: f.cookies.driver,
        body: new Uint8Array(pad),
      }),
      { id },
    );
    expect(sig.status).toBe(201);
    for (const b of answerEveryItem({ kind: 'pre_trip', hasTrailer: false, fromSeq: 1 }))
      expect((await step(id, b)).status).toBe(201);
    expect((await sign(id)).status).toBe(200);
  });

  it('a photo, even on the defect step, is refused with 409 and an audit row', async () => {
    const before = await refusalsLogged(id);
    const late = await putPhoto(id, randomUUID(), await jpeg('#224488'), findingId);
    expect(late.status).toBe(409);
    expect((await readError(late)).message).toBe('This report is signed and locked; no photo can be added to it.');
    expect(await refusalsLogged(id)).toBe(before + 1);
    // The photo sent before signing, sent again (a reconnect), is still the same photo.
    expect((await putPhoto(id, photoId, await jpeg('#884422'), findingId)).status).toBe(200);
  });

  it('a new signature is refused with 409 and an audit row; the same one sent again is not', async () => {
    const before = await refusalsLogged(id);
    const other = await sharp({ create: { width: 400, height: 150, channels: 4, background: '#000000' } })
      .png()
      .toBuffer();
    const put = (body: Buffer) =>
      callRoute(
        signature.PUT,
        makeRequest(`/api/inspections/${id}/signature`, {
          method: 'PUT',
          cookie: f.cookies.driver,
          body: new Uint8Array(body),
        }),
        { id },
      );
    const refused = await put(other);
    expect(refused.status).toBe(409);
    expect((await readError(refused)).message).toBe('This report is signed and locked; its signature cannot change.');
    expect(await refusalsLogged(id)).toBe(before + 1);
    expect((await put(await png())).status).toBe(200);
  });

  it('the integrity check re-reads the photo and the signature from storage: a changed one breaks the match', async () => {
    expect((await checkReportIntegrity({ fleetId: f.fleet.id, inspectionId: id })).ok).toBe(true);
    const row = await db
      .selectFrom('attachment')
      .select('objectKey')
      .where('id', '=', photoId)
      .executeTakeFirstOrThrow();
    const original = (await getObjectBytes(row.objectKey)).bytes;
    await putObject(row.objectKey, await jpeg('#00ff00'), 'image/jpeg');
    const after = await checkReportIntegrity({ fleetId: f.fleet.id, inspectionId: id });
    expect(after.ok).toBe(false);
    expect(after.message).toMatch(/does not match what the driver signed/);
    await putObject(row.objectKey, original, 'image/jpeg');
    expect((await checkReportIntegrity({ fleetId: f.fleet.id, inspectionId: id })).ok).toBe(true);
    const sig = await db.selectFrom('inspection').select('signatureKey').where('id', '=', id).executeTakeFirstOrThrow();
    const other = await sharp({ create: { width: 400, height: 150, channels: 4, background: '#ff0000' } })
      .png()
      .toBuffer();
    await putObject(sig.signatureKey!, other, 'image/png');
    expect((await checkReportIntegrity({ fleetId: f.fleet.id, inspectionId: id })).ok).toBe(false);
  });

  it('a repair certified under another person’s name is refused; under the mechanic’s own, it is taken', async () => {
    const defect = await db.selectFrom('defect').select('id').where('inspectionId', '=', id).executeTakeFirstOrThrow();
    const certify = (certifiedName: string) =>
      callRoute(
        certification.POST,
        makeRequest(`/api/defects/${defect.id}/certification`, {
          method: 'POST',
          cookie: f.cookies.mechanic,
          json: { outcome: 'repaired', work: 'Replaced the tire', certifiedName, confirm: true },
        }),
        { id: defect.id },
      );
    const other = await certify('Dana Other');
    expect(other.status).toBe(422);
    expect((await readError(other)).message).toBe(
      `Sign with your name as it is on your account: ${f.users.mechanic.name}.`,
    );
    expect((await certify(f.users.mechanic.name)).status).toBe(201);
  });
});

describe('a clean post-trip', () => {
  it('walks its own zones, signs, and is never flagged for skipping the air-brake tests', async () => {
    // Units of their own: the tractor above is out of service for its bulge.
    const tractor = await makeUnit(db, { fleetId: f.fleet.id, kind: 'tractor' });
    const trailer = await makeUnit(db, { fleetId: f.fleet.id, kind: 'trailer' });
    const id = randomUUID();
    const begun = await start(id, { kind: 'post_trip', tractorId: tractor.id, trailerId: trailer.id });
    expect(begun.status).toBe(201);
    const answered = answerEveryItem({ kind: 'post_trip', hasTrailer: true, fromSeq: 0 });
    expect(answered.map((b) => b.zone)).not.toContain('air_brake_tests');
    for (const b of answered) expect((await step(id, b)).status).toBe(201);
    expect((await sign(id)).status).toBe(200);
    const detail = await callRoute(report.GET, makeRequest(`/api/reports/${id}`, { cookie: f.cookies.supervisor }), {
      id,
    });
    expect((await readJson<{ skippedZones: unknown[] }>(detail)).skippedZones).toEqual([]);
    const board = await getSupervisorBoard({ fleetId: f.fleet.id });
    const row = board.attention.find((r) => r.id === id);
    expect(row?.reasons ?? []).not.toContain('zones_skipped');
  });
});

describe('fleet settings choose the required readings and the tire-pressure tolerance', () => {
  let g: FleetFixture;
  beforeAll(async () => {
    g = await makeFleetFixture(db, 'Settings fleet');
    await db
      .updateTable('unit')
      .set({ axles: JSON.stringify([{ position: 'steer', tires: ['LF', 'RF'], coldPsi: 110, chamber: '24' }]) })
      .where('id', '=', g.tractor.id)
      .execute();
  });
  const patch = (json: Record<string, unknown>) =>
    callRoute(fleetSettings.PATCH, makeRequest('/api/admin/fleet', { method: 'PATCH', cookie: g.cookies.admin, json }));
  const post = (inspectionId: string, body: Record<string, unknown>) =>
    callRoute(
      steps.POST,
      makeRequest(`/api/inspections/${inspectionId}/steps`, {
        method: 'POST',
        cookie: g.cookies.driver,
        json: { inputMode: 'typed', deviceAt: iso(), ...body },
      }),
      { id: inspectionId },
    );
  const begin = async () => {
    const id = randomUUID();
    const res = await callRoute(
      inspections.POST,
      makeRequest('/api/inspections', {
        method: 'POST',
        cookie: g.cookies.driver,
        json: { id, kind: 'pre_trip', tractorId: g.tractor.id, trailerId: null, odometer: 1, startedAt: iso() },
      }),
    );
    expect(res.status).toBe(201);
    return id;
  };

  it('by default a steer tire 1 psi under its 110 psi target passes (2 psi gauge tolerance); at 0 psi tolerance it is a minor defect', async () => {
    const reading = (id: string) =>
      post(id, {
        id: randomUUID(),
        seq: 1,
        zone: 'front',
        item: 'front.steer_pressure',
        kind: 'measurement',
        reading: { value: 109 },
      });
    const first = await begin();
    expect((await readJson<StepAnswer>(await reading(first))).step).toMatchObject({ verdict: 'pass', severity: null });
    const set = await patch({ tirePressureTolerancePsi: 0 });
    expect(set.status).toBe(200);
    const second = await begin();
    expect((await readJson<StepAnswer>(await reading(second))).step).toMatchObject({
      verdict: 'fail',
      severity: 'minor',
    });
    const tooLoose = await patch({ tirePressureTolerancePsi: 25 });
    expect(tooLoose.status).toBe(422);
    expect((await readError(tooLoose)).fields?.tirePressureTolerancePsi).toEqual([
      'A tolerance above 10 psi would hide a tire that really is low.',
    ]);
  });

  it('a fleet that requires tread depth cannot sign a pre-trip without it', async () => {
    expect((await patch({ requiredReadings: ['tread_depth', 'air_leak'] })).status).toBe(200);
    const id = await begin();
    for (const b of answerEveryItem({ kind: 'pre_trip', hasTrailer: false, fromSeq: 10 })) await post(id, b);
    const refused = await callRoute(
      finish.POST,
      makeRequest(`/api/inspections/${id}/finish`, {
        method: 'POST',
        cookie: g.cookies.driver,
        json: { signatureName: g.users.driver.name, certify: true, finishedAt: iso() },
      }),
      { id },
    );
    expect(refused.status).toBe(409);
    expect((await readError(refused)).fields?.openItems).toEqual([
      'front.steer_tread',
      'dst.drive_tread',
      'pst.drive_tread',
    ]);
  });
});
