import { defineRoute } from '@/lib/api/define-route';
import { listReportsQuerySchema } from '@/lib/schemas/reports';
import { listReports } from '@/lib/services/reports/list-reports';

export const GET = defineRoute({ roles: ['supervisor'], query: listReportsQuerySchema }, async ({ user, query }) =>
  Response.json(await listReports({ fleetId: user.fleetId, query })),
);
