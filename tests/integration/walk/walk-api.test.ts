import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as acks from '@/app/api/acknowledgements/route';
import * as attachments from '@/app/api/attachments/[id]/route';
import * as finish from '@/app/api/inspections/[id]/finish/route';
import * as photos from '@/app/api/inspections/[id]/photos/[photoId]/route';
import * as signature from '@/app/api/inspections/[id]/signature/route';
import * as steps from '@/app/api/inspections/[id]/steps/route';
import * as inspections from '@/app/api/inspections/route';
import * as report from '@/app/api/reports/[id]/route';
import * as review from '@/app/api/units/[id]/review/route';
import { makeFleetFixture, type FleetFixture } from '../../setup/fleet-fixture';
import { callRoute, makeRequest } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';
import { readError, readJson } from '../../setup/read-json';
import { answerEveryItem } from '../../setup/walk-answers';

/** What these tests read of the answers (the assertions check the values). */
type StepBody = { step: { severity: string | null } & Record<string, unknown> };
type ReviewBody = { review: { mustAcknowledge: boolean; mayOperate: boolean } };
type CaughtList = { messages: { subject: string }[] };

const db = getTestDb();
let f: FleetFixture;
const now = () => new Date().toISOString();

beforeAll(async () => {
  f = await makeFleetFixture(db, 'Walk fleet');
  await db
    .updateTable('fleet')
    .set({
      maintenanceEmail: `shop-${f.fleet.slug}@test.example`,
      supervisorEmail: `boss-${f.fleet.slug}@test.example`,
    })
    .where('id', '=', f.fleet.id)
    .execute();
  await db
    .updateTable('unit')
    .set({
      axles: JSON.stringify([
        { position: 'steer', tires: ['LF', 'RF'], coldPsi: 110, chamber: '24' },
        { position: 'drive', tires: ['A', 'B', 'C', 'D'], coldPsi: 100, chamber: '30' },
      ]),
    })
    .where('id', '=', f.tractor.id)
    .execute();
});
afterAll(() => db.destroy());

const start = (id: string, cookie = f.cookies.driver) =>
  callRoute(
    inspections.POST,
    makeRequest('/api/inspections', {
      method: 'POST',
      cookie,
      json: {
        id,
        kind: 'pre_trip',
        tractorId: f.tractor.id,
        trailerId: f.trailer.id,
        odometer: 120500,
        location: 'Test yard',
        startedAt: now(),
      },
    }),
  );
const step = (inspectionId: string, body: Record<string, unknown>, cookie = f.cookies.driver) =>
  callRoute(
    steps.POST,
    makeRequest(`/api/inspections/${inspectionId}/steps`, {
      method: 'POST',
      cookie,
      json: { inputMode: 'voice', deviceAt: now(), ...body },
    }),
    { id: inspectionId },
  );

