import { z } from 'zod';
import { idSchema } from './common';

const emptyToUndefined = (v: unknown) => (v === '' || v === null ? undefined : v);

export const listDefectsQuerySchema = z.object({
  status: z.preprocess(emptyToUndefined, z.enum(['open', 'closed', 'all']).default('open')),
  severity: z.preprocess(emptyToUndefined, z.enum(['minor', 'major']).optional()),
  unitId: z.preprocess(emptyToUndefined, idSchema.optional()),
});
export type ListDefectsQuery = z.infer<typeof listDefectsQuerySchema>;

/** The carrier's certification on the report, 49 CFR 396.11(a)(3): repaired, or repair unnecessary. */
export const certifyRepairBodySchema = z
  .object({
    outcome: z.enum(['repaired', 'no_repair_needed'], { message: 'choose repaired or no repair needed' }),
    work: z.string().trim().max(4000).default(''),
    parts: z.string().trim().max(2000).default(''),
    notes: z.string().trim().max(4000).default(''),
    certifiedName: z.string().trim().min(2, 'type your full name to sign').max(120),
    confirm: z.literal(true, { message: 'tick the certification statement to sign it' }),
    /** Other open defects of the same unit certified with this one: a work order signed once. */
    togetherWith: z.array(idSchema).max(50, 'at most 50 defects in one work order').optional(),
  })
  .refine((b) => b.outcome === 'no_repair_needed' || b.work.length >= 3, {
    path: ['work'],
    message: 'describe the work done',
  })
  .refine((b) => b.outcome === 'repaired' || b.notes.length >= 3 || b.work.length >= 3, {
    path: ['notes'],
    message: 'say why no repair is needed (what you checked)',
  });
export type CertifyRepairBody = z.infer<typeof certifyRepairBodySchema>;

export const repairCertificationStatement = {
  repaired: 'I certify that the defect listed was repaired and the unit is safe to operate in this respect.',
  no_repair_needed: 'I certify that repair of the defect listed is unnecessary for the safe operation of the unit.',
} as const;

export type DefectQueueRow = {
  id: string;
  unitId: string;
  unitNumber: string;
  unitKind: 'tractor' | 'trailer';
  unitStatus: 'in_service' | 'out_of_service';
  zone: string;
  component: string;
  condition: string;
  position: string | null;
  severity: 'minor' | 'major';
  description: string;
  status: 'open' | 'repaired' | 'no_repair_needed';
  reportedAt: string;
  inspectionId: string;
  driverName: string;
  certifiedName: string | null;
  certifiedAt: string | null;
  photoCount: number;
};

/** One unit's defects in the mechanic's queue. */
export type DefectQueueGroup = {
  unitId: string;
  unitNumber: string;
  unitKind: 'tractor' | 'trailer';
  unitStatus: 'in_service' | 'out_of_service';
  major: DefectQueueRow[];
  minor: DefectQueueRow[];
};

/** One defect with its finding, repair and photos, as GET /api/defects/[id] answers. */
export type DefectDetail = {
  id: string;
  /** The fleet's IANA time zone, for every time shown with the defect. */
  timezone: string;
  /** The unit's other open defects, to certify with this one as a work order. */
  unitOpenDefects: { id: string; severity: 'minor' | 'major'; description: string }[];
  unitId: string;
  unitNumber: string;
  unitKind: 'tractor' | 'trailer';
  unitStatus: 'in_service' | 'out_of_service';
  unitMake: string | null;
  unitModel: string | null;
  zone: string;
  component: string;
  condition: string;
  position: string | null;
  severity: 'minor' | 'major';
  description: string;
  status: 'open' | 'repaired' | 'no_repair_needed';
  reportedAt: string;
  inspectionId: string;
  inspectionKind: 'pre_trip' | 'post_trip';
  inspectedAt: string;
  odometer: number | null;
  location: string | null;
  driverName: string;
  finding: {
    heard: string | null;
    score: number | null;
    resolution: 'auto' | 'confirmed' | 'corrected' | null;
    measurementKind: string | null;
    value: number | null;
    unit: string | null;
    limitText: string | null;
    source: string | null;
    verdict: 'pass' | 'fail' | null;
  };
  repair: { work: string | null; parts: string | null; notes: string | null };
  certification: { name: string | null; at: string; text: string | null } | null;
  /** `takenBy`: the driver's photo of the finding, or the mechanic's of the repair. */
  photos: { id: string; contentType: string; url: string; takenBy: 'driver' | 'mechanic'; takenAt: string }[];
};
