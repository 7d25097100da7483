import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { POST as retireRoute } from '@/app/api/admin/units/[id]/retire/route';
import { GET as getUnit, PATCH as patchUnit } from '@/app/api/admin/units/[id]/route';
import { GET as listUnits, POST as createUnit } from '@/app/api/admin/units/route';
import { findUsableUnit, listUsableUnits } from '@/lib/db/units';
import { z } from 'zod';
import { findVinProblem, unitSchema } from '@/lib/schemas/units';
import { parseJson, readError } from '../../setup/read-json';
import { callRoute, makeRequest } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';
import { auditRows, makeAdminFleet, makeTractor, makeVin, tractorAxles, trailerAxles } from './helpers';

const db = getTestDb();
afterAll(() => db.destroy());

let ctx: Awaited<ReturnType<typeof makeAdminFleet>>;
beforeEach(async () => {
  ctx = await makeAdminFleet();
});

const create = (json: unknown) =>
  callRoute(createUnit, makeRequest('/api/admin/units', { method: 'POST', cookie: ctx.adminCookie, json }));
const patch = (id: string, json: unknown) =>
  callRoute(patchUnit, makeRequest(`/api/admin/units/${id}`, { method: 'PATCH', cookie: ctx.adminCookie, json }), {
    id,
  });
const retire = (id: string, json: unknown = {}) =>
  callRoute(
    retireRoute,
    makeRequest(`/api/admin/units/${id}/retire`, { method: 'POST', cookie: ctx.adminCookie, json }),
    { id },
  );

const unitBodySchema = z.object({ unit: unitSchema });
const unitListSchema = z.object({ units: z.array(unitSchema) });

const trailer = (over: Record<string, unknown> = {}) => ({
  kind: 'trailer',
  unitNumber: '5390',
  plate: 'trl 1200',
  plateJurisdiction: 'on',
  vin: makeVin(),
  make: 'Plainsman',
  model: '53 ft dry van',
  year: 2021,
  axles: trailerAxles,
  ...over,
});

describe('VIN check', () => {
  it('accepts a VIN whose check digit fits (49 CFR 565.15)', () => {
    expect(findVinProblem('1M8GDM9AXKP042788')).toBeNull(); // check digit X
    expect(findVinProblem(makeVin())).toBeNull();
  });
  it('names what is wrong', () => {
    expect(findVinProblem('1M8GDM9AXKP04278')).toMatch(/17 characters; this one has 16/);
    expect(findVinProblem('1M8GDM9AXKP0427O8')).toMatch(/never uses the letters I, O or Q/);
    expect(findVinProblem('1M8GDM9A1KP042788')).toMatch(/check digit/);
  });
});

describe('adding a unit', () => {
  it('stores the trailer with its axle layout, normalised, and audits it', async () => {
    const vin = makeVin();
    const res = await create(trailer({ vin: `${vin.slice(0, 8).toLowerCase()} ${vin.slice(8)}` }));
    expect(res.status).toBe(201);
    const { unit } = await parseJson(res, unitBodySchema);
    expect(unit).toMatchObject({
      kind: 'trailer',
      unitNumber: '5390',
      plate: 'TRL 1200',
      plateJurisdiction: 'ON',
      vin,
      year: 2021,
      status: 'in_service',
      retiredAt: null,
    });
    expect(unit.axles).toEqual(trailerAxles);
    const stored = await db
      .selectFrom('unit')
      .select(['fleetId', 'axles'])
      .where('id', '=', unit.id)
      .executeTakeFirstOrThrow();
    expect(stored).toEqual({ fleetId: ctx.fleet.id, axles: trailerAxles });
    expect(await auditRows(unit.id)).toEqual([
      expect.objectContaining({
        action: 'unit.created',
        entity: 'unit',
        actorId: ctx.admin.id,
        detail: { kind: 'trailer', unitNumber: '5390', vin, axles: 2 },
      }),
    ]);
  });

  it('explains a bad VIN beside the field (422)', async () => {
    const res = await create(trailer({ vin: 'IOQ45678901234567' }));
    expect(res.status).toBe(422);
    const error = await readError(res);
    expect(error.fields?.vin).toEqual([
      'A VIN never uses the letters I, O or Q (they read like 1 and 0). Check those characters.',
    ]);
    const res2 = await create(trailer({ vin: '1M8GDM9A1KP042788' }));
    expect((await readError(res2)).fields?.vin?.[0]).toMatch(/check digit/);
  });

  it('refuses a unit number already used in the fleet, whatever the case (409)', async () => {
    await makeTractor(ctx.fleet.id, { unitNumber: 'NB-214' });
    const res = await create({ ...trailer(), unitNumber: 'nb-214' });
    expect(res.status).toBe(409);
    const error = await readError(res);
    expect(error.message).toBe('Unit number NB-214 is already in use in this fleet.');
    expect(error.fields?.unitNumber).toEqual(['Unit number NB-214 is already in use in this fleet.']);
  });

  it('allows the same unit number in another fleet', async () => {
    const other = await makeAdminFleet();
    await makeTractor(other.fleet.id, { unitNumber: '5390' });
    expect((await create(trailer())).status).toBe(201);
  });

  it('checks the axle layout against the kind, the chamber types and the pressures', async () => {
    const res = await create(trailer({ axles: tractorAxles }));
    expect(res.status).toBe(422);
    expect((await readError(res)).fields?.['axles.0.position']).toEqual(['A trailer has trailer axles only.']);

    const res2 = await create({
      ...trailer(),
      kind: 'tractor',
      axles: [{ position: 'drive', tires: ['A', 'B'], coldPsi: 200, chamber: '31' }],
    });
    const { fields } = await readError(res2);
    expect(fields?.['axles.0.coldPsi']).toEqual(['A cold-inflation target is at most 150 psi.']);
    expect(fields?.['axles.0.chamber']?.[0]).toMatch(/brake chamber type/);

    const res3 = await create({ ...trailer(), kind: 'tractor', axles: [tractorAxles[1], tractorAxles[0]] });
    expect((await readError(res3)).fields?.['axles.0.position']).toEqual([
      'The first axle of a tractor is its steer axle.',
    ]);
  });

  it('wants a jurisdiction with a plate', async () => {
    const res = await create(trailer({ plateJurisdiction: '' }));
    expect(res.status).toBe(422);
    expect((await readError(res)).fields?.plateJurisdiction).toEqual([
      'Pick the state or province that issued this plate.',
    ]);
  });
});

