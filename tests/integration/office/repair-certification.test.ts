// A unit's status follows its open major defects through repair: out of service while one is
// open, back in service only when none is (49 CFR 396.11(a)(3), 396.7), and that is mailed.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as certificationRoute from '@/app/api/defects/[id]/certification/route';
import * as defectsRoute from '@/app/api/defects/route';
import * as pendingRoute from '@/app/api/reports/acknowledgements/route';
import { listPendingAcknowledgements } from '@/lib/services/inspections/list-pending-acknowledgements';
import { readError, readJson } from '../../setup/read-json';
import { callRoute, makeRequest } from '../../setup/session';
import { caughtMailTo, makeOfficeFleet, makeSignedReport, type OfficeFleet } from './office-fixtures';

let f: OfficeFleet;
beforeAll(async () => {
  f = await makeOfficeFleet();
});
afterAll(() => f.db.destroy());

/** What these tests read of the answers (the assertions check the values). */
type Queue = { groups: { unitId: string; unitStatus: string; major: unknown[]; minor: unknown[] }[] };
type Certified = { unit: { status: string; changed: boolean }; openMajor: number; mailed: boolean };
type Pending = { pending: { due: unknown; defects: unknown[] }[] };

const certify = (id: string, body: Record<string, unknown>, cookie = f.cookies.mechanic) =>
  callRoute(
    certificationRoute.POST,
    makeRequest(`/api/defects/${id}/certification`, { method: 'POST', cookie, json: body }),
    { id },
  );

const unitStatus = async (id: string) =>
  (await f.db.selectFrom('unit').select('status').where('id', '=', id).executeTakeFirstOrThrow()).status;

