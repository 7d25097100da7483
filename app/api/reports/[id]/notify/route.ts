import { defineRoute } from '@/lib/api/define-route';
import { idParamsSchema } from '@/lib/schemas/common';
import { notifyReportDefects } from '@/lib/services/mail/notify-report-defects';

// Mail the shop about this report's open defects (out of service, or repair needed).
export const POST = defineRoute({ roles: ['supervisor'], params: idParamsSchema }, async ({ user, params }) =>
  Response.json(await notifyReportDefects({ fleetId: user.fleetId, actorName: user.name, id: params.id })),
);
