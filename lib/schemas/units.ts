// Tractors and trailers, as the admin screens and /api/admin/units speak them. Universal.
import { z } from 'zod';

export const unitKinds = ['tractor', 'trailer'] as const;
export type UnitKind = (typeof unitKinds)[number];

export const axlePositions = ['steer', 'drive', 'trailer'] as const;
export type AxlePosition = (typeof axlePositions)[number];

/** Clamp-type air brake chamber types, as stamped on the chamber (L = long stroke). */
export const brakeChamberTypes = [
  '6',
  '9',
  '12',
  '12L',
  '16',
  '16L',
  '20',
  '20L',
  '24',
  '24L',
  '24L3',
  '30',
  '30L',
  '36',
  'DD3-30',
] as const;
export type BrakeChamberType = (typeof brakeChamberTypes)[number];

/** Bounds for a cold-inflation target: common practice for truck tires, no published source. */
export const coldPsiBounds = { min: 50, max: 150 } as const;

/** US states and DC, then Canadian provinces and territories. */
export const plateJurisdictions = [
  'AL',
  'AK',
  'AZ',
  'AR',
  'CA',
  'CO',
  'CT',
  'DE',
  'DC',
  'FL',
  'GA',
  'HI',
  'ID',
  'IL',
  'IN',
  'IA',
  'KS',
  'KY',
  'LA',
  'ME',
  'MD',
  'MA',
  'MI',
  'MN',
  'MS',
  'MO',
  'MT',
  'NE',
  'NV',
  'NH',
  'NJ',
  'NM',
  'NY',
  'NC',
  'ND',
  'OH',
  'OK',
  'OR',
  'PA',
  'RI',
  'SC',
  'SD',
  'TN',
  'TX',
  'UT',
  'VT',
  'VA',
  'WA',
  'WV',
  'WI',
  'WY',
  'AB',
  'BC',
  'MB',
  'NB',
  'NL',
  'NS',
  'NT',
  'NU',
  'ON',
  'PE',
  'QC',
  'SK',
  'YT',
] as const;

const maxYear = new Date().getFullYear() + 2;

// VIN check digit: transliteration and position weights of 49 CFR 565.15.
const vinValue: Record<string, number> = {
  A: 1,
  B: 2,
  C: 3,
  D: 4,
  E: 5,
  F: 6,
  G: 7,
  H: 8,
  J: 1,
  K: 2,
  L: 3,
  M: 4,
  N: 5,
  P: 7,
  R: 9,
  S: 2,
  T: 3,
  U: 4,
  V: 5,
  W: 6,
  X: 7,
  Y: 8,
  Z: 9,
};
const vinWeights = [8, 7, 6, 5, 4, 3, 2, 10, 0, 9, 8, 7, 6, 5, 4, 3, 2];

/** The check digit (9th character) a 17-character VIN should carry: '0'–'9' or 'X'. */
export function computeVinCheckDigit(vin: string): string {
  let sum = 0;
  for (let i = 0; i < 17; i += 1) {
    const c = vin[i] ?? '0';
    const v = /\d/.test(c) ? Number(c) : (vinValue[c] ?? 0);
    sum += v * (vinWeights[i] ?? 0);
  }
  const r = sum % 11;
  return r === 10 ? 'X' : String(r);
}

/** What is wrong with a VIN, in words, or null when it is well formed. */
export function findVinProblem(vin: string): string | null {
  if (vin.length !== 17) return `A VIN has 17 characters; this one has ${vin.length}.`;
  if (/[IOQ]/.test(vin))
    return 'A VIN never uses the letters I, O or Q (they read like 1 and 0). Check those characters.';
  if (!/^[A-Z0-9]{17}$/.test(vin)) return 'A VIN is letters and digits only.';
  if (computeVinCheckDigit(vin) !== vin[8])
    return 'The 9th character (the check digit) does not fit the rest of this VIN. Look for a mistyped character.';
  return null;
}

