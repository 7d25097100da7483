import { defineRoute } from '@/lib/api/define-route';
import { roles } from '@/lib/auth/roles';
import { getDb } from '@/lib/db';
import { listUsableUnits } from '@/lib/db/units';

// Every role of the fleet may see its units in use (retired ones are the admin's business).
export const GET = defineRoute({ roles }, async ({ user }) =>
  Response.json({ units: await listUsableUnits(getDb(), { fleetId: user.fleetId }) }),
);
