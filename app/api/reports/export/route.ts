import { defineRoute } from '@/lib/api/define-route';
import { exportReportsQuerySchema } from '@/lib/schemas/reports';
import { exportReportsCsv } from '@/lib/services/reports/export-reports-csv';

// The filtered reports table as CSV, for audits: same filters and order as GET /api/reports.
export const GET = defineRoute({ roles: ['supervisor'], query: exportReportsQuerySchema }, ({ user, query }) => {
  const stamp = new Date().toISOString().slice(0, 10);
  const body = exportReportsCsv({ fleetId: user.fleetId, query });
  return Promise.resolve(
    new Response(body, {
      headers: {
        'content-type': 'text/csv; charset=utf-8',
        'content-disposition': `attachment; filename="inspection-reports-${stamp}.csv"`,
        'cache-control': 'no-store',
      },
    }),
  );
});
