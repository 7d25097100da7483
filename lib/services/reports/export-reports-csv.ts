import 'server-only';
import { getDb } from '@/lib/db';
import { isoWithOffset } from '@/lib/format/iso-with-offset';
import { iterateReportRows } from '@/lib/db/reports';
import type { ExportReportsQuery, ReportRow } from '@/lib/schemas/reports';
import { getFleetMinimumsOrThrow } from './list-reports';

export const reportCsvColumns = [
  ['report_id', (r) => r.id],
  ['type', (r) => (r.kind === 'pre_trip' ? 'pre-trip' : 'post-trip')],
  ['status', (r) => (r.status === 'draft' ? 'draft' : r.reviewedAt ? 'reviewed' : 'submitted')],
  ['started_at', (r, tz) => isoWithOffset(r.startedAt, tz)],
  ['finished_at', (r, tz) => (r.finishedAt ? isoWithOffset(r.finishedAt, tz) : '')],
  ['duration_min', (r) => (r.durationS === null ? '' : (r.durationS / 60).toFixed(1))],
  ['minimum_min', (r) => String(r.minimumS / 60)],
  ['short', (r) => (r.short ? 'yes' : 'no')],
  ['driver', (r) => r.driverName],
  ['tractor', (r) => r.tractorNumber],
  ['trailer', (r) => r.trailerNumber ?? ''],
  ['odometer', (r) => (r.odometer === null ? '' : String(r.odometer))],
  ['location', (r) => r.location ?? ''],
  ['major_defects', (r) => String(r.majorCount)],
  ['minor_defects', (r) => String(r.minorCount)],
  ['open_defects', (r) => String(r.openCount)],
  ['reviewed_at', (r, tz) => (r.reviewedAt ? isoWithOffset(r.reviewedAt, tz) : '')],
] as const satisfies ReadonlyArray<readonly [string, (r: ReportRow, timeZone: string) => string]>;

/**
 * One CSV cell (RFC 4180): quoted when it holds a quote, comma or line break, quotes doubled.
 * A cell that a spreadsheet would run as a formula (= + - @, tab, carriage return) gets a leading
 * apostrophe so that it stays text.
 */
export function escapeCsvCell(value: string): string {
  let v = value;
  if (/^[=+\-@\t\r]/.test(v)) v = `'${v}`;
  return /[",\r\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v;
}

export function toCsvLine(cells: readonly string[]): string {
  return `${cells.map(escapeCsvCell).join(',')}\r\n`;
}

/** The filtered reports table as CSV text, streamed: the header line, then one line a report. */
export function exportReportsCsv({
  fleetId,
  query,
}: {
  fleetId: string;
  query: ExportReportsQuery;
}): ReadableStream<Uint8Array> {
  const { sort, dir, ...filters } = query;
  const encoder = new TextEncoder();
  let rows: AsyncGenerator<ReportRow[]> | undefined;
  // Times as ISO 8601 in the fleet's zone with its offset: the clock the office reads, unambiguous.
  let timeZone = 'UTC';
  return new ReadableStream<Uint8Array>({
    async start(controller) {
      const minimums = await getFleetMinimumsOrThrow(fleetId);
      timeZone = minimums.timezone;
      rows = iterateReportRows(getDb(), { fleetId, filters, minimums, sort, dir });
      controller.enqueue(encoder.encode(`\uFEFF${toCsvLine(reportCsvColumns.map(([name]) => name))}`));
    },
    async pull(controller) {
      const next = await rows!.next();
      if (next.done) return controller.close();
      controller.enqueue(
        encoder.encode(next.value.map((r) => toCsvLine(reportCsvColumns.map(([, get]) => get(r, timeZone)))).join('')),
      );
    },
  });
}
