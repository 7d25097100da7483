import { z } from 'zod';

/** Zod schemas of the data files in grammars/. Shared by the matcher, the seed and the trainer export. */

const idSchema = z.string().regex(/^[a-z0-9]+(?:_[a-z0-9]+)*$/, 'ids are snake_case');
const phraseSchema = z.string().trim().min(1).max(80);
const versionSchema = z.number().int().positive();

export const severitySchema = z.enum(['minor', 'major']);
export type Severity = z.infer<typeof severitySchema>;

export const zoneIdSchema = z.enum([
  'front',
  'engine_bay',
  'driver_side_tractor',
  'coupling',
  'driver_side_trailer',
  'rear',
  'passenger_side_trailer',
  'passenger_side_tractor',
  'in_cab',
  'air_brake_tests',
]);
export type ZoneId = z.infer<typeof zoneIdSchema>;

export const measureKindSchema = z.enum([
  'tread_depth',
  'tire_pressure',
  'pushrod_stroke',
  'low_air_warning',
  'air_buildup',
  'governor_cutout',
  'governor_cutin',
  'air_leak',
  'steering_lash',
  'fifth_wheel_movement',
  'ground_clearance',
]);
export type MeasureKind = z.infer<typeof measureKindSchema>;

export const unitSchema = z.enum(['32nds', 'psi', 's', 'min', 'in', 'count']);
export type Unit = z.infer<typeof unitSchema>;

export const vocabularySystemSchema = z.object({
  id: idSchema,
  name: z.string().min(1),
  nscPart: z.string().optional(),
});

export const vocabularyConditionSchema = z.object({
  id: idSchema,
  name: z.string().min(1),
  phrases: z.array(phraseSchema).min(1),
});

export const vocabularyDefectSchema = z.object({
  condition: idSchema,
  severity: z.object({ us: severitySchema, ca: severitySchema }),
  source: z.string().min(1),
});

export const vocabularyComponentSchema = z.object({
  id: idSchema,
  system: idSchema,
  name: z.string().min(1),
  phrases: z.array(phraseSchema).min(1),
  zones: z.array(zoneIdSchema).min(1),
  defects: z.array(vocabularyDefectSchema).min(1),
});

export const vocabularySchema = z.object({
  version: versionSchema,
  systems: z.array(vocabularySystemSchema).min(1),
  conditions: z.array(vocabularyConditionSchema).min(1),
  components: z.array(vocabularyComponentSchema).min(1),
});
export type Vocabulary = z.infer<typeof vocabularySchema>;
export type VocabularyComponent = z.infer<typeof vocabularyComponentSchema>;
export type VocabularyCondition = z.infer<typeof vocabularyConditionSchema>;

export const commandIdSchema = z.enum([
  'next',
  'previous',
  'repeat',
  'ok',
  'undo',
  'photo',
  'pause',
  'finish',
  'yes',
  'no',
]);
export type CommandId = z.infer<typeof commandIdSchema>;

export const commandsSchema = z.object({
  version: versionSchema,
  commands: z.array(z.object({ id: commandIdSchema, phrases: z.array(phraseSchema).min(1) })).min(1),
  fillers: z.array(z.string().regex(/^[a-z']+$/, 'fillers are single lower-case words')),
  contractions: z.record(z.string(), z.string()),
  replacements: z.record(z.string(), z.string()),
});
export type Commands = z.infer<typeof commandsSchema>;

export const positionsSchema = z.object({
  version: versionSchema,
  positions: z.array(z.object({ id: idSchema, group: idSchema, phrases: z.array(phraseSchema).min(1) })).min(1),
  axleWords: z.array(z.string().min(1)),
  ordinals: z.record(z.string(), z.number().int().positive()),
});
export type Positions = z.infer<typeof positionsSchema>;

export const numbersSchema = z.object({
  version: versionSchema,
  units: z.record(z.string(), z.number().int().min(0).max(19)),
  tens: z.record(z.string(), z.number().int().min(20).max(90)),
  scales: z.record(z.string(), z.number().int().positive()),
  fractions: z.record(z.string(), z.number().positive().lt(1)),
  ambiguousUnitWords: z.array(z.string()),
  unitWords: z.record(unitSchema, z.array(phraseSchema)),
  measureWords: z.record(measureKindSchema, z.array(phraseSchema)),
  measureUnits: z.record(measureKindSchema, unitSchema),
});
export type NumberWords = z.infer<typeof numbersSchema>;

export const vehicleConfigurationSchema = z.enum(['tractor_trailer', 'bobtail']);
export type VehicleConfiguration = z.infer<typeof vehicleConfigurationSchema>;

export const zoneItemSchema = z.object({
  id: z.string().regex(/^[a-z0-9_]+\.[a-z0-9_]+$/, 'item ids are zone.item'),
  label: z.string().min(1),
  component: idSchema,
  measure: measureKindSchema.optional(),
  configurations: z.array(vehicleConfigurationSchema).min(1),
});
export type ZoneItem = z.infer<typeof zoneItemSchema>;

export const zonesSchema = z.object({
  version: versionSchema,
  configurations: z.array(z.object({ id: vehicleConfigurationSchema, name: z.string().min(1) })).min(1),
  zones: z
    .array(
      z.object({
        id: zoneIdSchema,
        name: z.string().min(1),
        phrases: z.array(phraseSchema).min(1),
        configurations: z.array(vehicleConfigurationSchema).min(1),
        items: z.array(zoneItemSchema).min(1),
      }),
    )
    .min(1),
});
export type Zones = z.infer<typeof zonesSchema>;

/** All four data files the matcher needs, as one object. */
export const grammarSchema = z.object({
  vocabulary: vocabularySchema,
  commands: commandsSchema,
  positions: positionsSchema,
  numbers: numbersSchema,
  zones: zonesSchema,
});
export type Grammar = z.infer<typeof grammarSchema>;
