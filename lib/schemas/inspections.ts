import { z } from 'zod';
import { zoneIdSchema } from './grammar';
import { idSchema } from './common';

const text = (max: number, what: string) => z.string().trim().max(max, `${what} is at most ${max} characters.`);
const optionalText = (max: number, what: string) =>
  text(max, what)
    .nullish()
    .transform((v) => (v ? v : null));
const deviceTime = z.iso.datetime({ offset: true, message: 'must be a date and time (ISO 8601)' });

export const inspectionKinds = ['pre_trip', 'post_trip'] as const;
export type InspectionKind = (typeof inspectionKinds)[number];

export const startInspectionBodySchema = z.object({
  id: idSchema,
  kind: z.enum(inspectionKinds, { error: 'Choose pre-trip or post-trip.' }),
  tractorId: idSchema,
  trailerId: idSchema.nullable(),
  odometer: z
    .int('Enter the odometer in whole miles or kilometres.')
    .min(0, 'The odometer cannot be negative.')
    .max(9_999_999, 'That odometer reading is too large.')
    .nullable(),
  location: optionalText(200, 'The location'),
  billOfLading: optionalText(60, 'The bill of lading number'),
  sealNumber: optionalText(40, 'The seal number'),
  startedAt: deviceTime,
});
export type StartInspectionBody = z.input<typeof startInspectionBodySchema>;

export const stepKinds = ['ok', 'defect', 'measurement', 'zone_ok', 'visit', 'undo', 'note'] as const;
export type StepKind = (typeof stepKinds)[number];

/** One thing that happened on the walk, sent as it happens (and again, harmlessly, after a reconnect). */
export const recordStepBodySchema = z
  .object({
    id: idSchema,
    seq: z.int().min(0).max(100_000),
    zone: zoneIdSchema,
    item: text(80, 'The item').nullable().default(null),
    kind: z.enum(stepKinds),
    heard: text(500, 'What was heard').nullable().default(null),
    alternatives: z.array(text(500, 'An alternative')).max(10).default([]),
    inputMode: z.enum(['voice', 'tap', 'typed']),
    termKey: z
      .string()
      .regex(/^[a-z0-9_]+:[a-z0-9_]+$/, 'must be component:condition')
      .nullable()
      .default(null),
    position: text(40, 'The position').nullable().default(null),
    score: z.number().min(0).max(1).nullable().default(null),
    resolution: z.enum(['auto', 'confirmed', 'corrected']).nullable().default(null),
    undoesStepId: idSchema.nullable().default(null),
    /** The number read off the gauge, and any extra fields the check needs. */
    reading: z
      .object({
        value: z
          .number({ error: 'The reading must be a number.' })
          .finite()
          .min(0, 'A reading cannot be negative.')
          .max(100_000),
        wheelDiameter: z.number().positive().max(30).optional(),
        power: z.boolean().optional(),
        chamber: z.string().max(12).optional(),
      })
      .nullable()
      .default(null),
    deviceAt: deviceTime,
  })
  .superRefine((s, ctx) => {
    if (s.kind === 'defect' && !s.termKey)
      ctx.addIssue({
        code: 'custom',
        path: ['termKey'],
        message: 'A defect needs the component and condition it is about.',
      });
    if (s.kind === 'measurement' && (!s.reading || !s.item))
      ctx.addIssue({
        code: 'custom',
        path: ['reading'],
        message: 'A measurement needs the checklist item and the reading.',
      });
    if (s.kind === 'undo' && !s.undoesStepId)
      ctx.addIssue({ code: 'custom', path: ['undoesStepId'], message: 'An undo names the step it takes back.' });
    if (s.kind === 'ok' && !s.item)
      ctx.addIssue({ code: 'custom', path: ['item'], message: 'An OK names the checklist item.' });
  });
export type RecordStepBody = z.input<typeof recordStepBodySchema>;

export const finishInspectionBodySchema = z.object({
  signatureName: text(120, 'The name').min(2, 'Type your full name to sign.'),
  certify: z.literal(true, { error: 'Tick the certification to sign the report.' }),
  finishedAt: deviceTime,
  /** Every step the phone recorded: signing is refused while the server lacks one of them. */
  stepIds: z.array(idSchema).max(5000, 'A walk has at most 5000 steps.').optional(),
});
export type FinishInspectionBody = z.input<typeof finishInspectionBodySchema>;

export const acknowledgeBodySchema = z.object({
  id: idSchema,
  unitId: idSchema,
  reviewedInspectionId: idSchema,
  signatureName: text(120, 'The name').min(2, 'Type your full name to sign.'),
});
export type AcknowledgeBody = z.input<typeof acknowledgeBodySchema>;

export const photoParamsSchema = z.object({ id: idSchema, photoId: idSchema });
export const photoQuerySchema = z.object({ stepId: idSchema.optional() });
