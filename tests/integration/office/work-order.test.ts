// A work order: a unit's open defects certified in one signature. The unit goes back in service
// once, with one mail, when its last open major defect is in the order (49 CFR 396.11(a)(3)).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as certificationRoute from '@/app/api/defects/[id]/certification/route';
import { readError, readJson } from '../../setup/read-json';
import { callRoute, makeRequest } from '../../setup/session';
import { caughtMailTo, makeOfficeFleet, makeSignedReport, type OfficeFleet } from './office-fixtures';

let f: OfficeFleet;
beforeAll(async () => {
  f = await makeOfficeFleet({ name: 'Work order fleet' });
});
afterAll(() => f.db.destroy());

type Certified = {
  certifiedIds: string[];
  unit: { status: string; changed: boolean };
  openMajor: number;
  openMinor: number;
  mailed: boolean;
};

const certify = (id: string, body: Record<string, unknown>) =>
  callRoute(
    certificationRoute.POST,
    makeRequest(`/api/defects/${id}/certification`, { method: 'POST', cookie: f.cookies.mechanic, json: body }),
    { id },
  );
const signed = { outcome: 'repaired', work: 'Replaced and tested', certifiedName: 'Morgan Shop', confirm: true };

describe('work orders', () => {
  it("certifies a unit's open defects together: back in service once, one mail", async () => {
    const report = await makeSignedReport(f, {
      tractorIndex: 1,
      defects: [
        { unit: 'tractor', severity: 'major', description: 'steer tire, bulge, left' },
        { unit: 'tractor', severity: 'major', description: 'brake chamber, audible air leak' },
        { unit: 'tractor', severity: 'minor', description: 'wiper blade, worn' },
      ],
    });
    const [a, b, c] = report.defects;
    const res = await certify(a!.id, { ...signed, togetherWith: [b!.id, c!.id] });
    expect(res.status).toBe(201);
    const body = await readJson<Certified>(res);
    expect(body.certifiedIds.sort()).toEqual([a!.id, b!.id, c!.id].sort());
    expect(body).toMatchObject({
      unit: { status: 'in_service', changed: true },
      openMajor: 0,
      openMinor: 0,
      mailed: true,
    });
    const rows = await f.db
      .selectFrom('defect')
      .select(['status', 'certifiedName', 'certifiedAt'])
      .where('inspectionId', '=', report.id)
      .execute();
    expect(rows.map((r) => r.status)).toEqual(['repaired', 'repaired', 'repaired']);
    expect(new Set(rows.map((r) => r.certifiedAt?.toISOString())).size).toBe(1); // one signature
    const mails = await caughtMailTo(f.fleet.maintenanceEmail);
    expect(mails.map((m) => m.subject)).toEqual([
      `Back in service: unit ${report.tractor.unitNumber} (${f.fleet.name})`,
    ]);
    const units = await f.db
      .selectFrom('auditLog')
      .select('action')
      .where('fleetId', '=', f.fleet.id)
      .where('action', '=', 'unit.in_service')
      .execute();
    expect(units).toHaveLength(1);
  });

  it('certifies one by one as before, and refuses an order mixing units or holding a certified defect', async () => {
    const report = await makeSignedReport(f, {
      tractorIndex: 2,
      defects: [
        { unit: 'tractor', severity: 'major', description: 'lug nut, loose' },
        { unit: 'tractor', severity: 'minor', description: 'marker lamp, cracked' },
        { unit: 'trailer', severity: 'minor', description: 'mud flap, broken' },
      ],
    });
    const [major, minor, trailerMinor] = report.defects;
    const mixed = await certify(major!.id, { ...signed, togetherWith: [trailerMinor!.id] });
    expect(mixed.status).toBe(422);
    expect((await readError(mixed)).message).toMatch(/A work order covers one unit/);

    const one = await readJson<Certified>(await certify(minor!.id, signed));
    expect(one).toMatchObject({ certifiedIds: [minor!.id], unit: { status: 'out_of_service', changed: false } });

    const again = await certify(major!.id, { ...signed, togetherWith: [minor!.id] });
    expect(again.status).toBe(409);
    expect((await readError(again)).message).toMatch(/already certified; take it out of the work order/);
    // nothing of the refused order was written
    const row = await f.db.selectFrom('defect').select('status').where('id', '=', major!.id).executeTakeFirstOrThrow();
    expect(row.status).toBe('open');
  });
});
