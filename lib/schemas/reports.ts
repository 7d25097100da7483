import { z } from 'zod';
import { idSchema } from './common';

// Query strings arrive as text: every filter is optional, empty means "any".
const emptyToUndefined = (v: unknown) => (v === '' || v === null ? undefined : v);
const optionalId = z.preprocess(emptyToUndefined, idSchema.optional());
const optionalDate = z.preprocess(emptyToUndefined, z.iso.date({ message: 'must be a date (YYYY-MM-DD)' }).optional());
const optionalFlag = z.preprocess(emptyToUndefined, z.enum(['yes', 'no']).optional());

export const reportSortKeys = ['startedAt', 'durationS', 'driverName', 'tractorNumber', 'kind', 'defects'] as const;
export type ReportSortKey = (typeof reportSortKeys)[number];

export const reportFiltersSchema = z.object({
  from: optionalDate,
  to: optionalDate,
  driverId: optionalId,
  unitId: optionalId,
  kind: z.preprocess(emptyToUndefined, z.enum(['pre_trip', 'post_trip']).optional()),
  hasDefects: optionalFlag,
  short: optionalFlag,
  /** review state of a submitted report, or drafts still being walked */
  status: z.preprocess(emptyToUndefined, z.enum(['unreviewed', 'reviewed', 'draft']).optional()),
});
export type ReportFilters = z.infer<typeof reportFiltersSchema>;

export const listReportsQuerySchema = reportFiltersSchema.extend({
  page: z.preprocess(emptyToUndefined, z.coerce.number().int().min(1).max(100_000).default(1)),
  pageSize: z.preprocess(emptyToUndefined, z.coerce.number().int().min(5).max(200).default(25)),
  sort: z.preprocess(emptyToUndefined, z.enum(reportSortKeys).default('startedAt')),
  dir: z.preprocess(emptyToUndefined, z.enum(['asc', 'desc']).default('desc')),
});
export type ListReportsQuery = z.infer<typeof listReportsQuerySchema>;

export const exportReportsQuerySchema = listReportsQuerySchema.omit({ page: true, pageSize: true });
export type ExportReportsQuery = z.infer<typeof exportReportsQuerySchema>;

export type ReportRow = {
  id: string;
  kind: 'pre_trip' | 'post_trip';
  status: 'draft' | 'submitted';
  startedAt: string;
  finishedAt: string | null;
  durationS: number | null;
  minimumS: number;
  short: boolean;
  driverId: string;
  driverName: string;
  tractorId: string;
  tractorNumber: string;
  trailerId: string | null;
  trailerNumber: string | null;
  odometer: number | null;
  location: string | null;
  majorCount: number;
  minorCount: number;
  openCount: number;
  reviewedAt: string | null;
};

export type ReportPage = { rows: ReportRow[]; total: number; page: number; pageSize: number; pageCount: number };

export const reviewReportBodySchema = z.object({
  note: z.string().trim().max(2000, 'keep the note under 2,000 characters').default(''),
});
export type ReviewReportBody = z.infer<typeof reviewReportBodySchema>;

export const pendingAcknowledgementsQuerySchema = z.object({
  units: z
    .string()
    .transform((s) =>
      s
        .split(',')
        .map((x) => x.trim())
        .filter(Boolean),
    )
    .pipe(z.array(idSchema).min(1, 'name at least one unit').max(10)),
});

/** A photo of a report, with the address the screens load it from (null in the PDF). */
export type ReportPhoto = {
  id: string;
  stepId: string | null;
  defectId: string | null;
  contentType: string;
  url: string | null;
  objectKey: string;
};

/** One recorded step of a report, as the transcript shows it. */
export type ReportStep = {
  id: string;
  seq: number;
  zone: string;
  item: string | null;
  kind: 'ok' | 'defect' | 'measurement' | 'not_checked' | 'zone_ok' | 'visit' | 'undo' | 'note' | 'photo';
  heard: string | null;
  alternatives: string[];
  inputMode: 'voice' | 'tap' | 'typed';
  termKey: string | null;
  component: string | null;
  condition: string | null;
  position: string | null;
  score: number | null;
  resolution: 'auto' | 'confirmed' | 'corrected' | null;
  measurementKind: string | null;
  value: number | null;
  unit: string | null;
  verdict: 'pass' | 'fail' | null;
  severity: 'minor' | 'major' | null;
  limitText: string | null;
  source: string | null;
  deviceAt: string;
  photos: ReportPhoto[];
};

/** The stored content hash against the one recomputed from the rows. */
export type ReportHashCheck = {
  state: 'match' | 'mismatch' | 'unsigned';
  stored: string | null;
  computed: string | null;
};

type ReportUnit = {
  number: string | null;
  plate: string | null;
  plateJurisdiction: string | null;
  make: string | null;
  model: string | null;
  status: 'in_service' | 'out_of_service' | null;
};

/** A report with everything the supervisor's detail screen and the PDF show (GET /api/reports/[id]). */
export type ReportDetail = {
  id: string;
  kind: 'pre_trip' | 'post_trip';
  status: 'draft' | 'submitted';
  driverName: string;
  tractor: ReportUnit & { id: string; number: string; vin: string | null };
  trailer: (ReportUnit & { id: string }) | null;
  odometer: number | null;
  location: string | null;
  billOfLading: string | null;
  sealNumber: string | null;
  ruleProfile: string;
  vocabulary: { id: string | null; label: string | null };
  startedAt: string;
  finishedAt: string | null;
  durationS: number | null;
  duration: {
    minutes: number;
    minimumMinutes: number;
    short: boolean;
    source: string;
    clock: 'server' | 'device';
  } | null;
  certificationText: string | null;
  signatureName: string | null;
  signedAt: string | null;
  hash: ReportHashCheck;
  review: { reviewedAt: string | null; reviewerName: string | null; note: string | null };
  zones: { id: string; name: string; seconds: number | null; steps: ReportStep[] }[];
  skippedZones: { id: string; name: string }[];
  lowConfidenceUnconfirmed: number;
  defects: {
    id: string;
    stepId: string;
    unitId: string;
    unitNumber: string;
    zone: string;
    component: string;
    condition: string;
    position: string | null;
    severity: 'minor' | 'major';
    description: string;
    status: 'open' | 'repaired' | 'no_repair_needed';
    repairWork: string | null;
    repairParts: string | null;
    repairNotes: string | null;
    certifiedName: string | null;
    certificationText: string | null;
    certifiedAt: string | null;
    photos: ReportPhoto[];
  }[];
  acknowledgements: {
    id: string;
    unitId: string;
    unitNumber: string;
    signatureName: string;
    statement: string;
    acknowledgedAt: string;
  }[];
  photoCount: number;
  fleetName: string;
  timezone: string;
};
