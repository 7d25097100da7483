import type { Metadata } from 'next';
import { RoleHome } from '@/components/app-shell/role-home';
import { TrainerNav } from '@/components/trainer/trainer-nav';
import { requireRole } from '@/lib/auth/guards';
import { InboxClient } from './inbox-client';

export const metadata: Metadata = { title: 'Field utterances' };

export default async function FieldUtterancesPage() {
  const user = await requireRole('trainer');
  return (
    <RoleHome user={user} title="Field utterances">
      <TrainerNav />
      <InboxClient />
    </RoleHome>
  );
}
