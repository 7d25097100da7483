// Defect 9 of issue 16: heavy work does not hold the request thread. A trainer's evaluation of
// a large labelled set yields between batches (other requests are answered meanwhile) and the set
// has a size cap; a photo is decoded only under a pixel limit.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as evaluation from '@/app/api/vocabulary/versions/[id]/evaluation/route';
import * as versions from '@/app/api/vocabulary/versions/route';
import * as testSet from '@/app/api/vocabulary/test-set/route';
import * as inspections from '@/app/api/inspections/route';
import * as photos from '@/app/api/inspections/[id]/photos/[photoId]/route';
import { maxTestSetLines } from '@/lib/schemas/vocabulary';
import { makeFleetFixture, type FleetFixture } from '../../setup/fleet-fixture';
import { readError, readJson } from '../../setup/read-json';
import { callRoute, makeRequest } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';

const db = getTestDb();
let f: FleetFixture;
beforeAll(async () => {
  f = await makeFleetFixture(db, 'Heavy work fleet');
});
afterAll(() => db.destroy());

const fixtureLines = readFileSync(path.resolve(__dirname, '../../fixtures/matcher/utterances.jsonl'), 'utf8')
  .split('\n')
  .filter((l) => l.trim());
// Each line made distinct with a word of its own (the matcher remembers words it has resolved),
// as a trainer's real set, or an abusive one, would be.
const setOf = (n: number) =>
  Array.from({ length: n }, (_, i) => {
    const u = JSON.parse(fixtureLines[i % fixtureLines.length]!) as { text: string };
    return JSON.stringify({ ...u, text: `${u.text} vr${(i * 7919).toString(36)}k` });
  }).join('\n');
const putSet = (jsonl: string) =>
  callRoute(
    testSet.PUT,
    makeRequest('/api/vocabulary/test-set', {
      method: 'PUT',
      cookie: f.cookies.trainer,
      json: { name: 'big set', jsonl },
    }),
  );

describe('heavy work (issue 16, defect 9)', () => {
  it('defect 9: evaluating 4,000 lines lets the server answer others in between', async () => {
    expect((await putSet(setOf(4000))).status).toBe(200);
    const draft = await readJson<{ id: string }>(
      await callRoute(
        versions.POST,
        makeRequest('/api/vocabulary/versions', { method: 'POST', cookie: f.cookies.trainer, json: {} }),
      ),
    );
    // A timer stands for every other request: the longest it waits is the longest stretch the
    // evaluation holds the thread. Whole, 4,000 distinct lines held it for 4.6 to 8 s on this machine;
    // in slices, for about 10 ms at a time (other work such as parsing the set adds a little). 500 ms
    // is far from both.
    const began = performance.now();
    let last = performance.now();
    let longest = 0;
    const timer = setInterval(() => {
      const now = performance.now();
      longest = Math.max(longest, now - last);
      last = now;
    }, 1);
    try {
      const res = await callRoute(
        evaluation.POST,
        makeRequest(`/api/vocabulary/versions/${draft.id}/evaluation`, { method: 'POST', cookie: f.cookies.trainer }),
        { id: draft.id },
      );
      // The stretch since the last tick counts too (the answer may arrive before the timer runs again).
      longest = Math.max(longest, performance.now() - last);
      expect(res.status).toBe(200);
      expect(((await res.json()) as { set: { count: number } }).set.count).toBe(4000);
    } finally {
      clearInterval(timer);
    }
    console.log(
      `evaluation ${Math.round(performance.now() - began)} ms, longest stretch without a timer tick: ${Math.round(longest)} ms`,
    );
    expect(longest).toBeLessThan(500);
  }, 60_000);

  it('defect 9: a labelled set over the cap is refused with a reason', async () => {
    const res = await putSet(setOf(maxTestSetLines + 1));
    expect(res.status).toBe(422);
    expect((await readError(res)).message).toMatch(
      new RegExp(`at most ${maxTestSetLines.toLocaleString('en-US')} lines`),
    );
  });

  it('defect 9: a photo over the pixel limit is refused without being decoded whole', async () => {
    const id = randomUUID();
    const started = await callRoute(
      inspections.POST,
      makeRequest('/api/inspections', {
        method: 'POST',
        cookie: f.cookies.driver,
        json: {
          id,
          kind: 'pre_trip',
          tractorId: f.tractor.id,
          trailerId: null,
          odometer: 3,
          startedAt: new Date().toISOString(),
        },
      }),
    );
    expect(started.status).toBe(201);
    // 8,900 × 8,900 = 79 megapixels of one grey, a small file that would need 237 MB to decode.
    const huge = await sharp({
      create: { width: 8900, height: 8900, channels: 3, background: { r: 128, g: 128, b: 128 } },
    })
      .png({ compressionLevel: 9 })
      .toBuffer();
    const photoId = randomUUID();
    const res = await callRoute(
      photos.PUT,
      makeRequest(`/api/inspections/${id}/photos/${photoId}`, {
        method: 'PUT',
        cookie: f.cookies.driver,
        body: new Uint8Array(huge),
        headers: { 'content-type': 'image/png' },
      }),
      { id, photoId },
    );
    expect(res.status).toBe(422);
    expect((await readError(res)).message).toMatch(/megapixels/i);
  }, 60_000);
});
