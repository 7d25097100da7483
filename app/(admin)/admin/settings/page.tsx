import { dehydrate, HydrationBoundary, QueryClient } from '@tanstack/react-query';
import type { Metadata } from 'next';
import { requireRole } from '@/lib/auth/guards';
import { getDb } from '@/lib/db';
import { findFleetSettings } from '@/lib/db/fleets';
import { fleetSettingsKeys } from '@/lib/queries/admin';
import { SettingsClient } from './settings-client';

export const metadata: Metadata = { title: 'Fleet settings' };

export default async function FleetSettingsPage() {
  const user = await requireRole('admin');
  const qc = new QueryClient();
  // The fleet is the signed-in admin's own; the browser's cache holds one fleet, so the key the client reads has no fleet part.
  // eslint-disable-next-line @tanstack/query/exhaustive-deps
  await qc.prefetchQuery({
    queryKey: fleetSettingsKeys.detail(),
    queryFn: async () => (await findFleetSettings(getDb(), { fleetId: user.fleetId })) ?? null,
  });
  return (
    <HydrationBoundary state={dehydrate(qc)}>
      <SettingsClient />
    </HydrationBoundary>
  );
}