describe('editing and retiring a unit', () => {
  it('edits fields and records what changed', async () => {
    const t = await makeTractor(ctx.fleet.id, { unitNumber: '301' });
    const res = await patch(t.id, {
      make: 'Ardent',
      year: 2020,
      axles: [{ ...tractorAxles[0], coldPsi: 115 }, tractorAxles[1]],
    });
    expect(res.status).toBe(200);
    const { unit } = await parseJson(res, unitBodySchema);
    expect(unit).toMatchObject({ make: 'Ardent', year: 2020 });
    expect(unit.axles).toHaveLength(2);
    const [row] = await auditRows(t.id);
    expect(row).toMatchObject({
      action: 'unit.updated',
      detail: { unitNumber: '301', changes: { make: { from: null, to: 'Ardent' }, year: { from: null, to: 2020 } } },
    });
    expect(Object.keys((row!.detail as { changes: object }).changes).sort()).toEqual(['axles', 'make', 'year']);
  });

  it('refuses to renumber onto a number in use (409)', async () => {
    await makeTractor(ctx.fleet.id, { unitNumber: '302' });
    const t = await makeTractor(ctx.fleet.id, { unitNumber: '303' });
    const res = await patch(t.id, { unitNumber: '302' });
    expect(res.status).toBe(409);
  });

  it('retires a unit: kept, read-only, no longer offered for new inspections', async () => {
    const t = await makeTractor(ctx.fleet.id, { unitNumber: '304' });
    expect((await findUsableUnit(db, { fleetId: ctx.fleet.id, id: t.id, kind: 'tractor' }))?.id).toBe(t.id);

    const res = await retire(t.id, { reason: 'sold at auction' });
    expect(res.status).toBe(200);
    expect((await parseJson(res, unitBodySchema)).unit.retiredAt).toEqual(expect.any(String));
    expect((await auditRows(t.id)).map((r) => [r.action, r.detail])).toEqual([
      ['unit.retired', { unitNumber: '304', kind: 'tractor', reason: 'sold at auction' }],
    ]);

    expect(await findUsableUnit(db, { fleetId: ctx.fleet.id, id: t.id })).toBeUndefined();
    expect((await listUsableUnits(db, { fleetId: ctx.fleet.id })).map((u) => u.id)).not.toContain(t.id);
    expect(await db.selectFrom('unit').select('id').where('id', '=', t.id).executeTakeFirst()).toEqual({ id: t.id });

    expect((await retire(t.id)).status).toBe(409);
    const edit = await patch(t.id, { make: 'Ardent' });
    expect(edit.status).toBe(409);
    expect((await readError(edit)).message).toMatch(/retired/);
    const reuse = await create({ ...trailer(), kind: 'tractor', unitNumber: '304', axles: tractorAxles });
    expect((await readError(reuse)).message).toMatch(/retired unit/);
  });

  it('lists by kind and retirement', async () => {
    const a = await makeTractor(ctx.fleet.id, { unitNumber: '310' });
    const b = await makeTractor(ctx.fleet.id, { unitNumber: '311' });
    await retire(b.id);
    const list = async (q: string) => {
      const res = await callRoute(listUnits, makeRequest(`/api/admin/units${q}`, { cookie: ctx.adminCookie }));
      return (await parseJson(res, unitListSchema)).units.map((u) => u.id);
    };
    expect(await list('')).toEqual([a.id, b.id]);
    expect(await list('?retired=exclude')).toEqual([a.id]);
    expect(await list('?retired=only&kind=tractor')).toEqual([b.id]);
    expect(await list('?kind=trailer')).toEqual([]);
  });
});

describe('another fleet', () => {
  it("gets 404 for another fleet's unit by id, and changes nothing", async () => {
    const other = await makeAdminFleet();
    const theirs = await makeTractor(other.fleet.id, { unitNumber: '999' });
    expect(
      (
        await callRoute(getUnit, makeRequest(`/api/admin/units/${theirs.id}`, { cookie: ctx.adminCookie }), {
          id: theirs.id,
        })
      ).status,
    ).toBe(404);
    expect((await patch(theirs.id, { make: 'Hijacked' })).status).toBe(404);
    expect((await retire(theirs.id)).status).toBe(404);
    const row = await db
      .selectFrom('unit')
      .select(['make', 'retiredAt'])
      .where('id', '=', theirs.id)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({ make: null, retiredAt: null });
    expect(await auditRows(theirs.id)).toEqual([]);
    expect(await findUsableUnit(db, { fleetId: ctx.fleet.id, id: theirs.id })).toBeUndefined();
  });
});
