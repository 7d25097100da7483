import { RoleHome } from '@/components/app-shell/role-home';
import { TrainerNav } from '@/components/trainer/trainer-nav';
import { requireRole } from '@/lib/auth/guards';
import { getDb } from '@/lib/db';
import { findFleetName } from '@/lib/db/fleets';
import { VersionsClient } from './versions-client';

export default async function TrainerHomePage() {
  const user = await requireRole('trainer');
  const fleetName = await findFleetName(getDb(), { fleetId: user.fleetId });
  return (
    <RoleHome fleetName={fleetName} title="Defect vocabulary">
      <TrainerNav />
      <p className="text-lg">
        The words drivers say, what they match, and how sure the match is. Edits go to a draft; a published version
        never changes, and each inspection keeps the version it started with.
      </p>
      <VersionsClient />
    </RoleHome>
  );
}
