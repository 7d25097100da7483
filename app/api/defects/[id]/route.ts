import { defineRoute } from '@/lib/api/define-route';
import { idParamsSchema } from '@/lib/schemas/common';
import { getDefectOrThrow } from '@/lib/services/defects/get-defect-or-throw';

export const GET = defineRoute(
  { roles: ['mechanic', 'supervisor'], params: idParamsSchema },
  async ({ user, params }) => Response.json(await getDefectOrThrow({ fleetId: user.fleetId, id: params.id })),
);
