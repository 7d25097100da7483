import type { Metadata } from 'next';
import { RoleHome } from '@/components/app-shell/role-home';
import { TrainerNav } from '@/components/trainer/trainer-nav';
import { requireRole } from '@/lib/auth/guards';
import { getDb } from '@/lib/db';
import { findFleetName } from '@/lib/db/fleets';
import { EvaluationClient } from './evaluation-client';

export const metadata: Metadata = { title: 'Evaluate and publish' };

export default async function EvaluationPage() {
  const user = await requireRole('trainer');
  const fleetName = await findFleetName(getDb(), { fleetId: user.fleetId });
  return (
    <RoleHome fleetName={fleetName} title="Evaluate and publish">
      <TrainerNav />
      <EvaluationClient />
    </RoleHome>
  );
}
