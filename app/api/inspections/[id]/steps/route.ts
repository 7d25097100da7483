import { defineRoute } from '@/lib/api/define-route';
import { idParamsSchema } from '@/lib/schemas/common';
import { recordStepBodySchema } from '@/lib/schemas/inspections';
import { recordStep } from '@/lib/services/inspections/record-step';

export const POST = defineRoute(
  { roles: ['driver'], params: idParamsSchema, body: recordStepBodySchema },
  async ({ user, params, body }) => {
    const { step, created } = await recordStep({
      fleetId: user.fleetId,
      actorId: user.id,
      inspectionId: params.id,
      body,
    });
    return Response.json({ step }, { status: created ? 201 : 200 });
  },
);
