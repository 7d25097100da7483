import { defineRoute } from '@/lib/api/define-route';
import { idParamsSchema } from '@/lib/schemas/common';
import { getReportDetail } from '@/lib/services/reports/get-report-detail';

export const GET = defineRoute({ roles: ['supervisor'], params: idParamsSchema }, async ({ user, params }) =>
  Response.json(await getReportDetail({ fleetId: user.fleetId, id: params.id })),
);
