import { RoleHome } from '@/components/app-shell/role-home';
import { requireRole } from '@/lib/auth/guards';
import { getDb } from '@/lib/db';
import { findFleet } from '@/lib/db/fleets';
import { listDefectsQuerySchema } from '@/lib/schemas/defects';
import { listDefectQueue } from '@/lib/services/defects/list-defect-queue';
import { DefectQueue } from './defect-queue';

export default async function MechanicHomePage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const user = await requireRole('mechanic', 'supervisor');
  const fleet = await findFleet(getDb(), { fleetId: user.fleetId });
  const sp = await searchParams;
  const query = listDefectsQuerySchema.safeParse({ status: sp.status, severity: sp.severity, unitId: sp.unit });
  const q = query.success ? query.data : listDefectsQuerySchema.parse({});
  const queue = await listDefectQueue({ fleetId: user.fleetId, query: q });
  return (
    <RoleHome fleetName={fleet?.name ?? null} title="Open defects">
      <DefectQueue
        groups={queue.groups}
        status={q.status}
        filteredUnit={q.unitId ?? null}
        timeZone={fleet?.timezone ?? 'UTC'}
      />
    </RoleHome>
  );
}