const vinSchema = z
  .string('Enter the VIN as text.')
  .transform((v) => v.replace(/[\s-]/g, '').toUpperCase())
  .superRefine((v, ctx) => {
    if (v === '') return;
    const problem = findVinProblem(v);
    if (problem) ctx.addIssue({ code: 'custom', message: problem });
  })
  .transform((v) => (v === '' ? null : v));

/** Optional free text: trimmed, an empty field means "none". */
const optionalText = (max: number, what: string) =>
  z
    .string(`Enter the ${what} as text.`)
    .trim()
    .max(max, `Keep the ${what} under ${max + 1} characters.`)
    .transform((v) => (v === '' ? null : v))
    .nullable()
    .optional();

const unitNumberSchema = z
  .string('Enter the unit number.')
  .trim()
  .toUpperCase()
  .min(1, 'Enter the unit number painted on the unit.')
  .max(20, 'Keep the unit number to 20 characters.')
  .regex(/^[A-Z0-9][A-Z0-9 -]*$/, 'Use letters, digits, spaces and dashes for the unit number.');

const plateSchema = z
  .string('Enter the plate as text.')
  .trim()
  .toUpperCase()
  .max(12, 'A plate is at most 12 characters.')
  .regex(/^[A-Z0-9 -]*$/, 'Use letters, digits, spaces and dashes for the plate.')
  .transform((v) => (v === '' ? null : v))
  .nullable()
  .optional();

const jurisdictionSchema = z
  .union([
    z.literal('').transform(() => null),
    z.null(),
    z
      .string()
      .trim()
      .toUpperCase()
      .pipe(
        z.enum(plateJurisdictions, {
          error: 'Pick the state or province that issued the plate (two letters, e.g. IA or ON).',
        }),
      ),
  ])
  .optional();

const yearSchema = z
  .union([
    z.null(),
    z
      .int('Enter the model year as a whole number, like 2021.')
      .min(1950, 'Enter a model year from 1950 on.')
      .max(maxYear, `Enter a model year up to ${maxYear}.`),
  ])
  .optional();

export const axleSchema = z.object({
  position: z.enum(axlePositions, { error: 'Say whether the axle is a steer, drive or trailer axle.' }),
  tires: z
    .array(
      z
        .string()
        .trim()
        .toUpperCase()
        .regex(/^[A-Z0-9]{1,6}$/, 'Name each tire position with up to 6 letters or digits.'),
    )
    .min(2, 'An axle carries 2 tires (singles) or 4 (duals).')
    .max(4, 'An axle carries 2 tires (singles) or 4 (duals).')
    .refine((t) => t.length !== 3, 'An axle carries 2 tires (singles) or 4 (duals).')
    .refine((t) => new Set(t).size === t.length, 'Each tire on an axle needs its own position name.'),
  coldPsi: z
    .int('Enter the cold-inflation target as whole psi.')
    .min(coldPsiBounds.min, `A cold-inflation target is at least ${coldPsiBounds.min} psi.`)
    .max(coldPsiBounds.max, `A cold-inflation target is at most ${coldPsiBounds.max} psi.`),
  chamber: z.enum(brakeChamberTypes, {
    error: `Pick the brake chamber type stamped on the chamber (${brakeChamberTypes.join(', ')}).`,
  }),
});
export type Axle = z.infer<typeof axleSchema>;

const axlesSchema = z
  .array(axleSchema, 'Give the axles as a list.')
  .min(1, 'Add at least one axle.')
  .max(6, 'A unit has at most 6 axles here.');

