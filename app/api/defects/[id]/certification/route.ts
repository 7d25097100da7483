import { defineRoute } from '@/lib/api/define-route';
import { idParamsSchema } from '@/lib/schemas/common';
import { certifyRepairBodySchema } from '@/lib/schemas/defects';
import { certifyRepair } from '@/lib/services/defects/certify-repair';

// The carrier's repair certification on the report, 49 CFR 396.11(a)(3).
export const POST = defineRoute(
  { roles: ['mechanic'], params: idParamsSchema, body: certifyRepairBodySchema },
  async ({ user, params, body }) =>
    Response.json(
      await certifyRepair({ fleetId: user.fleetId, actorId: user.id, actorName: user.name, id: params.id, body }),
      {
        status: 201,
      },
    ),
);
