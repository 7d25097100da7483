import { defineRoute } from '@/lib/api/define-route';
import { getDb } from '@/lib/db';
import { findFleetSettings } from '@/lib/db/fleets';
import { findFleetUnit } from '@/lib/db/units';
import { AppError } from '@/lib/errors';
import { idParamsSchema } from '@/lib/schemas/common';
import { findUnitReview } from '@/lib/services/inspections/find-unit-review';

// The unit's last report and its repair certifications, for the next driver's review (49 CFR 396.13).
export const GET = defineRoute(
  { roles: ['driver', 'mechanic', 'supervisor'], params: idParamsSchema },
  async ({ user, params }) => {
    const db = getDb();
    const unit = await findFleetUnit(db, { fleetId: user.fleetId, id: params.id });
    if (!unit) throw new AppError('not_found', 'No such unit in your fleet.');
    const fleet = await findFleetSettings(db, { fleetId: user.fleetId });
    return Response.json({
      unit,
      review: await findUnitReview(db, {
        fleetId: user.fleetId,
        unitId: unit.id,
        driverId: user.id,
        profile: fleet?.ruleProfile ?? 'us-federal',
      }),
    });
  },
);
