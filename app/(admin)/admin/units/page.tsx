import { dehydrate, HydrationBoundary, QueryClient } from '@tanstack/react-query';
import type { Metadata } from 'next';
import { requireRole } from '@/lib/auth/guards';
import { getDb } from '@/lib/db';
import { listFleetUnits } from '@/lib/db/units';
import { adminUnitKeys } from '@/lib/queries/admin';
import { UnitsClient } from './units-client';

export const metadata: Metadata = { title: 'Units' };

export default async function AdminUnitsPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const user = await requireRole('admin');
  const { added } = await searchParams;
  const qc = new QueryClient();
  // The fleet is the signed-in admin's own; the browser's cache holds one fleet, so the key the client reads has no fleet part.
  // eslint-disable-next-line @tanstack/query/exhaustive-deps
  await qc.prefetchQuery({
    queryKey: adminUnitKeys.list(),
    queryFn: () => listFleetUnits(getDb(), { fleetId: user.fleetId }),
  });
  return (
    <HydrationBoundary state={dehydrate(qc)}>
      <UnitsClient added={typeof added === 'string' ? added : null} />
    </HydrationBoundary>
  );
}
