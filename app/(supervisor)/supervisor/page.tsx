import { RoleHome } from '@/components/app-shell/role-home';
import { requireRole } from '@/lib/auth/guards';
import { getDb } from '@/lib/db';
import { findFleetName } from '@/lib/db/fleets';
import { getSupervisorBoard } from '@/lib/services/units/get-supervisor-board';
import { AttentionList } from './attention-list';
import { UnitsBoard } from './units-board';

export default async function SupervisorHomePage() {
  const user = await requireRole('supervisor');
  const fleetName = await findFleetName(getDb(), { fleetId: user.fleetId });
  const board = await getSupervisorBoard({ fleetId: user.fleetId });
  return (
    <RoleHome fleetName={fleetName} title="Fleet at a glance">
      <div className="grid gap-6 xl:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
        <UnitsBoard units={board.units} timezone={board.fleet.timezone} />
        <AttentionList rows={board.attention} days={board.days} fleet={board.fleet} />
      </div>
    </RoleHome>
  );
}
