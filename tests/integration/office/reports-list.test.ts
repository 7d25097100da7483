// The reports table: server-side paging, filters and sort, checked against the rows themselves
// on a fleet with seeded-style history (db/seeds/02-history).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as reportsRoute from '@/app/api/reports/route';
import { listReports } from '@/lib/services/reports/list-reports';
import { listReportsQuerySchema, type ListReportsQuery, type ReportPage } from '@/lib/schemas/reports';
import { readError, readJson } from '../../setup/read-json';
import { callRoute, makeRequest } from '../../setup/session';
import { makeOfficeFleet, type OfficeFleet } from './office-fixtures';

let f: OfficeFleet;
let all: {
  id: string;
  kind: string;
  driverId: string;
  tractorId: string;
  trailerId: string | null;
  startedAt: Date;
  durationS: number | null;
  reviewedAt: Date | null;
  defects: number;
  majors: number;
}[];

const q = (over: Record<string, unknown> = {}): ListReportsQuery => listReportsQuerySchema.parse(over);

beforeAll(async () => {
  f = await makeOfficeFleet({ history: 21 });
  await makeOfficeFleet({ history: 3, name: 'Another fleet' }); // rows that must never show up
  const rows = await f.db
    .selectFrom('inspection as i')
    .select((eb) => [
      'i.id',
      'i.kind',
      'i.driverId',
      'i.tractorId',
      'i.trailerId',
      'i.startedAt',
      'i.durationS',
      'i.reviewedAt',
      eb
        .selectFrom('defect')
        .select((e) => e.fn.countAll<number>().as('n'))
        .whereRef('defect.inspectionId', '=', 'i.id')
        .as('defects'),
      eb
        .selectFrom('defect')
        .select((e) => e.fn.countAll<number>().as('n'))
        .whereRef('defect.inspectionId', '=', 'i.id')
        .where('defect.severity', '=', 'major')
        .as('majors'),
    ])
    .where('i.fleetId', '=', f.fleet.id)
    .execute();
  all = rows.map((r) => ({ ...r, defects: Number(r.defects), majors: Number(r.majors) }));
});
afterAll(() => f.db.destroy());

