// Every API route × every role: 401 without a session, 403 for a role that may not, 2xx for one
// that may. The last test fails when a route file exists that this table does not list.
import fs from 'node:fs';
import path from 'node:path';
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import * as acknowledgements from '@/app/api/acknowledgements/route';
import * as attachments from '@/app/api/attachments/[id]/route';
import * as health from '@/app/api/health/route';
import * as dashboard from '@/app/api/dashboard/route';
import * as dashboardBoard from '@/app/api/dashboard/board/route';
import * as defects from '@/app/api/defects/route';
import * as defect from '@/app/api/defects/[id]/route';
import * as defectCertification from '@/app/api/defects/[id]/certification/route';
import * as caughtMail from '@/app/api/mail/route';
import * as reports from '@/app/api/reports/route';
import * as reportsExport from '@/app/api/reports/export/route';
import * as reportsPending from '@/app/api/reports/acknowledgements/route';
import * as report from '@/app/api/reports/[id]/route';
import * as reportPdf from '@/app/api/reports/[id]/pdf/route';
import * as reportReview from '@/app/api/reports/[id]/review/route';
import * as reportNotify from '@/app/api/reports/[id]/notify/route';
import * as finish from '@/app/api/inspections/[id]/finish/route';
import * as photos from '@/app/api/inspections/[id]/photos/[photoId]/route';
import * as signature from '@/app/api/inspections/[id]/signature/route';
import * as repairPhotos from '@/app/api/defects/[id]/photos/[photoId]/route';
import * as inspection from '@/app/api/inspections/[id]/route';
import * as steps from '@/app/api/inspections/[id]/steps/route';
import * as inspections from '@/app/api/inspections/route';
import * as me from '@/app/api/me/route';
import * as password from '@/app/api/password/route';
import * as passwordForgot from '@/app/api/password/forgot/route';
import * as passwordReset from '@/app/api/password/reset/route';
import * as unitReview from '@/app/api/units/[id]/review/route';
import * as units from '@/app/api/units/route';
import { makeInspection, makeUnit, makeUser } from '../../../db/factories';
import { adminRouteCases } from '../admin/admin-routes';
import { vocabularyRouteCases } from '../vocabulary/vocabulary-routes';
import { roles, type Role } from '@/lib/auth/roles';
import { makeFleetFixture, type FleetFixture } from '../../setup/fleet-fixture';
import { callRoute, makeRequest } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';
import { readError } from '../../setup/read-json';
import { answerEveryItem, answerEveryItemInDb } from '../../setup/walk-answers';

type Case = {
  route: string; // the route file's path under app/api, as written on disk
  method: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  allowed: readonly Role[] | 'public';
  call: (f: FleetFixture, cookie?: string) => Promise<Response>;
};

