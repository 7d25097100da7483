// A whole walk through the real route handlers, for the security, fault and integrity tests.
import { randomUUID } from 'node:crypto';
import * as finish from '@/app/api/inspections/[id]/finish/route';
import * as steps from '@/app/api/inspections/[id]/steps/route';
import * as inspections from '@/app/api/inspections/route';
import type { DB } from '../../../db/connect';
import { makeUnit } from '../../../db/factories';
import type { FleetFixture } from '../../setup/fleet-fixture';
import { callRoute, makeRequest } from '../../setup/session';
import { answerEveryItem } from '../../setup/walk-answers';

const now = () => new Date().toISOString();

export function startWalk(f: FleetFixture, id = randomUUID(), tractorId = f.tractor.id) {
  return callRoute(
    inspections.POST,
    makeRequest('/api/inspections', {
      method: 'POST',
      cookie: f.cookies.driver,
      json: { id, kind: 'pre_trip', tractorId, trailerId: null, odometer: 1000, startedAt: now() },
    }),
  );
}

export function postStep(f: FleetFixture, inspectionId: string, body: Record<string, unknown>) {
  return callRoute(
    steps.POST,
    makeRequest(`/api/inspections/${inspectionId}/steps`, {
      method: 'POST',
      cookie: f.cookies.driver,
      json: { inputMode: 'tap', deviceAt: now(), ...body },
    }),
    { id: inspectionId },
  );
}

export function signWalk(f: FleetFixture, inspectionId: string) {
  return callRoute(
    finish.POST,
    makeRequest(`/api/inspections/${inspectionId}/finish`, {
      method: 'POST',
      cookie: f.cookies.driver,
      json: { signatureName: f.users.driver.name, certify: true, finishedAt: now() },
    }),
    { id: inspectionId },
  );
}

/** A signed report with a few steps (one of them a defect) and every item answered, on a tractor of its own. */
export async function makeSignedReport(db: DB, f: FleetFixture) {
  const id = randomUUID();
  const unit = await makeUnit(db, { fleetId: f.fleet.id, kind: 'tractor' });
  const start = await startWalk(f, id, unit.id);
  if (start.status !== 201) throw new Error(`start failed: ${await start.text()}`);
  const stepIds: string[] = [];
  for (const [i, body] of [
    { zone: 'front', kind: 'visit' },
    { zone: 'front', kind: 'zone_ok', heard: 'all good' },
    { zone: 'in_cab', kind: 'defect', termKey: 'horn:inoperative', heard: 'horn does not work' },
  ].entries()) {
    const stepId = randomUUID();
    stepIds.push(stepId);
    const res = await postStep(f, id, { id: stepId, seq: i + 1, ...body });
    if (res.status !== 201) throw new Error(`step failed: ${await res.text()}`);
  }
  // Every other item answered: a report signs only when none is open.
  for (const body of answerEveryItem({ kind: 'pre_trip', hasTrailer: false, fromSeq: 10 })) {
    const res = await postStep(f, id, body);
    if (res.status !== 201) throw new Error(`step failed: ${await res.text()}`);
  }
  const signed = await signWalk(f, id);
  if (signed.status !== 200) throw new Error(`sign failed: ${await signed.text()}`);
  return { id, stepIds };
}
