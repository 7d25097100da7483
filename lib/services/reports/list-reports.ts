import 'server-only';
import { getDb } from '@/lib/db';
import { countReportRows, findFleetMinimums, listReportRows, type FleetMinimums } from '@/lib/db/reports';
import { AppError } from '@/lib/errors';
import type { ListReportsQuery, ReportPage } from '@/lib/schemas/reports';

export async function getFleetMinimumsOrThrow(fleetId: string): Promise<FleetMinimums> {
  const fleet = await findFleetMinimums(getDb(), { fleetId });
  if (!fleet) throw new AppError('not_found', 'No such fleet.');
  return fleet;
}

/** One page of the fleet's reports with the total, filtered and sorted on the server. */
export async function listReports({
  fleetId,
  query,
}: {
  fleetId: string;
  query: ListReportsQuery;
}): Promise<ReportPage> {
  const { page, pageSize, sort, dir, ...filters } = query;
  const minimums = await getFleetMinimumsOrThrow(fleetId);
  const db = getDb();
  const [rows, total] = await Promise.all([
    listReportRows(db, { fleetId, filters, minimums, sort, dir, limit: pageSize, offset: (page - 1) * pageSize }),
    countReportRows(db, { fleetId, filters, minimums }),
  ]);
  return { rows, total, page, pageSize, pageCount: Math.max(1, Math.ceil(total / pageSize)) };
}