describe('the walk through the API', () => {
  const inspectionId = randomUUID();
  const finding = randomUUID();
  const reading = randomUUID();
  const retracted = randomUUID();

  it('starts once, however often the start is sent', async () => {
    expect((await start(inspectionId)).status).toBe(201);
    expect((await start(inspectionId)).status).toBe(200);
    const rows = await db
      .selectFrom('inspection')
      .select(['id', 'status', 'ruleProfile'])
      .where('id', '=', inspectionId)
      .execute();
    expect(rows).toEqual([{ id: inspectionId, status: 'draft', ruleProfile: 'us-federal' }]);
  });

  it('records a finding with the severity from the vocabulary, once, however often it is sent', async () => {
    const body = {
      id: finding,
      seq: 1,
      zone: 'front',
      kind: 'defect',
      heard: 'bulge on the left steer tire',
      termKey: 'steer_tire:bulge',
      position: 'left',
      score: 0.97,
      resolution: 'auto',
    };
    const first = await step(inspectionId, body);
    expect(first.status).toBe(201);
    expect((await readJson<StepBody>(first)).step).toMatchObject({
      component: 'steer tire',
      condition: 'bulge',
      severity: 'major',
    }); // 49 CFR 393.75(a)(2)
    expect((await step(inspectionId, body)).status).toBe(200);
    const n = await db
      .selectFrom('inspectionStep')
      .select((eb) => eb.fn.countAll<number>().as('n'))
      .where('id', '=', finding)
      .executeTakeFirstOrThrow();
    expect(Number(n.n)).toBe(1);
  });

  it('judges a reading on the server from the unit data', async () => {
    // 49 CFR 393.75(b): steer tread at least 4/32 in
    const res = await step(inspectionId, {
      id: reading,
      seq: 2,
      zone: 'front',
      kind: 'measurement',
      item: 'front.steer_tread',
      heard: 'steer tread three thirty seconds',
      reading: { value: 3 },
    });
    expect(res.status).toBe(201);
    expect((await readJson<StepBody>(res)).step).toMatchObject({
      measurementKind: 'tread_depth',
      value: 3,
      unit: '32nds',
      verdict: 'fail',
      limitText: '4 32nds',
    });
  });

  it('takes a step back as a recorded correction, never a deletion', async () => {
    expect(
      (
        await step(inspectionId, {
          id: retracted,
          seq: 3,
          zone: 'front',
          kind: 'defect',
          termKey: 'mirror:cracked',
          heard: 'mirror cracked',
        })
      ).status,
    ).toBe(201);
    expect(
      (
        await step(inspectionId, {
          id: randomUUID(),
          seq: 4,
          zone: 'front',
          kind: 'undo',
          undoesStepId: retracted,
          heard: 'undo',
        })
      ).status,
    ).toBe(201);
    expect(
      await db.selectFrom('inspectionStep').select('id').where('id', '=', retracted).executeTakeFirst(),
    ).toBeTruthy();
  });

  it('refuses what it cannot judge, with a message a person can read', async () => {
    const bad = await step(inspectionId, {
      id: randomUUID(),
      seq: 5,
      zone: 'front',
      kind: 'measurement',
      item: 'front.steer_tread',
      reading: { value: -2 },
    });
    expect(bad.status).toBe(422);
    expect((await readError(bad)).message).toMatch(/negative/);
    const unknownTerm = await step(inspectionId, {
      id: randomUUID(),
      seq: 5,
      zone: 'front',
      kind: 'defect',
      termKey: 'flux_capacitor:cracked',
    });
    expect(unknownTerm.status).toBe(422);
  });

  it('stores a photo re-encoded without its metadata, and serves it back', async () => {
    const photoId = randomUUID();
    const jpeg = await sharp({ create: { width: 800, height: 600, channels: 3, background: '#c04020' } })
      .withMetadata({ exif: { IFD0: { Copyright: 'secret place', Make: 'TestCam' } } })
      .jpeg()
      .toBuffer();
    expect((await sharp(jpeg).metadata()).exif).toBeDefined();
    const put = await callRoute(
      photos.PUT,
      makeRequest(`/api/inspections/${inspectionId}/photos/${photoId}?stepId=${finding}`, {
        method: 'PUT',
        cookie: f.cookies.driver,
        body: jpeg,
        headers: { 'content-type': 'application/octet-stream' },
      }),
      { id: inspectionId, photoId },
    );
    expect(put.status).toBe(201);
    const got = await callRoute(
      attachments.GET,
      makeRequest(`/api/attachments/${photoId}`, { cookie: f.cookies.supervisor }),
      { id: photoId },
    );
    expect(got.status).toBe(200);
    const back = Buffer.from(await got.arrayBuffer());
    const meta = await sharp(back).metadata();
    expect(meta.exif).toBeUndefined();
    expect(meta.width).toBe(800);
    const notImage = await callRoute(
      photos.PUT,
      makeRequest(`/api/inspections/${inspectionId}/photos/${randomUUID()}`, {
        method: 'PUT',
        cookie: f.cookies.driver,
        body: Buffer.from('<html>hello</html>'),
        headers: { 'content-type': 'image/jpeg' },
      }),
      { id: inspectionId, photoId: randomUUID() },
    );
    expect(notImage.status).toBe(415);
  });

  it('keeps a drawn signature as a PNG, and refuses anything else', async () => {
    const png = await sharp({ create: { width: 600, height: 200, channels: 4, background: '#ffffff' } })
      .png()
      .toBuffer();
    const put = () =>
      callRoute(
        signature.PUT,
        makeRequest(`/api/inspections/${inspectionId}/signature`, {
          method: 'PUT',
          cookie: f.cookies.driver,
          body: png,
        }),
        { id: inspectionId },
      );
    expect((await put()).status).toBe(201);
    const jpeg = await sharp({ create: { width: 60, height: 20, channels: 3, background: '#ffffff' } })
      .jpeg()
      .toBuffer();
    const wrong = await callRoute(
      signature.PUT,
      makeRequest(`/api/inspections/${inspectionId}/signature`, {
        method: 'PUT',
        cookie: f.cookies.driver,
        body: jpeg,
      }),
      { id: inspectionId },
    );
    expect(wrong.status).toBe(415);
    const row = await db
      .selectFrom('inspection')
      .select('signatureKey')
      .where('id', '=', inspectionId)
      .executeTakeFirstOrThrow();
    expect(row.signatureKey).toBe(`fleet/${f.fleet.id}/inspections/${inspectionId}/signature.png`);
  });

  it('signs and locks: defects created, unit out of service, maintenance mailed', async () => {
    // Every item answered first: signing is refused while one is open.
    for (const body of answerEveryItem({ kind: 'pre_trip', hasTrailer: true, fromSeq: 20 }))
      expect((await step(inspectionId, body)).status).toBe(201);
    const wrongName = await callRoute(
      finish.POST,
      makeRequest(`/api/inspections/${inspectionId}/finish`, {
        method: 'POST',
        cookie: f.cookies.driver,
        json: { signatureName: 'Someone Else', certify: true, finishedAt: now() },
      }),
      { id: inspectionId },
    );
    expect(wrongName.status).toBe(422);
    const signed = await callRoute(
      finish.POST,
      makeRequest(`/api/inspections/${inspectionId}/finish`, {
        method: 'POST',
        cookie: f.cookies.driver,
        json: { signatureName: f.users.driver.name, certify: true, finishedAt: now() },
      }),
      { id: inspectionId },
    );
    expect(signed.status).toBe(200);
    const defects = await db
      .selectFrom('defect')
      .select(['stepId', 'severity', 'unitId', 'status'])
      .where('inspectionId', '=', inspectionId)
      .orderBy('createdAt')
      .execute();
    expect(defects.map((d) => d.stepId).sort()).toEqual([finding, reading].sort()); // the retracted one is not a defect
    expect(defects.every((d) => d.unitId === f.tractor.id && d.status === 'open')).toBe(true);
    const unit = await db.selectFrom('unit').select('status').where('id', '=', f.tractor.id).executeTakeFirstOrThrow();
    expect(unit.status).toBe('out_of_service');
    const row = await db
      .selectFrom('inspection')
      .select(['status', 'contentHash', 'signatureName'])
      .where('id', '=', inspectionId)
      .executeTakeFirstOrThrow();
    expect(row.status).toBe('submitted');
    expect(row.contentHash).toMatch(/^[0-9a-f]{64}$/);
    const mail = await readJson<CaughtList>(
      await fetch(
        `${process.env.MAIL_CATCHER_URL}/messages?to=${encodeURIComponent(`shop-${f.fleet.slug}@test.example`)}`,
      ),
    );
    expect(mail.messages[0]?.subject).toMatch(/OUT OF SERVICE/);
  });

  it('refuses any change to the locked report, and logs the attempt', async () => {
    const late = await step(inspectionId, {
      id: randomUUID(),
      seq: 9,
      zone: 'rear',
      kind: 'zone_ok',
      heard: 'all good',
    });
    expect(late.status).toBe(409);
    const logged = await db
      .selectFrom('auditLog')
      .select('action')
      .where('entityId', '=', inspectionId)
      .where('action', '=', 'inspection.change_refused')
      .execute();
    expect(logged.length).toBe(1);
    // A replay of a step that was already recorded (the same payload) is still harmless.
    const replay = await step(inspectionId, {
      id: finding,
      seq: 1,
      zone: 'front',
      kind: 'defect',
      heard: 'bulge on the left steer tire',
      termKey: 'steer_tire:bulge',
      position: 'left',
      score: 0.97,
      resolution: 'auto',
    });
    expect(replay.status).toBe(200);
  });

  it('asks the next driver to review and sign the last report before the next walk (49 CFR 396.13)', async () => {
    const r = await callRoute(
      review.GET,
      makeRequest(`/api/units/${f.tractor.id}/review`, { cookie: f.cookies.driver }),
      { id: f.tractor.id },
    );
    const body = await readJson<ReviewBody>(r);
    expect(body.review.mustAcknowledge).toBe(true);
    expect(body.review.mayOperate).toBe(false);
    const blocked = await start(randomUUID());
    expect(blocked.status).toBe(409);
    expect((await readError(blocked)).message).toMatch(/Review and sign the last report/);
    const ack = await callRoute(
      acks.POST,
      makeRequest('/api/acknowledgements', {
        method: 'POST',
        cookie: f.cookies.driver,
        json: {
          id: randomUUID(),
          unitId: f.tractor.id,
          reviewedInspectionId: inspectionId,
          signatureName: f.users.driver.name,
        },
      }),
    );
    expect(ack.status).toBe(201);
    const trailerAck = await callRoute(
      review.GET,
      makeRequest(`/api/units/${f.trailer.id}/review`, { cookie: f.cookies.driver }),
      { id: f.trailer.id },
    );
    expect((await readJson<ReviewBody>(trailerAck)).review.mustAcknowledge).toBe(false);
    expect((await start(randomUUID())).status).toBe(201);
  });
});

