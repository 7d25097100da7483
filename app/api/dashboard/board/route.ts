import { defineRoute } from '@/lib/api/define-route';
import { getSupervisorBoard } from '@/lib/services/units/get-supervisor-board';

export const GET = defineRoute({ roles: ['supervisor'] }, async ({ user }) =>
  Response.json(await getSupervisorBoard({ fleetId: user.fleetId })),
);
