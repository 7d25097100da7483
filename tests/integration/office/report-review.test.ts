// The report detail the supervisor reads (transcript by zone, hash recomputed from the rows) and
// the review mark.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as detailRoute from '@/app/api/reports/[id]/route';
import * as reviewRoute from '@/app/api/reports/[id]/review/route';
import * as notifyRoute from '@/app/api/reports/[id]/notify/route';
import * as boardRoute from '@/app/api/dashboard/board/route';
import * as dashboardRoute from '@/app/api/dashboard/route';
import * as mailRoute from '@/app/api/mail/route';
import { readJson } from '../../setup/read-json';
import { callRoute, makeRequest } from '../../setup/session';
import { caughtMailTo, makeOfficeFleet, makeSignedReport, type OfficeFleet } from './office-fixtures';

let f: OfficeFleet;
beforeAll(async () => {
  f = await makeOfficeFleet({ name: 'Review fleet' });
});
afterAll(() => f.db.destroy());

/** What these tests read of the answers (the assertions check the values). */
type Detail = {
  hash: { state: string; stored: string | null; computed: string | null };
  duration: unknown;
  zones: { id: string; seconds: number; steps: { kind: string }[] }[];
  skippedZones: unknown[];
  defects: unknown[];
  review: { reviewedAt: string | null } | null;
};
type Board = {
  units: { id: string; status: string; last: unknown }[];
  attention: { reasons: string[] }[];
};
type Dashboard = {
  defectsBySystem: unknown[];
  openMajorByDay: unknown[];
  durationBuckets: { preTrip: number; postTrip: number }[];
  recognition: { share: number }[];
};

const detail = async (id: string) =>
  readJson<Detail>(
    await callRoute(detailRoute.GET, makeRequest(`/api/reports/${id}`, { cookie: f.cookies.supervisor }), { id }),
  );

describe('report detail', () => {
  it('shows the transcript zone by zone with time in each, the duration against the minimum and a matching hash', async () => {
    const report = await makeSignedReport(f, {
      minutes: 9,
      defects: [{ unit: 'tractor', severity: 'major', description: 'steer tire, bulge' }],
    });
    const d = await detail(report.id);
    expect(d.hash.state).toBe('match');
    expect(d.hash.computed).toBe(report.hash);
    expect(d.duration).toMatchObject({ minimumMinutes: 15, short: true });
    expect(d.zones.map((z) => z.id)).toEqual(['front', 'engine_bay']);
    expect(d.zones[0]?.seconds).toBe(90); // three steps 30 s apart before the next zone
    const finding = d.zones[0]?.steps.find((s) => s.kind === 'defect');
    expect(finding).toMatchObject({
      heard: 'steer tire, bulge',
      score: 0.91,
      resolution: 'auto',
      alternatives: ['bulge on the right steer tire'],
    });
    expect(d.skippedZones.length).toBeGreaterThan(0);
    expect(d.defects[0]).toMatchObject({ severity: 'major', status: 'open' });
  });

  it('shows loudly when the rows no longer match the signed hash', async () => {
    const report = await makeSignedReport(f, { tractorIndex: 1 });
    await f.db
      .updateTable('inspectionStep')
      .set({ heard: 'all good (edited later)' })
      .where('id', '=', report.steps[1]!.id)
      .execute();
    const d = await detail(report.id);
    expect(d.hash.state).toBe('mismatch');
    expect(d.hash.stored).toBe(report.hash);
    expect(d.hash.computed).not.toBe(report.hash);
  });
});

