import { defineRoute } from '@/lib/api/define-route';
import { idParamsSchema } from '@/lib/schemas/common';
import { finishInspectionBodySchema } from '@/lib/schemas/inspections';
import { finishInspection } from '@/lib/services/inspections/finish-inspection';

export const POST = defineRoute(
  { roles: ['driver'], params: idParamsSchema, body: finishInspectionBodySchema },
  async ({ req, user, params, body }) =>
    Response.json(
      await finishInspection({
        fleetId: user.fleetId,
        actorId: user.id,
        actorName: user.name,
        inspectionId: params.id,
        body,
        appUrl: process.env.NEXTAUTH_URL ?? new URL(req.url).origin,
      }),
    ),
);
