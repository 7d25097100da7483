import type { Metadata } from 'next';
import { RoleHome } from '@/components/app-shell/role-home';
import { TrainerNav } from '@/components/trainer/trainer-nav';
import { requireRole } from '@/lib/auth/guards';
import { getDb } from '@/lib/db';
import { findFleetName } from '@/lib/db/fleets';
import { InboxClient } from './inbox-client';

export const metadata: Metadata = { title: 'Field utterances' };

export default async function FieldUtterancesPage() {
  const user = await requireRole('trainer');
  const fleetName = await findFleetName(getDb(), { fleetId: user.fleetId });
  return (
    <RoleHome fleetName={fleetName} title="Field utterances">
      <TrainerNav />
      <InboxClient />
    </RoleHome>
  );
}
