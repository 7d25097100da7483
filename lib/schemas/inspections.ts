import { z } from 'zod';
import { deviceTimeSchema as deviceTime } from '@/lib/walk/step';
import { idSchema } from './common';

const text = (max: number, what: string) => z.string().trim().max(max, `${what} is at most ${max} characters.`);
const optionalText = (max: number, what: string) =>
  text(max, what)
    .nullish()
    .transform((v) => (v ? v : null));

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

// The step contract lives with the walk's core, shared by the phone and the server.
export { recordStepBodySchema, stepKinds, type RecordStepBody, type StepKind } from '@/lib/walk/step';

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
