import { defineRoute } from '@/lib/api/define-route';
import { pendingAcknowledgementsQuerySchema } from '@/lib/schemas/reports';
import { listPendingAcknowledgements } from '@/lib/services/inspections/list-pending-acknowledgements';

// What the next driver of these units must review and sign before driving (49 CFR 396.13).
export const GET = defineRoute(
  { roles: ['driver', 'mechanic', 'supervisor'], query: pendingAcknowledgementsQuerySchema },
  async ({ user, query }) =>
    Response.json({ pending: await listPendingAcknowledgements({ fleetId: user.fleetId, unitIds: query.units }) }),
);