/** Problems between a unit's kind and its axle layout, keyed by field path. */
export function findAxleProblems(kind: UnitKind, axles: readonly Axle[]): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  const add = (key: string, message: string) => (fields[key] ??= []).push(message);
  axles.forEach((a, i) => {
    if (kind === 'trailer' && a.position !== 'trailer') add(`axles.${i}.position`, 'A trailer has trailer axles only.');
    if (kind === 'tractor' && a.position === 'trailer')
      add(`axles.${i}.position`, 'A tractor has steer and drive axles, not trailer axles.');
  });
  if (kind === 'tractor' && axles.length > 0 && axles[0]?.position !== 'steer')
    add('axles.0.position', 'The first axle of a tractor is its steer axle.');
  return fields;
}

const unitFields = {
  unitNumber: unitNumberSchema,
  plate: plateSchema,
  plateJurisdiction: jurisdictionSchema,
  vin: vinSchema.nullable().optional(),
  make: optionalText(40, 'make'),
  model: optionalText(60, 'model'),
  year: yearSchema,
  axles: axlesSchema,
};

function checkPlate(b: { plate?: string | null; plateJurisdiction?: string | null }, ctx: z.RefinementCtx) {
  if (b.plate && b.plateJurisdiction === null) {
    ctx.addIssue({
      code: 'custom',
      path: ['plateJurisdiction'],
      message: 'Pick the state or province that issued this plate.',
    });
  }
}

export const createUnitBodySchema = z
  .object({ kind: z.enum(unitKinds, { error: 'Say whether this is a tractor or a trailer.' }), ...unitFields })
  .superRefine((b, ctx) => {
    checkPlate({ plate: b.plate, plateJurisdiction: b.plateJurisdiction ?? null }, ctx);
    for (const [path, messages] of Object.entries(findAxleProblems(b.kind, b.axles))) {
      for (const message of messages)
        ctx.addIssue({ code: 'custom', path: path.split('.').map((p) => (/^\d+$/.test(p) ? Number(p) : p)), message });
    }
  });
export type CreateUnitBody = z.input<typeof createUnitBodySchema>;

export const updateUnitBodySchema = z
  .object({
    unitNumber: unitFields.unitNumber.optional(),
    plate: unitFields.plate,
    plateJurisdiction: unitFields.plateJurisdiction,
    vin: unitFields.vin,
    make: unitFields.make,
    model: unitFields.model,
    year: unitFields.year,
    axles: unitFields.axles.optional(),
  })
  .refine((b) => Object.values(b).some((v) => v !== undefined), {
    message: 'Nothing to change: send at least one field.',
  })
  .superRefine((b, ctx) => {
    if (b.plate !== undefined && b.plateJurisdiction !== undefined)
      checkPlate({ plate: b.plate, plateJurisdiction: b.plateJurisdiction }, ctx);
  });
export type UpdateUnitBody = z.input<typeof updateUnitBodySchema>;

export const unitParamsSchema = z.object({ id: z.uuid('That is not a unit id.') });

export const listUnitsQuerySchema = z.object({
  kind: z.enum(unitKinds, { error: 'kind is tractor or trailer.' }).optional(),
  retired: z.enum(['include', 'exclude', 'only'], { error: 'retired is include, exclude or only.' }).default('include'),
});
export type ListUnitsQuery = z.input<typeof listUnitsQuerySchema>;

export const unitSchema = z.object({
  id: z.string(),
  kind: z.enum(unitKinds),
  unitNumber: z.string(),
  plate: z.string().nullable(),
  plateJurisdiction: z.string().nullable(),
  vin: z.string().nullable(),
  make: z.string().nullable(),
  model: z.string().nullable(),
  year: z.number().nullable(),
  axles: z.array(axleSchema),
  status: z.enum(['in_service', 'out_of_service']),
  retiredAt: z.string().nullable(),
  updatedAt: z.string(),
});
export type UnitDto = z.infer<typeof unitSchema>;

export const retireUnitBodySchema = z.object({
  reason: z.string('Give the reason as text.').trim().max(200, 'Keep the reason under 200 characters.').optional(),
});
export type RetireUnitBody = z.input<typeof retireUnitBodySchema>;
