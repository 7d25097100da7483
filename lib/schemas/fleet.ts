// A fleet's own settings, as the admin screen and /api/admin/fleet speak them. Universal.
import { z } from 'zod';
import { measureKindSchema } from './grammar';
import { optionalEmailSchema } from './users';

export const ruleProfiles = ['us-federal', 'ca-nsc13'] as const;
export type RuleProfile = (typeof ruleProfiles)[number];

export const ruleProfileLabel: Record<RuleProfile, string> = {
  'us-federal': 'United States: FMCSA rules (49 CFR parts 393 and 396)',
  'ca-nsc13': 'Canada: National Safety Code Standard 13',
};

/** Default cold-inflation targets: common practice for truck tires, no published source. */
export const tirePressureBounds = { min: 50, max: 150 } as const;
export const inspectionMinuteBounds = { min: 0, max: 240 } as const;

const minutes = (what: string) =>
  z
    .int(`Enter the minimum ${what} time as whole minutes.`)
    .min(inspectionMinuteBounds.min, 'Minutes cannot be negative.')
    .max(
      inspectionMinuteBounds.max,
      `Keep the minimum ${what} time at ${inspectionMinuteBounds.max} minutes (4 hours) or less.`,
    );

const psi = (axle: string) =>
  z
    .int(`Enter the ${axle} target as whole psi.`)
    .min(tirePressureBounds.min, `A ${axle} target below ${tirePressureBounds.min} psi is not a truck tire pressure.`)
    .max(
      tirePressureBounds.max,
      `A ${axle} target above ${tirePressureBounds.max} psi is more than truck tires are built for.`,
    );

export const tirePressureTargetsSchema = z.object({
  steer: psi('steer'),
  drive: psi('drive'),
  trailer: psi('trailer'),
});
export type TirePressureTargets = z.infer<typeof tirePressureTargetsSchema>;

/** The readings a pre-trip must carry (a number, or "not checked" with a reason). */
export const requiredReadingsSchema = z.array(measureKindSchema, { error: 'Pick readings from the list.' }).max(20);
export const tirePressureToleranceSchema = z
  .int('Enter the tolerance as whole psi.')
  .min(0, 'The tolerance cannot be negative.')
  .max(10, 'A tolerance above 10 psi would hide a tire that really is low.');

/** Time zones offered in the settings (IANA names); any other IANA zone the runtime knows is accepted too. */
export const fleetTimeZones = [
  'America/St_Johns',
  'America/Halifax',
  'America/Moncton',
  'America/New_York',
  'America/Toronto',
  'America/Chicago',
  'America/Winnipeg',
  'America/Regina',
  'America/Denver',
  'America/Edmonton',
  'America/Phoenix',
  'America/Los_Angeles',
  'America/Vancouver',
  'America/Anchorage',
  'Pacific/Honolulu',
] as const;

/** Whether the runtime knows `name` as an IANA time zone ("America/Chicago"; "UTC"). */
export function isTimeZone(name: string): boolean {
  if (!/^[A-Za-z_]+(?:\/[A-Za-z0-9_+-]+)*$/.test(name)) return false;
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: name });
    return true;
  } catch {
    return false;
  }
}

export const timeZoneSchema = z
  .string('Pick the time zone from the list.')
  .trim()
  .refine(isTimeZone, 'Pick the time zone from the list (a name such as America/Chicago).');

export const updateFleetSettingsBodySchema = z
  .object({
    minPretripMinutes: minutes('pre-trip').optional(),
    minPosttripMinutes: minutes('post-trip').optional(),
    tirePressureTargets: tirePressureTargetsSchema.optional(),
    requiredReadings: requiredReadingsSchema.optional(),
    tirePressureTolerancePsi: tirePressureToleranceSchema.optional(),
    ruleProfile: z.enum(ruleProfiles, { error: 'Pick one of the rule profiles in the list.' }).optional(),
    timezone: timeZoneSchema.optional(),
    maintenanceEmail: optionalEmailSchema,
    supervisorEmail: optionalEmailSchema,
  })
  .refine((b) => Object.values(b).some((v) => v !== undefined), {
    message: 'Nothing to change: send at least one setting.',
  });
export type UpdateFleetSettingsBody = z.input<typeof updateFleetSettingsBodySchema>;

export const fleetSettingsSchema = z.object({
  id: z.string(),
  name: z.string(),
  minPretripMinutes: z.number(),
  minPosttripMinutes: z.number(),
  tirePressureTargets: tirePressureTargetsSchema,
  requiredReadings: requiredReadingsSchema,
  tirePressureTolerancePsi: z.number(),
  ruleProfile: z.enum(ruleProfiles),
  timezone: z.string(),
  maintenanceEmail: z.string().nullable(),
  supervisorEmail: z.string().nullable(),
  updatedAt: z.string(),
});
export type FleetSettings = z.infer<typeof fleetSettingsSchema>;
