// Set-up for the office integration tests: a fleet with seeded-style history, and signed reports
// with defects built the way the driver's finish builds them (the content hash over the rows).
import { createHash, randomUUID } from 'node:crypto';
import { makeFleet, makeUnit, makeUser } from '../../../db/factories';
import type { InspectionStep } from '../../../db/schema';
import { seedHistory } from '../../../db/seeds/02-history';
import { serializeReport, toCanonicalSteps } from '../../../lib/walk/report';
import { sessionCookieFor } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';

export async function makeOfficeFleet(opts: { history?: number; name?: string } = {}) {
  const db = getTestDb();
  const slug = `office-${randomUUID().slice(0, 8)}`;
  const fleet = await makeFleet(db, {
    slug,
    name: opts.name ?? `Office fleet ${slug}`,
    maintenanceEmail: `shop-${slug}@test.example`,
    supervisorEmail: `sup-${slug}@test.example`,
  });
  const drivers = [];
  for (const n of ['Avery Stone', 'Blake Ortiz', 'Casey Nguyen'])
    drivers.push(
      await makeUser(db, {
        fleetId: fleet.id,
        roles: ['driver'],
        name: n,
        email: `${n.split(' ')[0]!.toLowerCase()}-${slug}@test.example`,
      }),
    );
  const mechanic = await makeUser(db, { fleetId: fleet.id, roles: ['mechanic'], name: 'Morgan Shop' });
  const supervisor = await makeUser(db, { fleetId: fleet.id, roles: ['supervisor'], name: 'Sam Lead' });
  const admin = await makeUser(db, { fleetId: fleet.id, roles: ['admin'], name: 'Ari Admin' });
  const tractors = [];
  for (const n of ['101', '102', '103'])
    tractors.push(
      await makeUnit(db, { fleetId: fleet.id, kind: 'tractor', unitNumber: n, plate: `P-${n}`, vin: `VIN${n}XYZ` }),
    );
  const trailers = [];
  for (const n of ['5001', '5002', '5003', '5004'])
    trailers.push(await makeUnit(db, { fleetId: fleet.id, kind: 'trailer', unitNumber: n, year: 2019 }));
  let history = null;
  if (opts.history) history = await seedHistory(db, { fleetSlug: slug, days: opts.history });
  return {
    db,
    fleet: { ...fleet, maintenanceEmail: `shop-${slug}@test.example`, supervisorEmail: `sup-${slug}@test.example` },
    drivers,
    mechanic,
    supervisor,
    admin,
    tractors,
    trailers,
    history,
    cookies: {
      supervisor: await sessionCookieFor(supervisor),
      mechanic: await sessionCookieFor(mechanic),
      driver: await sessionCookieFor(drivers[0]!),
      admin: await sessionCookieFor(admin),
    },
  };
}

export type OfficeFleet = Awaited<ReturnType<typeof makeOfficeFleet>>;

type DefectSpec = {
  unit: 'tractor' | 'trailer';
  severity: 'minor' | 'major';
  description: string;
  component?: string;
  condition?: string;
  zone?: string;
};

