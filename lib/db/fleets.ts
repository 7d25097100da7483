import 'server-only';
import {
  ruleProfiles,
  requiredReadingsSchema,
  tirePressureTargetsSchema,
  type FleetSettings,
  type RuleProfile,
  type TirePressureTargets,
} from '@/lib/schemas/fleet';
import { DEFAULT_REQUIRED_READINGS } from '@/lib/walk/zones';
import type { DB } from './index';

export async function findFleet(db: DB, { fleetId }: { fleetId: string }) {
  return db
    .selectFrom('fleet')
    .select(['id', 'name', 'timezone', 'ruleProfile', 'minPretripMinutes', 'minPosttripMinutes', 'tirePressureTargets'])
    .where('id', '=', fleetId)
    .executeTakeFirst();
}

/** The fleet's name, for the top of each role's home screen. */
export async function findFleetName(db: DB, { fleetId }: { fleetId: string }): Promise<string | null> {
  const row = await db.selectFrom('fleet').select('name').where('id', '=', fleetId).executeTakeFirst();
  return row?.name ?? null;
}

// ---- admin: the fleet's own settings

const settingsColumns = [
  'id',
  'name',
  'minPretripMinutes',
  'minPosttripMinutes',
  'tirePressureTargets',
  'ruleProfile',
  'timezone',
  'maintenanceEmail',
  'supervisorEmail',
  'requiredReadings',
  'tirePressureTolerancePsi',
  'updatedAt',
] as const;

type SettingsRow = {
  id: string;
  name: string;
  minPretripMinutes: number;
  minPosttripMinutes: number;
  tirePressureTargets: unknown;
  ruleProfile: string;
  timezone: string;
  maintenanceEmail: string | null;
  supervisorEmail: string | null;
  requiredReadings: unknown;
  tirePressureTolerancePsi: number;
  updatedAt: Date;
};

const fallbackTargets: TirePressureTargets = { steer: 110, drive: 100, trailer: 100 };

function toFleetSettings(row: SettingsRow): FleetSettings {
  const targets = tirePressureTargetsSchema.safeParse(row.tirePressureTargets);
  return {
    ...row,
    tirePressureTargets: targets.success ? targets.data : fallbackTargets,
    requiredReadings: requiredReadingsSchema.safeParse(row.requiredReadings).data ?? [...DEFAULT_REQUIRED_READINGS],
    ruleProfile: (ruleProfiles as readonly string[]).includes(row.ruleProfile)
      ? (row.ruleProfile as RuleProfile)
      : 'us-federal',
    updatedAt: row.updatedAt.toISOString(),
  };
}

export async function findFleetSettings(db: DB, { fleetId }: { fleetId: string }): Promise<FleetSettings | undefined> {
  const row = await db.selectFrom('fleet').select(settingsColumns).where('id', '=', fleetId).executeTakeFirst();
  return row ? toFleetSettings(row) : undefined;
}

export type FleetSettingsChange = Partial<Omit<FleetSettings, 'id' | 'name' | 'updatedAt'>>;

export async function updateFleetSettingsRow(
  db: DB,
  { fleetId, set }: { fleetId: string; set: FleetSettingsChange },
): Promise<FleetSettings | undefined> {
  const { tirePressureTargets, requiredReadings, ...rest } = set;
  const row = await db
    .updateTable('fleet')
    .set({
      ...rest,
      ...(tirePressureTargets ? { tirePressureTargets: JSON.stringify(tirePressureTargets) } : {}),
      ...(requiredReadings ? { requiredReadings: JSON.stringify(requiredReadings) } : {}),
    })
    .where('id', '=', fleetId)
    .returning(settingsColumns)
    .executeTakeFirst();
  return row ? toFleetSettings(row) : undefined;
}
