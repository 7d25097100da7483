// Bad input at every route: random and malformed bodies, wrong types, huge strings, unknown
// fields, wrong content types, nonsense ids and queries. Only 4xx answers with a JSON error a
// person can read; never a 500, never a changed row.
import { randomUUID } from 'node:crypto';
import fc from 'fast-check';
import { sql } from 'kysely';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { roles } from '@/lib/auth/roles';
import { makeInspection, makeUser } from '../../../db/factories';
import { makeFleetFixture, type FleetFixture } from '../../setup/fleet-fixture';
import { callRoute, makeRequest, sessionCookieFor } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';
import { loadRouteCatalog, pathOf, type CatalogRoute } from './route-catalog';
import { makeSignedReport } from './walk-helpers';
import { readError } from '../../setup/read-json';

const db = getTestDb();
let f: FleetFixture;
let routes: CatalogRoute[];
let cookie: string; // one user holding every role, so that only the input decides
let ids: Record<string, string>;
const RUNS = Number(process.env.FUZZ_RUNS ?? 20);

beforeAll(async () => {
  f = await makeFleetFixture(db, 'Fuzz fleet');
  const everyone = await makeUser(db, { fleetId: f.fleet.id, roles: [...roles], name: 'Fuzz Everyone' });
  cookie = await sessionCookieFor(everyone);
  const draft = await makeInspection(db, { fleetId: f.fleet.id, driverId: everyone.id, tractorId: f.tractor.id });
  const signed = await makeSignedReport(db, f);
  const defect = await db
    .selectFrom('defect')
    .select('id')
    .where('inspectionId', '=', signed.id)
    .executeTakeFirstOrThrow();
  const version = await db
    .selectFrom('vocabularyVersion')
    .select('id')
    .where('fleetId', '=', f.fleet.id)
    .executeTakeFirst();
  ids = {
    inspections: draft.id,
    reports: signed.id,
    defects: defect.id,
    units: f.tractor.id,
    'admin/units': f.tractor.id,
    'admin/users': f.users.driver.id,
    versions: version?.id ?? randomUUID(),
  };
  routes = await loadRouteCatalog();
}, 120_000);
afterAll(() => db.destroy());

/** Real ids for a route's path params, so that a request that got past validation would act. */
function paramsFor(r: CatalogRoute): Record<string, string> {
  const out: Record<string, string> = {};
  for (const name of r.paramNames) {
    const before = r.route.slice(0, r.route.indexOf(`[${name}]`)).replace(/\/$/, '');
    const key = Object.keys(ids).find((k) => before === k || before.endsWith(`/${k}`));
    out[name] = key && name === 'id' ? ids[key]! : randomUUID();
  }
  return out;
}

/** A digest of every row of the fleet, in every table that has a fleet_id (and the fleet itself). */
async function fleetDigest(): Promise<string> {
  const tables = await sql<{
    t: string;
  }>`select table_name as t from information_schema.columns where table_schema = 'public' and column_name = 'fleet_id' order by table_name`.execute(
    db,
  );
  const parts: string[] = [];
  for (const { t: table } of tables.rows) {
    const r = await sql<{
      d: string | null;
    }>`select md5(string_agg(t::text, '|' order by t::text)) as d from ${sql.table(table)} t where fleet_id = ${f.fleet.id}`.execute(
      db,
    );
    parts.push(`${table}:${r.rows[0]?.d ?? '-'}`);
  }
  const fleet = await sql<{ d: string }>`select md5(t::text) as d from fleet t where id = ${f.fleet.id}`.execute(db);
  parts.push(`fleet:${fleet.rows[0]?.d}`);
  return parts.join(' ');
}

type Sent = { route: CatalogRoute; status: number; text: string; what: string };

function expectReadableRefusal(s: Sent, allowed: (status: number) => boolean = (st) => st >= 400 && st < 500) {
  const where = `${s.route.method} /api/${s.route.route} with ${s.what}: ${s.status} ${s.text.slice(0, 300)}`;
  expect(allowed(s.status), where).toBe(true);
  if (s.status >= 400) {
    const body = JSON.parse(s.text) as { error?: { code?: unknown; message?: unknown } };
    expect(typeof body.error?.code, where).toBe('string');
    expect(typeof body.error?.message, where).toBe('string');
    const message = body.error!.message as string;
    // A sentence for a person: words, not a stack trace or a zod dump.
    expect(message.length, where).toBeGreaterThan(8);
    expect(message.length, where).toBeLessThan(600);
    expect(message, where).not.toMatch(
      /\bat .+\.(ts|js):\d+|ZodError|TypeError|undefined is not|\[object Object\]|Unexpected token/,
    );
  }
}

