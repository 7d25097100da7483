import type { Metadata } from 'next';
import { RoleHome } from '@/components/app-shell/role-home';
import { TrainerNav } from '@/components/trainer/trainer-nav';
import { requireRole } from '@/lib/auth/guards';
import { getDb } from '@/lib/db';
import { findFleetName } from '@/lib/db/fleets';
import { BenchClient } from './bench-client';

export const metadata: Metadata = { title: 'Test bench' };

export default async function TestBenchPage() {
  const user = await requireRole('trainer');
  const fleetName = await findFleetName(getDb(), { fleetId: user.fleetId });
  return (
    <RoleHome fleetName={fleetName} title="Test bench">
      <TrainerNav />
      <BenchClient />
    </RoleHome>
  );
}
