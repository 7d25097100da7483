// Builders shared by the seeds, the integration tests and the e2e tests. Each writes real rows.
import { randomUUID } from 'node:crypto';
import bcrypt from 'bcryptjs';
import type { Insertable } from 'kysely';
import type { DB } from '../connect';
import type { Fleet, Unit } from '../schema';
import type { Role } from '../../lib/auth/roles';

export async function hashPassword(password: string, cost = 10): Promise<string> {
  return bcrypt.hash(password, cost);
}

export async function makeFleet(db: DB, over: Partial<Insertable<Fleet>> = {}) {
  const slug = over.slug ?? `fleet-${randomUUID().slice(0, 8)}`;
  return db
    .insertInto('fleet')
    .values({ name: over.name ?? `Test fleet ${slug}`, slug, ...over })
    .onConflict((oc) => oc.column('slug').doUpdateSet({ name: (eb) => eb.ref('excluded.name') }))
    .returning(['id', 'name', 'slug'])
    .executeTakeFirstOrThrow();
}

export async function makeUser(
  db: DB,
  u: {
    fleetId: string;
    roles: Role[];
    email?: string;
    name?: string;
    password?: string;
    passwordHash?: string;
    active?: boolean;
  },
) {
  const email = (u.email ?? `user-${randomUUID().slice(0, 8)}@test.example`).toLowerCase();
  const passwordHash = u.passwordHash ?? (await hashPassword(u.password ?? 'test-password', 4));
  return db
    .insertInto('appUser')
    .values({
      fleetId: u.fleetId,
      email,
      name: u.name ?? email.split('@')[0]!,
      passwordHash,
      roles: u.roles,
      active: u.active ?? true,
    })
    .onConflict((oc) =>
      oc
        .column('email')
        .doUpdateSet({ name: (eb) => eb.ref('excluded.name'), roles: (eb) => eb.ref('excluded.roles') }),
    )
    .returning(['id', 'fleetId', 'email', 'name', 'roles'])
    .executeTakeFirstOrThrow();
}

export async function makeUnit(
  db: DB,
  u: { fleetId: string; kind: 'tractor' | 'trailer'; unitNumber?: string } & Partial<Insertable<Unit>>,
) {
  const { fleetId, kind, unitNumber, ...rest } = u;
  return db
    .insertInto('unit')
    .values({
      fleetId,
      kind,
      unitNumber: unitNumber ?? `${kind === 'tractor' ? 'T' : 'TR'}-${randomUUID().slice(0, 6)}`,
      ...rest,
    })
    .onConflict((oc) => oc.columns(['fleetId', 'unitNumber']).doUpdateSet({ make: (eb) => eb.ref('excluded.make') }))
    .returning(['id', 'fleetId', 'kind', 'unitNumber', 'status'])
    .executeTakeFirstOrThrow();
}

/** A submitted or draft inspection with no steps, for tests that need a report to point at. */
export async function makeInspection(
  db: DB,
  i: {
    fleetId: string;
    driverId: string;
    tractorId: string;
    trailerId?: string | null;
    kind?: 'pre_trip' | 'post_trip';
  },
) {
  return db
    .insertInto('inspection')
    .values({
      id: randomUUID(),
      fleetId: i.fleetId,
      driverId: i.driverId,
      tractorId: i.tractorId,
      trailerId: i.trailerId ?? null,
      kind: i.kind ?? 'pre_trip',
    })
    .returning(['id', 'fleetId', 'status'])
    .executeTakeFirstOrThrow();
}