async function send(
  r: CatalogRoute,
  init: { body?: BodyInit; contentType?: string | null; params?: Record<string, string>; query?: string },
  what: string,
): Promise<Sent> {
  const params = init.params ?? paramsFor(r);
  const headers: Record<string, string> = {};
  if (init.contentType) headers['content-type'] = init.contentType;
  const req = makeRequest(`${pathOf(r.route, params)}${init.query ?? ''}`, {
    method: r.method,
    cookie,
    headers,
    body: r.method === 'GET' ? undefined : init.body,
  });
  const res = await callRoute(r.fn, req, params);
  return { route: r, status: res.status, text: await res.text(), what };
}

const withBody = () => routes.filter((r) => r.spec.body);

/** JSON values, where every object carries at least one field no route knows. */
const junkJson = fc.oneof(
  fc
    .jsonValue({ maxDepth: 3 })
    .map((v) => (v && typeof v === 'object' && !Array.isArray(v) ? { ...v, ['zz_' + Object.keys(v).length]: v } : v)),
  fc
    .dictionary(fc.string({ minLength: 1, maxLength: 20 }), fc.jsonValue({ maxDepth: 2 }), { minKeys: 1, maxKeys: 6 })
    .map((d) => ({ ...d, __unknown__: true })),
  fc.constantFrom<unknown>(
    null,
    0,
    -1,
    1e308,
    true,
    false,
    '',
    'x',
    [],
    [{}],
    { id: 42 },
    { id: 'not-a-uuid', kind: 7 },
  ),
);