describe('listReports on seeded history', () => {
  it('has seeded-style data to page through', () => {
    expect(f.history && !f.history.skipped && f.history.inspections).toBeGreaterThan(40);
    expect(all.length).toBe(f.history && !f.history.skipped ? f.history.inspections : -1);
  });

  it('pages are disjoint, newest first, and together are every report of the fleet once', async () => {
    const seen: string[] = [];
    const first = await listReports({ fleetId: f.fleet.id, query: q({ pageSize: 10 }) });
    expect(first.total).toBe(all.length);
    expect(first.pageCount).toBe(Math.ceil(all.length / 10));
    for (let page = 1; page <= first.pageCount; page++) {
      const p = await listReports({ fleetId: f.fleet.id, query: q({ pageSize: 10, page }) });
      expect(p.rows.length).toBe(page < first.pageCount ? 10 : all.length - 10 * (first.pageCount - 1));
      seen.push(...p.rows.map((r) => r.id));
    }
    expect(new Set(seen).size).toBe(all.length);
    const expected = [...all]
      .sort((a, b) => b.startedAt.getTime() - a.startedAt.getTime() || b.id.localeCompare(a.id))
      .map((r) => r.id);
    expect(seen).toEqual(expected);
  });

  it('a page past the end is empty, with the right total', async () => {
    const p = await listReports({ fleetId: f.fleet.id, query: q({ pageSize: 50, page: 999 }) });
    expect(p.rows).toEqual([]);
    expect(p.total).toBe(all.length);
  });

  it('filters by driver, unit (tractor or trailer), type and defects exactly as the rows say', async () => {
    const driverId = f.drivers[1]!.id;
    const byDriver = await listReports({ fleetId: f.fleet.id, query: q({ driverId, pageSize: 200 }) });
    expect(byDriver.total).toBe(all.filter((r) => r.driverId === driverId).length);
    expect(byDriver.rows.every((r) => r.driverId === driverId && r.driverName === 'Blake Ortiz')).toBe(true);

    const trailerId = f.trailers[2]!.id;
    const byUnit = await listReports({ fleetId: f.fleet.id, query: q({ unitId: trailerId, pageSize: 200 }) });
    expect(byUnit.total).toBe(all.filter((r) => r.tractorId === trailerId || r.trailerId === trailerId).length);
    expect(byUnit.total).toBeGreaterThan(0);

    const post = await listReports({ fleetId: f.fleet.id, query: q({ kind: 'post_trip', pageSize: 200 }) });
    expect(post.total).toBe(all.filter((r) => r.kind === 'post_trip').length);

    const withDefects = await listReports({ fleetId: f.fleet.id, query: q({ hasDefects: 'yes', pageSize: 200 }) });
    expect(withDefects.total).toBe(all.filter((r) => r.defects > 0).length);
    expect(withDefects.total).toBeGreaterThan(0);
    expect(withDefects.rows.every((r) => r.majorCount + r.minorCount > 0)).toBe(true);
    const without = await listReports({ fleetId: f.fleet.id, query: q({ hasDefects: 'no', pageSize: 5 }) });
    expect(without.total + withDefects.total).toBe(all.length);
  });

  it('filters short inspections against the fleet minimum for each type (15 min pre-trip, 5 min post-trip)', async () => {
    const short = await listReports({ fleetId: f.fleet.id, query: q({ short: 'yes', pageSize: 200 }) });
    const expected = all.filter((r) => r.durationS !== null && r.durationS < (r.kind === 'pre_trip' ? 15 : 5) * 60);
    expect(short.total).toBe(expected.length);
    expect(short.total).toBeGreaterThan(0);
    expect(short.rows.every((r) => r.short && r.durationS! < r.minimumS)).toBe(true);
  });

  it('filters by review status and by date range (fleet time zone)', async () => {
    const reviewed = await listReports({ fleetId: f.fleet.id, query: q({ status: 'reviewed', pageSize: 200 }) });
    expect(reviewed.total).toBe(all.filter((r) => r.reviewedAt).length);
    const unreviewed = await listReports({ fleetId: f.fleet.id, query: q({ status: 'unreviewed', pageSize: 5 }) });
    expect(reviewed.total + unreviewed.total).toBe(all.length);

    const tz = 'America/Chicago';
    const day = (d: Date) => new Intl.DateTimeFormat('en-CA', { timeZone: tz }).format(d);
    const days = [...new Set(all.map((r) => day(r.startedAt)))].sort();
    const from = days[3]!;
    const to = days[7]!;
    const range = await listReports({ fleetId: f.fleet.id, query: q({ from, to, pageSize: 200 }) });
    expect(range.total).toBe(all.filter((r) => day(r.startedAt) >= from && day(r.startedAt) <= to).length);
    expect(range.rows.every((r) => day(new Date(r.startedAt)) >= from && day(new Date(r.startedAt)) <= to)).toBe(true);
  });

  it('combines filters (driver + has defects + pre-trip)', async () => {
    const driverId = f.drivers[0]!.id;
    const r = await listReports({
      fleetId: f.fleet.id,
      query: q({ driverId, hasDefects: 'yes', kind: 'pre_trip', pageSize: 200 }),
    });
    expect(r.total).toBe(all.filter((x) => x.driverId === driverId && x.defects > 0 && x.kind === 'pre_trip').length);
  });

  it('sorts by duration, by driver and by defects, both ways, on the server', async () => {
    const asc = await listReports({ fleetId: f.fleet.id, query: q({ sort: 'durationS', dir: 'asc', pageSize: 200 }) });
    const durations = asc.rows.map((r) => r.durationS ?? -1);
    expect(durations).toEqual([...durations].sort((a, b) => a - b));
    const desc = await listReports({ fleetId: f.fleet.id, query: q({ sort: 'durationS', dir: 'desc', pageSize: 5 }) });
    expect(desc.rows[0]!.durationS).toBe(Math.max(...all.map((r) => r.durationS ?? 0)));

    const byName = await listReports({
      fleetId: f.fleet.id,
      query: q({ sort: 'driverName', dir: 'asc', pageSize: 200 }),
    });
    const names = byName.rows.map((r) => r.driverName);
    expect(names).toEqual([...names].sort());

    const byDefects = await listReports({
      fleetId: f.fleet.id,
      query: q({ sort: 'defects', dir: 'desc', pageSize: 5 }),
    });
    expect(byDefects.rows[0]!.majorCount).toBe(Math.max(...all.map((r) => r.majors)));
  });
});

describe('GET /api/reports', () => {
  it('reads the filters from the query string', async () => {
    const res = await callRoute(
      reportsRoute.GET,
      makeRequest(`/api/reports?pageSize=5&page=2&kind=pre_trip&sort=durationS&dir=asc`, {
        cookie: f.cookies.supervisor,
      }),
    );
    expect(res.status).toBe(200);
    const body = await readJson<ReportPage>(res);
    expect(body.page).toBe(2);
    expect(body.rows).toHaveLength(5);
    expect(body.total).toBe(all.filter((r) => r.kind === 'pre_trip').length);
  });

  it('answers a bad filter with 422 and the field', async () => {
    const res = await callRoute(
      reportsRoute.GET,
      makeRequest(`/api/reports?sort=password&from=yesterday`, { cookie: f.cookies.supervisor }),
    );
    expect(res.status).toBe(422);
    const error = await readError(res);
    expect(Object.keys(error.fields ?? {})).toEqual(expect.arrayContaining(['sort', 'from']));
  });

  it("never lists another fleet's reports, even by a filter on its unit", async () => {
    const other = await makeOfficeFleet({ history: 2, name: 'Third fleet' });
    const res = await callRoute(
      reportsRoute.GET,
      makeRequest(`/api/reports?unitId=${other.tractors[0]!.id}`, { cookie: f.cookies.supervisor }),
    );
    expect((await readJson<ReportPage>(res)).total).toBe(0);
  });
});