describe('repair and certification', () => {
  it('keeps the unit out of service until its last open major defect is certified, then mails it back in service', async () => {
    const report = await makeSignedReport(f, {
      defects: [
        { unit: 'tractor', severity: 'major', description: 'steer tire, bulge, left' },
        { unit: 'tractor', severity: 'major', description: 'brake chamber, audible air leak' },
        { unit: 'tractor', severity: 'minor', description: 'wiper blade, worn' },
        { unit: 'trailer', severity: 'minor', description: 'mud flap, broken' },
      ],
    });
    const [major1, major2, minor, trailerMinor] = report.defects;
    expect(await unitStatus(report.tractor.id)).toBe('out_of_service');

    const queue = await readJson<Queue>(
      await callRoute(defectsRoute.GET, makeRequest('/api/defects', { cookie: f.cookies.mechanic })),
    );
    const group = queue.groups.find((g) => g.unitId === report.tractor.id);
    expect(group?.unitStatus).toBe('out_of_service');
    expect(group?.major).toHaveLength(2);
    expect(group?.minor).toHaveLength(1);
    expect(queue.groups[0]?.unitStatus).toBe('out_of_service'); // out-of-service units come first

    let res = await certify(major1!.id, {
      outcome: 'repaired',
      work: 'Replaced left steer tire',
      parts: '295/75R22.5 steer tire',
      notes: '',
      certifiedName: 'Morgan Shop',
      confirm: true,
    });
    expect(res.status).toBe(201);
    let body = await readJson<Certified>(res);
    expect(body.unit).toMatchObject({ status: 'out_of_service', changed: false });
    expect(body.openMajor).toBe(1);
    expect(await unitStatus(report.tractor.id)).toBe('out_of_service');

    res = await certify(minor!.id, {
      outcome: 'no_repair_needed',
      work: '',
      notes: 'Blade within wear limit, cleaned',
      certifiedName: 'Morgan Shop',
      confirm: true,
    });
    expect(res.status).toBe(201);
    expect(await unitStatus(report.tractor.id)).toBe('out_of_service');
    expect(await caughtMailTo(f.fleet.maintenanceEmail)).toHaveLength(0);

    res = await certify(major2!.id, {
      outcome: 'repaired',
      work: 'Replaced brake chamber diaphragm',
      parts: 'type 30 diaphragm',
      notes: 'Leak test passed',
      certifiedName: 'Morgan Shop',
      confirm: true,
    });
    body = await readJson<Certified>(res);
    expect(body.unit).toMatchObject({ status: 'in_service', changed: true });
    expect(body.mailed).toBe(true);
    expect(await unitStatus(report.tractor.id)).toBe('in_service');

    const mails = await caughtMailTo(f.fleet.maintenanceEmail);
    expect(mails.map((m) => m.subject)).toEqual([
      `Back in service: unit ${report.tractor.unitNumber} (${f.fleet.name})`,
    ]);
    expect(mails[0]!.to).toEqual(expect.arrayContaining([f.fleet.maintenanceEmail, f.fleet.supervisorEmail]));
    const outbox = await f.db
      .selectFrom('mailOutbox')
      .select(['kind', 'status'])
      .where('fleetId', '=', f.fleet.id)
      .execute();
    expect(outbox).toEqual([{ kind: 'back_in_service', status: 'sent' }]);

    // The trailer never went out of service: a minor defect may be driven on.
    expect(await unitStatus(report.trailer!.id)).toBe('in_service');
    const defect = await f.db.selectFrom('defect').selectAll().where('id', '=', major2!.id).executeTakeFirstOrThrow();
    expect(defect).toMatchObject({
      status: 'repaired',
      certifiedBy: f.mechanic.id,
      certifiedName: 'Morgan Shop',
      repairWork: 'Replaced brake chamber diaphragm',
    });
    expect(defect.certificationText).toMatch(/repaired/);
    const audit = await f.db
      .selectFrom('auditLog')
      .select('action')
      .where('fleetId', '=', f.fleet.id)
      .orderBy('id')
      .execute();
    expect(audit.map((a) => a.action)).toEqual([
      'defect.certified',
      'defect.certified',
      'defect.certified',
      'unit.in_service',
    ]);
    expect(trailerMinor!.severity).toBe('minor');
  });

  it('refuses to certify twice (409), and another fleet gets 404', async () => {
    const report = await makeSignedReport(f, {
      tractorIndex: 1,
      defects: [{ unit: 'tractor', severity: 'minor', description: 'marker lamp, cracked' }],
    });
    const id = report.defects[0]!.id;
    const ok = { outcome: 'repaired', work: 'Replaced lens', certifiedName: 'Morgan Shop', confirm: true };
    expect((await certify(id, ok)).status).toBe(201);
    const again = await certify(id, ok);
    expect(again.status).toBe(409);
    const other = await makeOfficeFleet({ name: 'Other shop' });
    expect((await certify(id, ok, other.cookies.mechanic)).status).toBe(404);
  });

  it('asks for the work done, a signature name and the statement ticked (422 with fields)', async () => {
    const report = await makeSignedReport(f, {
      tractorIndex: 2,
      defects: [{ unit: 'tractor', severity: 'major', description: 'lug nut, loose' }],
    });
    const res = await certify(report.defects[0]!.id, {
      outcome: 'repaired',
      work: '',
      certifiedName: 'M',
      confirm: false,
    });
    expect(res.status).toBe(422);
    const error = await readError(res);
    expect(Object.keys(error.fields ?? {})).toEqual(expect.arrayContaining(['certifiedName', 'confirm']));
    expect(await unitStatus(report.tractor.id)).toBe('out_of_service');
    expect(
      (
        await certify(report.defects[0]!.id, {
          outcome: 'repaired',
          work: 'x',
          certifiedName: 'Morgan Shop',
          confirm: true,
        })
      ).status,
    ).toBe(422);
  });

  it('the next driver must acknowledge the last report with defects, and sees the certification', async () => {
    const g = await makeOfficeFleet({ name: 'Ack fleet' });
    const report = await makeSignedReport(g, {
      defects: [{ unit: 'tractor', severity: 'major', description: 'steer tire, bulge' }],
    });
    const before = await listPendingAcknowledgements({
      fleetId: g.fleet.id,
      unitIds: [report.tractor.id, report.trailer!.id],
    });
    expect(before).toHaveLength(1);
    expect(before[0]!.report.id).toBe(report.id);
    expect(before[0]!.due).toMatchObject({ signatureRequired: true, mayOperate: false });

    await callRoute(
      certificationRoute.POST,
      makeRequest(`/api/defects/${report.defects[0]!.id}/certification`, {
        method: 'POST',
        cookie: g.cookies.mechanic,
        json: { outcome: 'repaired', work: 'Replaced tire', certifiedName: 'Morgan Shop', confirm: true },
      }),
      { id: report.defects[0]!.id },
    );
    const res = await callRoute(
      pendingRoute.GET,
      makeRequest(`/api/reports/acknowledgements?units=${report.tractor.id},${report.trailer!.id}`, {
        cookie: g.cookies.driver,
      }),
    );
    expect(res.status).toBe(200);
    const { pending } = await readJson<Pending>(res);
    expect(pending).toHaveLength(1);
    expect(pending[0]?.due).toMatchObject({ signatureRequired: true, mayOperate: true });
    expect(pending[0]?.defects[0]).toMatchObject({ status: 'repaired', certifiedName: 'Morgan Shop' });

    await g.db
      .insertInto('acknowledgement')
      .values({
        fleetId: g.fleet.id,
        unitId: report.tractor.id,
        reviewedInspectionId: report.id,
        driverId: g.drivers[1]!.id,
        signatureName: 'Blake Ortiz',
        statement: 'Reviewed.',
      })
      .execute();
    expect(await listPendingAcknowledgements({ fleetId: g.fleet.id, unitIds: [report.tractor.id] })).toEqual([]);
    // Another fleet asking about these units learns nothing.
    expect(await listPendingAcknowledgements({ fleetId: f.fleet.id, unitIds: [report.tractor.id] })).toEqual([]);
  });
});