describe('POST /api/reports/[id]/review', () => {
  it('marks the report reviewed with the note, by whom and when, and audits it', async () => {
    const report = await makeSignedReport(f, { tractorIndex: 2 });
    const res = await callRoute(
      reviewRoute.POST,
      makeRequest(`/api/reports/${report.id}/review`, {
        method: 'POST',
        cookie: f.cookies.supervisor,
        json: { note: 'Short walk; talked with the driver.' },
      }),
      { id: report.id },
    );
    expect(res.status).toBe(200);
    const d = await detail(report.id);
    expect(d.review).toMatchObject({ reviewerName: 'Sam Lead', note: 'Short walk; talked with the driver.' });
    expect(d.review?.reviewedAt).toBeTruthy();
    const audit = await f.db
      .selectFrom('auditLog')
      .select(['action', 'entityId'])
      .where('fleetId', '=', f.fleet.id)
      .where('action', '=', 'report.reviewed')
      .execute();
    expect(audit).toEqual([{ action: 'report.reviewed', entityId: report.id }]);
  });

  it('refuses a draft (409)', async () => {
    const draft = await f.db
      .insertInto('inspection')
      .values({
        id: crypto.randomUUID(),
        fleetId: f.fleet.id,
        driverId: f.drivers[0]!.id,
        tractorId: f.tractors[0]!.id,
        kind: 'pre_trip',
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    const res = await callRoute(
      reviewRoute.POST,
      makeRequest(`/api/reports/${draft.id}/review`, { method: 'POST', cookie: f.cookies.supervisor, json: {} }),
      { id: draft.id },
    );
    expect(res.status).toBe(409);
  });
});

describe('the shop notice and the caught-mail list', () => {
  it('mails the shop an out-of-service notice for a report with an open major defect; the admin sees it caught', async () => {
    const report = await makeSignedReport(f, {
      defects: [
        { unit: 'tractor', severity: 'major', description: 'air leak at the glad hands' },
        { unit: 'trailer', severity: 'minor', description: 'mud flap torn' },
      ],
    });
    const res = await callRoute(
      notifyRoute.POST,
      makeRequest(`/api/reports/${report.id}/notify`, { method: 'POST', cookie: f.cookies.supervisor }),
      { id: report.id },
    );
    expect(res.status).toBe(200);
    expect((await readJson<{ sent: unknown[] }>(res)).sent).toEqual([
      { unitNumber: '101', kind: 'out_of_service', sent: true },
      { unitNumber: '5001', kind: 'repair_needed', sent: true },
    ]);
    const subjects = (await caughtMailTo(f.fleet.maintenanceEmail)).map((m) => m.subject).sort();
    expect(subjects).toEqual([
      `OUT OF SERVICE: unit 101 (${f.fleet.name})`,
      `Repair needed: unit 5001 (${f.fleet.name})`,
    ]);
    const caught = await readJson<{ configured: boolean; messages: unknown[] }>(
      await callRoute(
        mailRoute.GET,
        makeRequest(`/api/mail?to=${encodeURIComponent(f.fleet.maintenanceEmail)}`, { cookie: f.cookies.admin }),
      ),
    );
    expect(caught.configured).toBe(true);
    expect(caught.messages).toHaveLength(2);
  });
});

describe('supervisor board and dashboard', () => {
  it('lists units with status and last inspection, and the reports that need attention with reasons', async () => {
    const g = await makeOfficeFleet({ history: 14, name: 'Board fleet' });
    const res = await callRoute(boardRoute.GET, makeRequest('/api/dashboard/board', { cookie: g.cookies.supervisor }));
    expect(res.status).toBe(200);
    const board = await readJson<Board>(res);
    expect(board.units).toHaveLength(7);
    const openMajor = await g.db
      .selectFrom('defect')
      .select(['unitId'])
      .where('fleetId', '=', g.fleet.id)
      .where('status', '=', 'open')
      .where('severity', '=', 'major')
      .execute();
    for (const u of board.units) expect(u.status === 'out_of_service').toBe(openMajor.some((d) => d.unitId === u.id));
    expect(board.units.filter((u) => u.last).length).toBeGreaterThan(3);
    const reasons = new Set(board.attention.flatMap((a) => a.reasons));
    expect(reasons.has('short')).toBe(true);
    expect(reasons.has('no_post_trip')).toBe(true);

    const dash = await readJson<Dashboard>(
      await callRoute(dashboardRoute.GET, makeRequest('/api/dashboard', { cookie: g.cookies.supervisor })),
    );
    expect(dash.defectsBySystem.length).toBeGreaterThan(0);
    expect(dash.openMajorByDay.length).toBe(61);
    expect(dash.durationBuckets.reduce((n, b) => n + b.preTrip + b.postTrip, 0)).toBe(
      g.history && !g.history.skipped ? g.history.inspections : -1,
    );
    expect(dash.recognition.every((r) => r.share >= 0 && r.share <= 100)).toBe(true);
  });
});