describe('every route, whatever it is sent', () => {
  it('found the routes', () => {
    expect(routes.length).toBeGreaterThan(25);
    expect(withBody().length).toBeGreaterThan(8);
  });

  it('random JSON bodies, wrong types and unknown fields: 4xx, readable, nothing changed', async () => {
    const before = await fleetDigest();
    for (const r of withBody()) {
      await fc.assert(
        fc.asyncProperty(junkJson, async (value) => {
          expectReadableRefusal(
            await send(
              r,
              { body: JSON.stringify(value), contentType: 'application/json' },
              `body ${JSON.stringify(value).slice(0, 120)}`,
            ),
          );
        }),
        { numRuns: RUNS, seed: 9 },
      );
    }
    expect(await fleetDigest()).toBe(before);
  });

  it('text that is not JSON: 400', async () => {
    const before = await fleetDigest();
    const notJson = fc.string({ maxLength: 200 }).filter((t) => {
      try {
        JSON.parse(t);
        return false;
      } catch {
        return true;
      }
    });
    for (const r of withBody()) {
      await fc.assert(
        fc.asyncProperty(
          fc.oneof(notJson, fc.constantFrom('{', '{"id":', '[1,2', "{'a':1}", '\u0000', 'null null')),
          async (text) => {
            const s = await send(
              r,
              { body: text, contentType: 'application/json' },
              `text ${JSON.stringify(text).slice(0, 80)}`,
            );
            expectReadableRefusal(s, (st) => st === 400);
          },
        ),
        { numRuns: RUNS, seed: 10 },
      );
    }
    expect(await fleetDigest()).toBe(before);
  });

  it('wrong content types: 415', async () => {
    const before = await fleetDigest();
    const types = fc.constantFrom(
      'text/plain',
      'application/x-www-form-urlencoded',
      'multipart/form-data; boundary=x',
      'application/xml',
      'image/jpeg',
      'application/jsonp',
      null,
    );
    for (const r of withBody()) {
      await fc.assert(
        fc.asyncProperty(types, fc.jsonValue({ maxDepth: 2 }), async (type, value) => {
          const s = await send(r, { body: JSON.stringify(value), contentType: type }, `content type ${type}`);
          expectReadableRefusal(s, (st) => st === 415);
        }),
        { numRuns: Math.min(RUNS, 10), seed: 11 },
      );
    }
    expect(await fleetDigest()).toBe(before);
  });

  it('huge strings: 413 or 422, never stored', async () => {
    const before = await fleetDigest();
    for (const r of withBody()) {
      for (const size of [5_000, 300_000, 2_000_000]) {
        const big = 'A'.repeat(size);
        for (const body of [
          JSON.stringify(big),
          JSON.stringify({ id: big, name: big, note: big, heard: big, grammar: big, text: big }),
        ]) {
          expectReadableRefusal(await send(r, { body, contentType: 'application/json' }, `a ${size}-character string`));
        }
      }
    }
    expect(await fleetDigest()).toBe(before);
  });

  it('nonsense in the path: 4xx', async () => {
    const before = await fleetDigest();
    const junkId = fc.oneof(
      fc.string({ maxLength: 60 }),
      fc.constantFrom(
        '42',
        '../../etc/passwd',
        "' or 1=1 --",
        '%00',
        'ffffffff-ffff-ffff-ffff-fffffffffffff',
        'A'.repeat(5000),
      ),
    );
    for (const r of routes.filter((x) => x.paramNames.length)) {
      await fc.assert(
        fc.asyncProperty(junkId, async (bad) => {
          const params = Object.fromEntries(r.paramNames.map((n) => [n, bad]));
          const s = await send(
            r,
            {
              params,
              body: r.spec.rawBody ? new Uint8Array([1, 2, 3]) : '{}',
              contentType: r.spec.rawBody ? 'image/jpeg' : 'application/json',
            },
            `id ${JSON.stringify(bad).slice(0, 60)}`,
          );
          expectReadableRefusal(s);
        }),
        { numRuns: RUNS, seed: 12 },
      );
    }
    expect(await fleetDigest()).toBe(before);
  });

  it('nonsense in the query: never a 500, and a refusal is readable', async () => {
    const before = await fleetDigest();
    const query = fc.dictionary(
      fc.constantFrom(
        'page',
        'pageSize',
        'size',
        'status',
        'sort',
        'from',
        'to',
        'units',
        'unit',
        'q',
        'kind',
        'severity',
        'stepId',
        'zone',
        fc.string({ maxLength: 8 }) as never,
      ),
      fc.oneof(fc.string({ maxLength: 40 }), fc.constantFrom('-1', '1e999', 'NaN', '9999999999', '', '[]', 'null')),
      { maxKeys: 4 },
    );
    for (const r of routes.filter((x) => x.spec.query && x.method === 'GET')) {
      await fc.assert(
        fc.asyncProperty(query, async (q) => {
          const s = await send(r, { query: `?${new URLSearchParams(q)}` }, `query ${JSON.stringify(q).slice(0, 100)}`);
          expectReadableRefusal(s, (st) => st < 500);
        }),
        { numRuns: RUNS, seed: 13 },
      );
    }
    expect(await fleetDigest()).toBe(before);
  });
});

