import { defineRoute } from '@/lib/api/define-route';
import { listDefectsQuerySchema } from '@/lib/schemas/defects';
import { listDefectQueue } from '@/lib/services/defects/list-defect-queue';

export const GET = defineRoute(
  { roles: ['mechanic', 'supervisor'], query: listDefectsQuerySchema },
  async ({ user, query }) => Response.json(await listDefectQueue({ fleetId: user.fleetId, query })),
);
