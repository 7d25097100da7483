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
