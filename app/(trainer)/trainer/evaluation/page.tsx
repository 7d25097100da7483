import type { Metadata } from 'next';
import { RoleHome } from '@/components/app-shell/role-home';
import { TrainerNav } from '@/components/trainer/trainer-nav';
import { requireRole } from '@/lib/auth/guards';
import { EvaluationClient } from './evaluation-client';

export const metadata: Metadata = { title: 'Evaluate and publish' };

export default async function EvaluationPage() {
  const user = await requireRole('trainer');
  return (
    <RoleHome user={user} title="Evaluate and publish">
      <TrainerNav />
      <EvaluationClient />
    </RoleHome>
  );
}
