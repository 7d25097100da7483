import type { Metadata } from 'next';
import { RoleHome } from '@/components/app-shell/role-home';
import { TrainerNav } from '@/components/trainer/trainer-nav';
import { requireRole } from '@/lib/auth/guards';
import { BenchClient } from './bench-client';

export const metadata: Metadata = { title: 'Test bench' };

export default async function TestBenchPage() {
  const user = await requireRole('trainer');
  return (
    <RoleHome user={user} title="Test bench">
      <TrainerNav />
      <BenchClient />
    </RoleHome>
  );
}
