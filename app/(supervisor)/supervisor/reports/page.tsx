import { HydrationBoundary, QueryClient, dehydrate } from '@tanstack/react-query';
import { requireRole } from '@/lib/auth/guards';
import { getDb } from '@/lib/db';
import { listReportFilterOptions } from '@/lib/db/reports';
import { paramsFromSearch, reportKeys } from '@/lib/queries/reports';
import { listReportsQuerySchema } from '@/lib/schemas/reports';
import { getFleetMinimumsOrThrow, listReports } from '@/lib/services/reports/list-reports';
import { ReportsClient } from './reports-client';

export const metadata = { title: 'Reports' };

export default async function ReportsPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const user = await requireRole('supervisor');
  const sp = new URLSearchParams(
    Object.entries(await searchParams).flatMap(([k, v]) => (typeof v === 'string' ? [[k, v]] : [])),
  );
  const params = paramsFromSearch(sp);
  const qc = new QueryClient();
  const parsed = listReportsQuerySchema.safeParse(params);
  if (parsed.success)
    qc.setQueryData(reportKeys.list(params), await listReports({ fleetId: user.fleetId, query: parsed.data }));
  const [options, fleet] = await Promise.all([
    listReportFilterOptions(getDb(), { fleetId: user.fleetId }),
    getFleetMinimumsOrThrow(user.fleetId),
  ]);
  return (
    <HydrationBoundary state={dehydrate(qc)}>
      <ReportsClient drivers={options.drivers} units={options.units} timezone={fleet.timezone} />
    </HydrationBoundary>
  );
}
