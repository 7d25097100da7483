import { dehydrate, HydrationBoundary, QueryClient } from '@tanstack/react-query';
import type { Metadata } from 'next';
import { requireRole } from '@/lib/auth/guards';
import { getDb } from '@/lib/db';
import { listFleetUsers } from '@/lib/db/users';
import { adminUserKeys } from '@/lib/queries/admin';
import { UsersClient } from './users-client';

export const metadata: Metadata = { title: 'People' };

export default async function AdminUsersPage() {
  const user = await requireRole('admin');
  const qc = new QueryClient();
  // The fleet is the signed-in admin's own; the browser's cache holds one fleet, so the key the client reads has no fleet part.
  // eslint-disable-next-line @tanstack/query/exhaustive-deps
  await qc.prefetchQuery({
    queryKey: adminUserKeys.list(),
    queryFn: () => listFleetUsers(getDb(), { fleetId: user.fleetId }),
  });
  return (
    <HydrationBoundary state={dehydrate(qc)}>
      <UsersClient selfId={user.id} />
    </HydrationBoundary>
  );
}
