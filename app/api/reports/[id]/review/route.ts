import { defineRoute } from '@/lib/api/define-route';
import { idParamsSchema } from '@/lib/schemas/common';
import { reviewReportBodySchema } from '@/lib/schemas/reports';
import { reviewReport } from '@/lib/services/reports/review-report';

export const POST = defineRoute(
  { roles: ['supervisor'], params: idParamsSchema, body: reviewReportBodySchema },
  async ({ user, params, body }) =>
    Response.json(await reviewReport({ fleetId: user.fleetId, actorId: user.id, id: params.id, note: body.note })),
);
