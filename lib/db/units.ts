import 'server-only';
import { z } from 'zod';
import { axleSchema, type Axle, type UnitDto, type UnitKind } from '@/lib/schemas/units';
import type { DB } from './index';

const unitColumns = [
  'id',
  'kind',
  'unitNumber',
  'plate',
  'plateJurisdiction',
  'vin',
  'make',
  'model',
  'year',
  'axles',
  'status',
  'retiredAt',
  'updatedAt',
] as const;

type UnitRow = {
  id: string;
  kind: string;
  unitNumber: string;
  plate: string | null;
  plateJurisdiction: string | null;
  vin: string | null;
  make: string | null;
  model: string | null;
  year: number | null;
  axles: unknown;
  status: string;
  retiredAt: Date | null;
  updatedAt: Date;
};

const storedAxles = z.array(axleSchema);

/** A unit row as the API returns it: dates as ISO strings, the axle layout checked. */
export function toUnitDto(row: UnitRow): UnitDto {
  const axles = storedAxles.safeParse(row.axles);
  return {
    ...row,
    kind: row.kind === 'trailer' ? 'trailer' : 'tractor',
    axles: axles.success ? axles.data : [],
    status: row.status === 'out_of_service' ? 'out_of_service' : 'in_service',
    retiredAt: row.retiredAt ? row.retiredAt.toISOString() : null,
    updatedAt: row.updatedAt.toISOString(),
  };
}

export type RetiredFilter = 'include' | 'exclude' | 'only';

/** A fleet's units, tractors first, by unit number. */
export async function listFleetUnits(
  db: DB,
  { fleetId, kind, retired = 'include' }: { fleetId: string; kind?: UnitKind; retired?: RetiredFilter },
): Promise<UnitDto[]> {
  let q = db.selectFrom('unit').select(unitColumns).where('fleetId', '=', fleetId);
  if (kind) q = q.where('kind', '=', kind);
  if (retired === 'exclude') q = q.where('retiredAt', 'is', null);
  if (retired === 'only') q = q.where('retiredAt', 'is not', null);
  const rows = await q.orderBy('kind').orderBy('unitNumber').execute();
  return rows.map(toUnitDto);
}

/** One unit of this fleet, retired or not; undefined when absent or in another fleet. */
export async function findFleetUnit(
  db: DB,
  { fleetId, id }: { fleetId: string; id: string },
): Promise<UnitDto | undefined> {
  const row = await db
    .selectFrom('unit')
    .select(unitColumns)
    .where('fleetId', '=', fleetId)
    .where('id', '=', id)
    .executeTakeFirst();
  return row ? toUnitDto(row) : undefined;
}

/** The unit carrying this number in the fleet (unit numbers stay taken after retirement). */
export async function findUnitByNumber(db: DB, { fleetId, unitNumber }: { fleetId: string; unitNumber: string }) {
  return db
    .selectFrom('unit')
    .select(['id', 'unitNumber', 'retiredAt'])
    .where('fleetId', '=', fleetId)
    .where('unitNumber', '=', unitNumber)
    .executeTakeFirst();
}

/**
 * Units a driver may pick for a new inspection: this fleet's, not retired, of the kind asked.
 * Out-of-service units are listed (a post-trip or a re-inspection may need them); callers decide.
 */
export async function listUsableUnits(
  db: DB,
  { fleetId, kind }: { fleetId: string; kind?: UnitKind },
): Promise<UnitDto[]> {
  return listFleetUnits(db, { fleetId, kind, retired: 'exclude' });
}

/** One unit a new inspection may use; undefined when absent, another fleet's, retired or of another kind. */
export async function findUsableUnit(
  db: DB,
  { fleetId, id, kind }: { fleetId: string; id: string; kind?: UnitKind },
): Promise<UnitDto | undefined> {
  let q = db
    .selectFrom('unit')
    .select(unitColumns)
    .where('fleetId', '=', fleetId)
    .where('id', '=', id)
    .where('retiredAt', 'is', null);
  if (kind) q = q.where('kind', '=', kind);
  const row = await q.executeTakeFirst();
  return row ? toUnitDto(row) : undefined;
}

export type UnitFields = {
  unitNumber: string;
  plate: string | null;
  plateJurisdiction: string | null;
  vin: string | null;
  make: string | null;
  model: string | null;
  year: number | null;
  axles: Axle[];
};

export async function insertFleetUnit(db: DB, u: { fleetId: string; kind: UnitKind } & UnitFields): Promise<UnitDto> {
  const row = await db
    .insertInto('unit')
    .values({ ...u, axles: JSON.stringify(u.axles) })
    .returning(unitColumns)
    .executeTakeFirstOrThrow();
  return toUnitDto(row);
}

export async function updateFleetUnitRow(
  db: DB,
  { fleetId, id, set }: { fleetId: string; id: string; set: Partial<UnitFields> & { retiredAt?: Date } },
): Promise<UnitDto | undefined> {
  const { axles, ...rest } = set;
  const row = await db
    .updateTable('unit')
    .set({ ...rest, ...(axles ? { axles: JSON.stringify(axles) } : {}) })
    .where('fleetId', '=', fleetId)
    .where('id', '=', id)
    .returning(unitColumns)
    .executeTakeFirst();
  return row ? toUnitDto(row) : undefined;
}

/** Counts for the admin overview. */
export async function countFleetUnits(db: DB, { fleetId }: { fleetId: string }) {
  const rows = await db
    .selectFrom('unit')
    .select(['kind', 'status', 'retiredAt'])
    .where('fleetId', '=', fleetId)
    .execute();
  const counts = { tractors: 0, trailers: 0, outOfService: 0, retired: 0 };
  for (const r of rows) {
    if (r.retiredAt) {
      counts.retired += 1;
      continue;
    }
    if (r.kind === 'tractor') counts.tractors += 1;
    else counts.trailers += 1;
    if (r.status === 'out_of_service') counts.outOfService += 1;
  }
  return counts;
}
