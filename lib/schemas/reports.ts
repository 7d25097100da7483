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