describe('signing names every step the phone recorded', () => {
  // The phone keeps its steps until the report locks, and the server commits an open walk's steps
  // without waiting for its disk: a step it lost in a crash is found here and sent again.
  // A fleet of its own, so that the walk tests below find their tractor as they expect it.
  let g: FleetFixture;
  beforeAll(async () => {
    g = await makeFleetFixture(db, 'Signing fleet');
  });
  const inspectionId = randomUUID();
  const [first, second, neverArrived] = [randomUUID(), randomUUID(), randomUUID()];
  const begin = () =>
    callRoute(
      inspections.POST,
      makeRequest('/api/inspections', {
        method: 'POST',
        cookie: g.cookies.driver,
        json: {
          id: inspectionId,
          kind: 'pre_trip',
          tractorId: g.tractor.id,
          trailerId: null,
          odometer: 88000,
          startedAt: now(),
        },
      }),
    );
  const record = (body: Record<string, unknown>) =>
    callRoute(
      steps.POST,
      makeRequest(`/api/inspections/${inspectionId}/steps`, {
        method: 'POST',
        cookie: g.cookies.driver,
        json: { inputMode: 'voice', deviceAt: now(), ...body },
      }),
      { id: inspectionId },
    );
  const sign = (stepIds: string[]) =>
    callRoute(
      finish.POST,
      makeRequest(`/api/inspections/${inspectionId}/finish`, {
        method: 'POST',
        cookie: g.cookies.driver,
        json: { signatureName: g.users.driver.name, certify: true, finishedAt: now(), stepIds },
      }),
      { id: inspectionId },
    );

  it('refuses to lock while the server lacks one, names it, and changes nothing', async () => {
    expect((await begin()).status).toBe(201);
    expect((await record({ id: first, seq: 0, zone: 'front', kind: 'visit', inputMode: 'tap' })).status).toBe(201);
    // The walk is known now, so this one takes the one-statement path; its answer must be the
    // same row, in the same words, as the careful path gives back for a replay of it.
    const secondBody = {
      id: second,
      seq: 1,
      zone: 'front',
      kind: 'defect',
      heard: 'horn does not work',
      termKey: 'horn:inoperative',
      score: 0.95,
      resolution: 'auto',
    };
    const quick = await record(secondBody);
    expect(quick.status).toBe(201);
    const quickStep = (await readJson<StepBody>(quick)).step;
    expect(quickStep).toMatchObject({
      id: second,
      termKey: 'horn:inoperative',
      inputMode: 'voice',
      kind: 'defect',
      alternatives: [],
      undoesStepId: null,
    });
    expect(quickStep.severity).toMatch(/^(minor|major)$/);
    const replay = await record(secondBody);
    expect(replay.status).toBe(200);
    expect((await readJson<StepBody>(replay)).step).toEqual(quickStep);
    const refused = await sign([first, second, neverArrived]);
    expect(refused.status).toBe(409);
    const error = await readError(refused);
    expect(error.fields?.stepIds).toEqual([neverArrived]);
    expect(error.message).toMatch(/One step recorded on this phone has not reached/);
    const row = await db
      .selectFrom('inspection')
      .select(['status', 'contentHash'])
      .where('id', '=', inspectionId)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({ status: 'draft', contentHash: null });
    const defects = await db.selectFrom('defect').select('id').where('inspectionId', '=', inspectionId).execute();
    expect(defects).toEqual([]);
  });

  it('locks once the phone has sent it again, with every step in the report', async () => {
    expect(
      (
        await record({
          id: neverArrived,
          seq: 2,
          zone: 'front',
          kind: 'zone_ok',
          heard: 'all good',
          score: 0.99,
          resolution: 'auto',
        })
      ).status,
    ).toBe(201);
    // The rest of the walk, every item answered (the front was answered by the step that arrived late).
    const rest = answerEveryItem({ kind: 'pre_trip', hasTrailer: false, fromSeq: 3, skipZones: ['front'] });
    for (const body of rest) expect((await record(body)).status).toBe(201);
    const all = [first, second, neverArrived, ...rest.map((b) => b.id as string)];
    const signed = await sign(all);
    expect(signed.status).toBe(200);
    const held = await db.selectFrom('inspectionStep').select('id').where('inspectionId', '=', inspectionId).execute();
    expect(held.map((r) => r.id).sort()).toEqual(all.sort());
    // Sent again after the lock (the phone did not hear the answer): the same report, unchanged.
    expect((await sign(all)).status).toBe(200);
  });
});

