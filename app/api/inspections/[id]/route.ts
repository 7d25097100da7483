import { defineRoute } from '@/lib/api/define-route';
import { idParamsSchema } from '@/lib/schemas/common';
import { getInspectionOrThrow } from '@/lib/services/inspections/get-inspection-or-throw';

// Drivers read reports too: the last report of a unit is reviewed before driving (49 CFR 396.13).
export const GET = defineRoute(
  { roles: ['driver', 'mechanic', 'supervisor'], params: idParamsSchema },
  async ({ user, params }) => Response.json(await getInspectionOrThrow({ fleetId: user.fleetId, id: params.id })),
);
