import { RoleHome } from '@/components/app-shell/role-home';
import { requireRole } from '@/lib/auth/guards';
import { findFleetName } from '@/lib/db/fleets';
import { getDb } from '@/lib/db';
import { listDriverInspections } from '@/lib/db/inspections';
import { DriverHomeClient } from './driver-home-client';

export default async function DriverHomePage() {
  const user = await requireRole('driver');
  const fleetName = await findFleetName(getDb(), { fleetId: user.fleetId });
  const recent = await listDriverInspections(getDb(), { fleetId: user.fleetId, driverId: user.id, limit: 8 });
  return (
    <RoleHome fleetName={fleetName} title="Today's walk-around">
      <DriverHomeClient
        recent={recent.map((r) => ({
          ...r,
          startedAt: r.startedAt.toISOString(),
          finishedAt: r.finishedAt?.toISOString() ?? null,
          defectCount: Number(r.defectCount ?? 0),
        }))}
      />
    </RoleHome>
  );
}