const cases: Case[] = [
  {
    route: 'health',
    method: 'GET',
    allowed: 'public',
    call: (_f, cookie) => callRoute(health.GET, makeRequest('/api/health', { cookie })),
  },
  {
    route: 'me',
    method: 'GET',
    allowed: roles,
    call: (_f, cookie) => callRoute(me.GET, makeRequest('/api/me', { cookie })),
  },
  {
    route: 'inspections/[id]',
    method: 'GET',
    allowed: ['driver', 'mechanic', 'supervisor'],
    call: (f, cookie) =>
      callRoute(inspection.GET, makeRequest(`/api/inspections/${f.inspection.id}`, { cookie }), {
        id: f.inspection.id,
      }),
  },
  {
    route: 'units',
    method: 'GET',
    allowed: roles,
    call: (_f, cookie) => callRoute(units.GET, makeRequest('/api/units', { cookie })),
  },
  {
    route: 'units/[id]/review',
    method: 'GET',
    allowed: ['driver', 'mechanic', 'supervisor'],
    call: (f, cookie) =>
      callRoute(unitReview.GET, makeRequest(`/api/units/${f.tractor.id}/review`, { cookie }), { id: f.tractor.id }),
  },
  {
    route: 'inspections',
    method: 'GET',
    allowed: ['driver'],
    call: (_f, cookie) => callRoute(inspections.GET, makeRequest('/api/inspections', { cookie })),
  },
  {
    route: 'inspections',
    method: 'POST',
    allowed: ['driver'],
    call: (f, cookie) =>
      callRoute(
        inspections.POST,
        makeRequest('/api/inspections', {
          method: 'POST',
          cookie,
          json: {
            id: randomUUID(),
            kind: 'post_trip',
            tractorId: f.tractor.id,
            trailerId: null,
            odometer: 1000,
            startedAt: new Date().toISOString(),
          },
        }),
      ),
  },
  {
    route: 'inspections/[id]/steps',
    method: 'POST',
    allowed: ['driver'],
    call: async (f, cookie) => {
      const draft = await freshDraft(f);
      return callRoute(
        steps.POST,
        makeRequest(`/api/inspections/${draft}/steps`, {
          method: 'POST',
          cookie,
          json: {
            id: randomUUID(),
            seq: 0,
            zone: 'front',
            kind: 'visit',
            inputMode: 'tap',
            deviceAt: new Date().toISOString(),
          },
        }),
        { id: draft },
      );
    },
  },
  {
    route: 'inspections/[id]/finish',
    method: 'POST',
    allowed: ['driver'],
    call: async (f, cookie) => {
      const draft = await freshDraft(f);
      await answerEveryItemInDb(db, { fleetId: f.fleet.id, inspectionId: draft, kind: 'pre_trip', hasTrailer: false });
      return callRoute(
        finish.POST,
        makeRequest(`/api/inspections/${draft}/finish`, {
          method: 'POST',
          cookie,
          json: { signatureName: f.users.driver.name, certify: true, finishedAt: new Date().toISOString() },
        }),
        { id: draft },
      );
    },
  },
  {
    route: 'inspections/[id]/photos/[photoId]',
    method: 'PUT',
    allowed: ['driver'],
    call: async (f, cookie) => {
      const draft = await freshDraft(f);
      const photoId = randomUUID();
      return callRoute(
        photos.PUT,
        makeRequest(`/api/inspections/${draft}/photos/${photoId}`, { method: 'PUT', cookie, body: await tinyJpeg() }),
        { id: draft, photoId },
      );
    },
  },
  {
    route: 'inspections/[id]/signature',
    method: 'PUT',
    allowed: ['driver'],
    call: async (f, cookie) => {
      const draft = await freshDraft(f);
      const png = await sharp({ create: { width: 300, height: 100, channels: 4, background: '#ffffff' } })
        .png()
        .toBuffer();
      return callRoute(
        signature.PUT,
        makeRequest(`/api/inspections/${draft}/signature`, { method: 'PUT', cookie, body: png }),
        { id: draft },
      );
    },
  },
  {
    route: 'defects/[id]/photos/[photoId]',
    method: 'PUT',
    allowed: ['mechanic'],
    call: async (f, cookie) => {
      const { reportId } = await reportWithDefect(f);
      const defect = await db
        .selectFrom('defect')
        .select('id')
        .where('inspectionId', '=', reportId)
        .executeTakeFirstOrThrow();
      const photoId = randomUUID();
      return callRoute(
        repairPhotos.PUT,
        makeRequest(`/api/defects/${defect.id}/photos/${photoId}`, { method: 'PUT', cookie, body: await tinyJpeg() }),
        { id: defect.id, photoId },
      );
    },
  },
  {
    route: 'attachments/[id]',
    method: 'GET',
    allowed: ['driver', 'mechanic', 'supervisor'],
    call: async (f, cookie) => {
      const id = await sharedPhoto(f);
      return callRoute(attachments.GET, makeRequest(`/api/attachments/${id}?size=thumb`, { cookie }), { id });
    },
  },
  {
    route: 'acknowledgements',
    method: 'POST',
    allowed: ['driver'],
    call: async (f, cookie) => {
      const { unitId, reportId } = await reportWithDefect(f);
      return callRoute(
        acknowledgements.POST,
        makeRequest('/api/acknowledgements', {
          method: 'POST',
          cookie,
          json: { id: randomUUID(), unitId, reviewedInspectionId: reportId, signatureName: f.users.driver.name },
        }),
      );
    },
  },
  // The office side: reports, defects, dashboard, caught mail.
  {
    route: 'reports',
    method: 'GET',
    allowed: ['supervisor'],
    call: (_f, cookie) => callRoute(reports.GET, makeRequest('/api/reports?pageSize=5', { cookie })),
  },
  {
    route: 'reports/export',
    method: 'GET',
    allowed: ['supervisor'],
    call: (_f, cookie) => callRoute(reportsExport.GET, makeRequest('/api/reports/export', { cookie })),
  },
  {
    route: 'reports/acknowledgements',
    method: 'GET',
    allowed: ['driver', 'mechanic', 'supervisor'],
    call: (f, cookie) =>
      callRoute(reportsPending.GET, makeRequest(`/api/reports/acknowledgements?units=${f.tractor.id}`, { cookie })),
  },
  {
    route: 'reports/[id]',
    method: 'GET',
    allowed: ['supervisor'],
    call: (f, cookie) =>
      callRoute(report.GET, makeRequest(`/api/reports/${f.inspection.id}`, { cookie }), { id: f.inspection.id }),
  },
  {
    route: 'reports/[id]/pdf',
    method: 'GET',
    allowed: ['driver', 'mechanic', 'supervisor'],
    call: (f, cookie) =>
      callRoute(reportPdf.GET, makeRequest(`/api/reports/${f.inspection.id}/pdf`, { cookie }), { id: f.inspection.id }),
  },
  {
    route: 'reports/[id]/review',
    method: 'POST',
    allowed: ['supervisor'],
    call: async (f, cookie) => {
      const { reportId } = await reportWithDefect(f);
      return callRoute(
        reportReview.POST,
        makeRequest(`/api/reports/${reportId}/review`, { method: 'POST', cookie, json: { note: 'checked' } }),
        { id: reportId },
      );
    },
  },
  {
    route: 'reports/[id]/notify',
    method: 'POST',
    allowed: ['supervisor'],
    call: async (f, cookie) => {
      const { reportId } = await reportWithDefect(f);
      return callRoute(reportNotify.POST, makeRequest(`/api/reports/${reportId}/notify`, { method: 'POST', cookie }), {
        id: reportId,
      });
    },
  },
  {
    route: 'defects',
    method: 'GET',
    allowed: ['mechanic', 'supervisor'],
    call: (_f, cookie) => callRoute(defects.GET, makeRequest('/api/defects', { cookie })),
  },
  {
    route: 'defects/[id]',
    method: 'GET',
    allowed: ['mechanic', 'supervisor'],
    call: async (f, cookie) => {
      const id = await openDefectOf(f);
      return callRoute(defect.GET, makeRequest(`/api/defects/${id}`, { cookie }), { id });
    },
  },
  {
    route: 'defects/[id]/certification',
    method: 'POST',
    allowed: ['mechanic'],
    call: async (f, cookie) => {
      const id = await openDefectOf(f, true);
      return callRoute(
        defectCertification.POST,
        makeRequest(`/api/defects/${id}/certification`, {
          method: 'POST',
          cookie,
          json: {
            outcome: 'repaired',
            work: 'Replaced the horn relay',
            certifiedName: f.users.mechanic.name,
            confirm: true,
          },
        }),
        { id },
      );
    },
  },
  {
    route: 'dashboard',
    method: 'GET',
    allowed: ['supervisor'],
    call: (_f, cookie) => callRoute(dashboard.GET, makeRequest('/api/dashboard', { cookie })),
  },
  {
    route: 'dashboard/board',
    method: 'GET',
    allowed: ['supervisor'],
    call: (_f, cookie) => callRoute(dashboardBoard.GET, makeRequest('/api/dashboard/board', { cookie })),
  },
  {
    route: 'mail',
    method: 'GET',
    allowed: ['admin'],
    call: (_f, cookie) => callRoute(caughtMail.GET, makeRequest('/api/mail', { cookie })),
  },
  {
    // Changing one's own password ends every other session; the answer carries this one on with
    // a new cookie, which replaces the fixture's so the later cases still have a session.
    route: 'password',
    method: 'PUT',
    allowed: roles,
    call: async (f, cookie) => {
      const res = await callRoute(
        password.PUT,
        makeRequest('/api/password', {
          method: 'PUT',
          cookie,
          json: { currentPassword: 'test-password', newPassword: `matrix passphrase ${randomUUID().slice(0, 8)}` },
        }),
      );
      const fresh = res.headers.getSetCookie().find((c) => c.startsWith('next-auth.session-token='));
      const role = roles.find((r) => f.cookies[r] === cookie);
      if (fresh && role) f.cookies[role] = fresh.split(';')[0]!;
      return res;
    },
  },
  {
    route: 'password/forgot',
    method: 'POST',
    allowed: 'public',
    call: (f) =>
      callRoute(
        passwordForgot.POST,
        makeRequest('/api/password/forgot', { method: 'POST', json: { email: f.users.driver.email } }),
      ),
  },
  {
    route: 'password/reset',
    method: 'POST',
    allowed: 'public',
    call: async (f) => {
      const token = randomBytes(32).toString('base64url');
      const u = await makeUser(db, { fleetId: f.fleet.id, roles: ['driver'] });
      await db
        .insertInto('passwordReset')
        .values({
          fleetId: f.fleet.id,
          userId: u.id,
          tokenHash: createHash('sha256').update(token).digest('hex'),
          expiresAt: new Date(Date.now() + 60_000),
        })
        .execute();
      return callRoute(
        passwordReset.POST,
        makeRequest('/api/password/reset', {
          method: 'POST',
          json: { token, newPassword: 'a matrix reset passphrase' },
        }),
      );
    },
  },
  // The trainer's vocabulary routes.
  ...vocabularyRouteCases,
  ...adminRouteCases.map((a): Case => ({
    route: a.path.replace(/^\/api\//, ''),
    method: a.method as Case['method'],
    allowed: ['admin'],
    call: (_f, cookie) => a.call(cookie),
  })),
];

const tinyJpeg = () =>
  sharp({ create: { width: 40, height: 30, channels: 3, background: '#446688' } })
    .jpeg()
    .toBuffer();

/** A draft inspection of the fixture's driver, so that a successful call changes nothing shared. */
async function freshDraft(f: FleetFixture): Promise<string> {
  return (await makeInspection(db, { fleetId: f.fleet.id, driverId: f.users.driver.id, tractorId: f.tractor.id })).id;
}

let photo: Promise<string> | undefined;
function sharedPhoto(f: FleetFixture): Promise<string> {
  photo ??= (async () => {
    const draft = await freshDraft(f);
    const id = randomUUID();
    const res = await callRoute(
      photos.PUT,
      makeRequest(`/api/inspections/${draft}/photos/${id}`, {
        method: 'PUT',
        cookie: f.cookies.driver,
        body: await tinyJpeg(),
      }),
      { id: draft, photoId: id },
    );
    if (res.status !== 201) throw new Error(`photo setup failed: ${await res.text()}`);
    return id;
  })();
  return photo;
}

/** An open defect on a fresh report (a new one each time when `fresh`, since certifying closes it). */
let sharedDefect: Promise<string> | undefined;
function openDefectOf(f: FleetFixture, fresh = false): Promise<string> {
  const make = async () => {
    const { reportId } = await reportWithDefect(f);
    return (await db.selectFrom('defect').select('id').where('inspectionId', '=', reportId).executeTakeFirstOrThrow())
      .id;
  };
  if (fresh) return make();
  sharedDefect ??= make();
  return sharedDefect;
}

/** A unit of its own whose last report lists a defect, through the real walk routes. */
async function reportWithDefect(f: FleetFixture) {
  const unit = await makeUnit(db, { fleetId: f.fleet.id, kind: 'tractor' });
  const reportId = randomUUID();
  const cookie = f.cookies.driver;
  const at = () => new Date().toISOString();
  await callRoute(
    inspections.POST,
    makeRequest('/api/inspections', {
      method: 'POST',
      cookie,
      json: { id: reportId, kind: 'pre_trip', tractorId: unit.id, trailerId: null, odometer: 5, startedAt: at() },
    }),
  );
  await callRoute(
    steps.POST,
    makeRequest(`/api/inspections/${reportId}/steps`, {
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
    { id: reportId },
  );
  // Every other item answered: a report signs only when none is open.
  for (const body of answerEveryItem({ kind: 'pre_trip', hasTrailer: false, fromSeq: 10 }))
    await callRoute(
      steps.POST,
      makeRequest(`/api/inspections/${reportId}/steps`, {
        method: 'POST',
        cookie,
        json: { ...body, deviceAt: at() },
      }),
      { id: reportId },
    );
  const signed = await callRoute(
    finish.POST,
    makeRequest(`/api/inspections/${reportId}/finish`, {
      method: 'POST',
      cookie,
      json: { signatureName: f.users.driver.name, certify: true, finishedAt: at() },
    }),
    { id: reportId },
  );
  if (signed.status !== 200) throw new Error(`report setup failed: ${await signed.text()}`);
  return { unitId: unit.id, reportId };
}

// Routes that are not ours to guard: next-auth's own sign-in endpoints.
const unguarded = new Set(['auth/[...nextauth] GET', 'auth/[...nextauth] POST']);

const db = getTestDb();
let f: FleetFixture;
beforeAll(async () => {
  f = await makeFleetFixture(db, 'Matrix fleet');
});
afterAll(() => db.destroy());

describe.each(cases)('$method /api/$route', (c) => {
  if (c.allowed === 'public') {
    it('answers without a session', async () => {
      expect((await c.call(f)).status).toBe(200);
    });
    return;
  }
  const allowed = c.allowed;
  it('401 without a session', async () => {
    const res = await c.call(f);
    expect(res.status).toBe(401);
    expect((await readError(res)).message).toMatch(/sign in/i);
  });
  it.each(roles.map((r) => [r]))('%s', async (role) => {
    const res = await c.call(f, f.cookies[role]);
    if (allowed.includes(role)) {
      expect(res.status, await res.clone().text()).toBeLessThan(300);
    } else {
      expect(res.status).toBe(403);
      expect((await readError(res)).code).toBe('forbidden');
    }
  });
});

describe('fleet isolation', () => {
  it("another fleet's report by id is 404, exactly like an id that does not exist", async () => {
    const other = await makeFleetFixture(db, 'Other fleet');
    const theirs = await callRoute(
      inspection.GET,
      makeRequest(`/api/inspections/${other.inspection.id}`, { cookie: f.cookies.supervisor }),
      { id: other.inspection.id },
    );
    const ghost = randomUUID();
    const nobody = await callRoute(
      inspection.GET,
      makeRequest(`/api/inspections/${ghost}`, { cookie: f.cookies.supervisor }),
      { id: ghost },
    );
    expect(theirs.status).toBe(404);
    expect(nobody.status).toBe(404);
    expect(await theirs.json()).toEqual(await nobody.json());
  });

  it('a malformed id is a clear 422, not a server error', async () => {
    const res = await callRoute(inspection.GET, makeRequest('/api/inspections/42', { cookie: f.cookies.supervisor }), {
      id: '42',
    });
    expect(res.status).toBe(422);
    expect((await readError(res)).message).toMatch(/record id/);
  });
});

describe('the table lists every route', () => {
  it('has a case for each exported method of each app/api route file', () => {
    const apiDir = path.resolve(__dirname, '../../../app/api');
    const found: string[] = [];
    const walk = (dir: string) => {
      for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
        const abs = path.join(dir, e.name);
        if (e.isDirectory()) walk(abs);
        else if (e.name === 'route.ts') {
          const route = path.relative(apiDir, dir).split(path.sep).join('/');
          const text = fs.readFileSync(abs, 'utf8');
          for (const m of text.matchAll(
            /export const (GET|POST|PATCH|PUT|DELETE)\b|export \{[^}]*\bas (GET|POST|PATCH|PUT|DELETE)\b/g,
          ))
            found.push(`${route} ${m[1] ?? m[2]}`);
          for (const m of text.matchAll(/\bas (GET|POST|PATCH|PUT|DELETE)\b/g)) found.push(`${route} ${m[1]}`);
        }
      }
    };
    walk(apiDir);
    const listed = new Set([...cases.map((c) => `${c.route} ${c.method}`), ...unguarded]);
    expect([...new Set(found)].filter((r) => !listed.has(r))).toEqual([]);
  });
});