/** A signed, submitted report with a visit and a finding step per defect, and its defect rows. */
export async function makeSignedReport(
  f: OfficeFleet,
  o: {
    driverIndex?: number;
    tractorIndex?: number;
    trailerIndex?: number | null;
    defects?: DefectSpec[];
    startedAt?: Date;
    minutes?: number;
    location?: string;
    kind?: 'pre_trip' | 'post_trip';
  } = {},
) {
  const db = f.db;
  const driver = f.drivers[o.driverIndex ?? 0]!;
  const tractor = f.tractors[o.tractorIndex ?? 0]!;
  const trailer = o.trailerIndex === null ? null : f.trailers[o.trailerIndex ?? 0]!;
  const startedAt = o.startedAt ?? new Date(Date.now() - 3 * 3600_000);
  const finishedAt = new Date(startedAt.getTime() + (o.minutes ?? 20) * 60_000);
  const signedAt = new Date(finishedAt.getTime() + 15_000);
  const id = randomUUID();
  const steps: {
    id: string;
    seq: number;
    zone: string;
    item: string | null;
    kind: InspectionStep['kind'];
    heard: string | null;
    termKey: string | null;
    component: string | null;
    condition: string | null;
    position: string | null;
    score: number | null;
    resolution: InspectionStep['resolution'];
    undoesStepId: string | null;
    measurementKind: string | null;
    value: number | null;
    unit: string | null;
    verdict: InspectionStep['verdict'];
    severity: InspectionStep['severity'];
    deviceAt: Date;
  }[] = [];
  const push = (s: Partial<(typeof steps)[number]> & { zone: string; kind: InspectionStep['kind'] }) => {
    const seq = steps.length;
    steps.push({
      id: randomUUID(),
      seq,
      item: null,
      heard: null,
      termKey: null,
      component: null,
      condition: null,
      position: null,
      score: null,
      resolution: null,
      undoesStepId: null,
      measurementKind: null,
      value: null,
      unit: null,
      verdict: null,
      severity: null,
      deviceAt: new Date(startedAt.getTime() + (seq + 1) * 30_000),
      ...s,
    });
    return steps[seq]!;
  };
  const defectSteps: { step: (typeof steps)[number]; spec: DefectSpec }[] = [];
  push({ zone: 'front', kind: 'visit' });
  for (const spec of o.defects ?? []) {
    const step = push({
      zone: spec.zone ?? 'front',
      kind: 'defect',
      heard: spec.description.toLowerCase(),
      component: spec.component ?? 'steer tire',
      condition: spec.condition ?? 'bulge',
      score: 0.91,
      resolution: 'auto',
      severity: spec.severity,
      termKey: 'steer_tire:bulge',
    });
    defectSteps.push({ step, spec });
  }
  push({ zone: 'front', kind: 'zone_ok', heard: 'all good', score: 1, resolution: 'auto' });
  push({ zone: 'engine_bay', kind: 'visit' });
  push({ zone: 'engine_bay', kind: 'zone_ok', heard: 'all good', score: 1, resolution: 'auto' });
  const header = {
    id,
    fleetId: f.fleet.id,
    kind: o.kind ?? 'pre_trip',
    driverId: driver.id,
    tractorId: tractor.id,
    trailerId: trailer?.id ?? null,
    odometer: 512_340,
    location: o.location ?? 'Test yard',
    billOfLading: null,
    sealNumber: null,
    ruleProfile: 'us-federal',
    vocabularyVersionId: null,
    startedAt,
    finishedAt,
    certificationText:
      'I performed this inspection and the report lists every defect I found or that was reported to me.',
    signatureName: driver.name,
    signedAt,
  };
  const hash = createHash('sha256')
    .update(
      // Written as a report of format 1 (the inspection row's default): steps and header only.
      serializeReport({ ...header, steps: toCanonicalSteps(steps, 1) }, null, 1),
    )
    .digest('hex');
  await db
    .insertInto('inspection')
    .values({ ...header, status: 'submitted', durationS: (o.minutes ?? 20) * 60, contentHash: hash })
    .execute();
  await db
    .insertInto('inspectionStep')
    .values(
      steps.map((s) => ({
        ...s,
        fleetId: f.fleet.id,
        inspectionId: id,
        alternatives: JSON.stringify(s.score !== null && s.score < 0.95 ? ['bulge on the right steer tire'] : []),
        inputMode: 'voice',
      })),
    )
    .execute();
  const defects = [];
  for (const { step, spec } of defectSteps) {
    const unitId = spec.unit === 'trailer' && trailer ? trailer.id : tractor.id;
    defects.push(
      await db
        .insertInto('defect')
        .values({
          fleetId: f.fleet.id,
          inspectionId: id,
          stepId: step.id,
          unitId,
          zone: step.zone,
          component: step.component!,
          condition: step.condition!,
          severity: spec.severity,
          description: spec.description,
        })
        .returning(['id', 'unitId', 'severity'])
        .executeTakeFirstOrThrow(),
    );
  }
  const majorUnits = new Set(defects.filter((d) => d.severity === 'major').map((d) => d.unitId));
  for (const u of majorUnits)
    await db.updateTable('unit').set({ status: 'out_of_service' }).where('id', '=', u).execute();
  return { id, tractor, trailer, driver, defects, steps, hash };
}

/** Messages the test mail catcher received for one address. */
export async function caughtMailTo(address: string): Promise<{ id: string; subject: string; to: string[] }[]> {
  const url = process.env.MAIL_CATCHER_URL;
  if (!url) throw new Error('MAIL_CATCHER_URL is not set');
  const res = await fetch(`${url}/messages?to=${encodeURIComponent(address)}`);
  return ((await res.json()) as { messages: { id: string; subject: string; to: string[] }[] }).messages;
}