describe('uploads', () => {
  const photoRoutes = () => routes.filter((r) => r.spec.rawBody);
  let jpeg: Buffer;
  beforeAll(async () => {
    jpeg = await sharp({ create: { width: 800, height: 600, channels: 3, background: '#884422' } })
      .jpeg({ quality: 90 })
      .toBuffer();
  });

  it('bytes that are not an image, whatever the name or type says: 4xx, nothing stored', async () => {
    const before = await fleetDigest();
    for (const r of photoRoutes()) {
      await fc.assert(
        fc.asyncProperty(
          fc.uint8Array({ minLength: 1, maxLength: 4096 }),
          fc.constantFrom('image/jpeg', 'image/png', 'application/octet-stream', 'text/html'),
          async (bytes, type) => {
            expectReadableRefusal(
              await send(r, { body: bytes, contentType: type }, `${bytes.length} random bytes as ${type}`),
            );
          },
        ),
        { numRuns: RUNS, seed: 14 },
      );
    }
    expect(await fleetDigest()).toBe(before);
  });

  it('a photo cut off part-way, or a JPEG header followed by junk: 4xx, nothing stored', async () => {
    const before = await fleetDigest();
    for (const r of photoRoutes()) {
      await fc.assert(
        fc.asyncProperty(fc.double({ min: 0.05, max: 0.95, noNaN: true }), async (cut) => {
          const part = jpeg.subarray(0, Math.floor(jpeg.length * cut));
          expectReadableRefusal(
            await send(
              r,
              { body: new Uint8Array(part), contentType: 'image/jpeg' },
              `the first ${Math.round(cut * 100)}% of a JPEG`,
            ),
          );
        }),
        { numRuns: Math.min(RUNS, 12), seed: 15 },
      );
      const fake = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.alloc(2000, 7)]);
      expectReadableRefusal(await send(r, { body: fake, contentType: 'image/jpeg' }, 'a JPEG signature over junk'));
      expectReadableRefusal(await send(r, { body: new Uint8Array(), contentType: 'image/jpeg' }, 'no bytes'));
    }
    expect(await fleetDigest()).toBe(before);
  });

  it('an upload larger than the limit is refused with 413 before it is read', async () => {
    for (const r of photoRoutes()) {
      const params = paramsFor(r);
      const req = makeRequest(pathOf(r.route, params), {
        method: 'PUT',
        cookie,
        headers: { 'content-type': 'image/jpeg', 'content-length': String(16 * 1024 * 1024) },
        body: new Uint8Array(jpeg),
      });
      const res = await callRoute(r.fn, req, params);
      expect(res.status).toBe(413);
      expect((await readError(res)).message).toMatch(
        r.route.endsWith('signature') ? /larger than 512 KB/ : /larger than 15 MB/,
      ); // each upload route states its own limit
      const big = Buffer.concat([jpeg, Buffer.alloc(15 * 1024 * 1024)]);
      const streamed = await callRoute(
        r.fn,
        makeRequest(pathOf(r.route, params), { method: 'PUT', cookie, body: new Uint8Array(big) }),
        params,
      );
      expect(streamed.status).toBe(413);
    }
  });
});

describe('the walk routes, one field at a time', () => {
  // A valid body with one field given a value of another type: refused with that field named.
  const valid = (): Record<string, Record<string, unknown>> => ({
    'inspections POST': {
      id: randomUUID(),
      kind: 'pre_trip',
      tractorId: f.tractor.id,
      trailerId: null,
      odometer: 1000,
      startedAt: new Date().toISOString(),
    },
    'inspections/[id]/steps POST': {
      id: randomUUID(),
      seq: 1,
      zone: 'front',
      kind: 'defect',
      termKey: 'horn:inoperative',
      heard: 'horn',
      inputMode: 'voice',
      score: 0.9,
      deviceAt: new Date().toISOString(),
    },
    'inspections/[id]/finish POST': {
      signatureName: 'Fuzz Everyone',
      certify: true,
      finishedAt: new Date().toISOString(),
    },
  });
  const wrongFor = (v: unknown) =>
    typeof v === 'string'
      ? fc.oneof(fc.integer(), fc.boolean(), fc.constant({}), fc.constant([v]))
      : typeof v === 'number'
        ? fc.oneof(
            fc.string({ maxLength: 5 }).map((s) => `${s}x`),
            fc.boolean(),
            fc.constant([v]),
            fc.constantFrom(-1e12, 1e12),
          )
        : fc.oneof(fc.string({ maxLength: 5 }), fc.integer({ min: 2 }), fc.constant({ nested: true }));

  it('each field with a wrong type is refused and named', async () => {
    const before = await fleetDigest();
    for (const [key, body] of Object.entries(valid())) {
      const [route, method] = key.split(' ');
      const r = routes.find((x) => x.route === route && x.method === method)!;
      for (const field of Object.keys(body).filter((k) => body[k] !== null)) {
        await fc.assert(
          fc.asyncProperty(wrongFor(body[field]), async (wrong) => {
            const s = await send(
              r,
              { body: JSON.stringify({ ...valid()[key], [field]: wrong }), contentType: 'application/json' },
              `${field} = ${JSON.stringify(wrong)}`,
            );
            expectReadableRefusal(s, (st) => st === 422);
            expect(
              Object.keys(
                (JSON.parse(s.text) as { error: { fields?: Record<string, unknown> } }).error.fields ?? {},
              ).join(' '),
            ).toContain(field);
          }),
          { numRuns: Math.min(RUNS, 8), seed: 16 },
        );
      }
    }
    expect(await fleetDigest()).toBe(before);
  });
});