describe('steps racing the signature', () => {
  // Steps of an open walk take the quick one-statement path once the walk is known; signing locks
  // the inspection for update. Whatever the interleaving, a step answered 2xx is in the signed
  // report (its hash still checks), and one that lost the race is refused with 409.
  let g: FleetFixture;
  beforeAll(async () => {
    g = await makeFleetFixture(db, 'Race fleet');
  });

  it('never adds a step to a report after its hash was taken', async () => {
    const inspectionId = randomUUID();
    const post = (body: Record<string, unknown>) =>
      callRoute(
        steps.POST,
        makeRequest(`/api/inspections/${inspectionId}/steps`, {
          method: 'POST',
          cookie: g.cookies.driver,
          json: { inputMode: 'tap', deviceAt: now(), ...body },
        }),
        { id: inspectionId },
      );
    const begin = await callRoute(
      inspections.POST,
      makeRequest('/api/inspections', {
        method: 'POST',
        cookie: g.cookies.driver,
        json: {
          id: inspectionId,
          kind: 'pre_trip',
          tractorId: g.tractor.id,
          trailerId: null,
          odometer: 5100,
          startedAt: now(),
        },
      }),
    );
    expect(begin.status).toBe(201);
    expect((await post({ id: randomUUID(), seq: 0, zone: 'front', kind: 'visit' })).status).toBe(201);
    for (const body of answerEveryItem({ kind: 'pre_trip', hasTrailer: false, fromSeq: 100 }))
      expect((await post(body)).status).toBe(201);
    const racing = Array.from({ length: 40 }, (_x, i) => ({
      id: randomUUID(),
      seq: i + 1,
      zone: 'front',
      kind: 'zone_ok',
    }));
    const answers = await Promise.all([
      ...racing.slice(0, 20).map((b) => post(b)),
      callRoute(
        finish.POST,
        makeRequest(`/api/inspections/${inspectionId}/finish`, {
          method: 'POST',
          cookie: g.cookies.driver,
          json: { signatureName: g.users.driver.name, certify: true, finishedAt: now() },
        }),
        { id: inspectionId },
      ),
      ...racing.slice(20).map((b) => post(b)),
    ]);
    const signedAnswer = answers[20]!;
    expect(signedAnswer.status).toBe(200);
    const stepAnswers = [...answers.slice(0, 20), ...answers.slice(21)];
    expect(stepAnswers.every((r) => r.status === 201 || r.status === 409)).toBe(true);
    const accepted = racing.filter((_b, i) => stepAnswers[i]!.status === 201).map((b) => b.id);
    const held = await db
      .selectFrom('inspectionStep')
      .select('id')
      .where('inspectionId', '=', inspectionId)
      .where(
        'id',
        'in',
        racing.map((b) => b.id),
      )
      .execute();
    expect(held.map((r) => r.id).sort()).toEqual(accepted.sort());
    const integrity = await callRoute(
      report.GET,
      makeRequest(`/api/reports/${inspectionId}`, { cookie: g.cookies.supervisor }),
      { id: inspectionId },
    );
    expect(integrity.status).toBe(200);
    expect((await readJson<{ hash: { state: string } }>(integrity)).hash).toMatchObject({ state: 'match' });
  });
});
