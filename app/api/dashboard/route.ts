import { defineRoute } from '@/lib/api/define-route';
import { getOfficeDashboard } from '@/lib/services/reports/get-office-dashboard';

export const GET = defineRoute({ roles: ['supervisor'] }, async ({ user }) =>
  Response.json(await getOfficeDashboard({ fleetId: user.fleetId })),
);
