// The step contract: one thing that happened on the walk, as the phone sends it and the server
// checks it. Shared by both sides, so that a step the phone builds is one the server takes.
import { z } from 'zod';
import { idSchema } from '@/lib/schemas/common';
import { zoneIdSchema } from '@/lib/schemas/grammar';

const text = (max: number, what: string) => z.string().trim().max(max, `${what} is at most ${max} characters.`);
export const deviceTimeSchema = z.iso.datetime({ offset: true, message: 'must be a date and time (ISO 8601)' });

export const stepKinds = ['ok', 'defect', 'measurement', 'not_checked', 'zone_ok', 'visit', 'undo', 'note'] as const;
export type StepKind = (typeof stepKinds)[number];

/** Why an item was not checked: a short list, "other" with a note. */
export const notCheckedReasons = ['not_accessible', 'not_equipped', 'no_gauge', 'other'] as const;
export type NotCheckedReason = (typeof notCheckedReasons)[number];
export const notCheckedReasonLabel: Record<NotCheckedReason, string> = {
  not_accessible: 'not accessible',
  not_equipped: 'not equipped',
  no_gauge: 'gauge not available',
  other: 'other',
};

export const readingSchema = z.object({
  value: z
    .number({ error: 'The reading must be a number.' })
    .finite()
    .min(0, 'A reading cannot be negative.')
    .max(100_000),
  wheelDiameter: z.number().positive().max(30).optional(),
  power: z.boolean().optional(),
  chamber: z.string().max(12).optional(),
});
export type ReadingInput = z.infer<typeof readingSchema>;

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
    reading: readingSchema.nullable().default(null),
    /** Why an item was not checked ("not_checked" steps only). */
    notCheckedReason: z.enum(notCheckedReasons, { error: 'Pick a reason from the list.' }).nullable().default(null),
    note: text(300, 'The note').nullable().default(null),
    deviceAt: deviceTimeSchema,
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
    if (s.kind === 'not_checked') {
      if (!s.item) ctx.addIssue({ code: 'custom', path: ['item'], message: 'Say which item was not checked.' });
      if (!s.notCheckedReason)
        ctx.addIssue({ code: 'custom', path: ['notCheckedReason'], message: 'Pick why the item was not checked.' });
      if (s.notCheckedReason === 'other' && !s.note)
        ctx.addIssue({ code: 'custom', path: ['note'], message: 'Write a short note for “other”.' });
    }
  });
export type RecordStepBody = z.input<typeof recordStepBodySchema>;
export type StepBody = z.output<typeof recordStepBodySchema>;

/** How far ahead of the server's clock a phone's clock may run before its times are refused. */
export const MAX_DEVICE_CLOCK_AHEAD_MS = 5 * 60_000;
/** A step heard this long after the phone recorded it was queued on the phone (offline). */
export const QUEUED_OFFLINE_AFTER_MS = 2 * 60_000;

/** A start older than this is not a walk that waited on the phone: the phone's clock is wrong. */
export const MAX_START_AGE_MS = 24 * 60 * 60_000;

/** A readable refusal for a start time the server cannot believe, or null. */
export function checkStartTime(startedAt: string | Date, now: Date): string | null {
  const ahead = checkDeviceTime(startedAt, { now, startedAt: null, what: 'start' });
  if (ahead) return ahead;
  if (now.getTime() - new Date(startedAt).getTime() > MAX_START_AGE_MS)
    return 'The start time is more than a day ago, so the phone’s clock cannot be right. Set the phone to the network time and start again.';
  return null;
}

/** A readable refusal for a device time the server cannot believe, or null when it is plausible. */
export function checkDeviceTime(
  deviceAt: string | Date,
  { now, startedAt, what }: { now: Date; startedAt: Date | null; what: string },
): string | null {
  const at = new Date(deviceAt).getTime();
  if (at - now.getTime() > MAX_DEVICE_CLOCK_AHEAD_MS)
    return `The phone’s clock is ahead of RigCall’s by ${Math.round((at - now.getTime()) / 60_000)} minutes, so the ${what} time cannot be right. Set the phone to the network time and try again.`;
  if (startedAt && at < startedAt.getTime() - 1000)
    return `The ${what} time is before the inspection started (${startedAt.toISOString()}): check the phone’s clock.`;
  return null;
}

/** The fields of a step that make its meaning: a replay must carry the same ones. */
export function stepFingerprint(s: {
  seq: number;
  zone: string;
  item: string | null;
  kind: string;
  termKey: string | null;
  position: string | null;
  undoesStepId: string | null;
  value: number | null;
  notCheckedReason: string | null;
}): string {
  return JSON.stringify([
    s.seq,
    s.zone,
    s.item,
    s.kind,
    s.termKey,
    s.position,
    s.undoesStepId,
    s.value,
    s.notCheckedReason,
  ]);
}
