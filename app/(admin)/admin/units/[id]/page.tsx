import { dehydrate, HydrationBoundary, QueryClient } from '@tanstack/react-query';
import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { requireRole } from '@/lib/auth/guards';
import { getDb } from '@/lib/db';
import { findFleetSettings } from '@/lib/db/fleets';
import { findFleetUnit } from '@/lib/db/units';
import { adminUnitKeys, fleetSettingsKeys } from '@/lib/queries/admin';
import { unitParamsSchema } from '@/lib/schemas/units';
import { EditUnitClient } from './edit-unit-client';

export const metadata: Metadata = { title: 'Unit' };

export default async function EditUnitPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requireRole('admin');
  const parsed = unitParamsSchema.safeParse(await params);
  const unit = parsed.success ? await findFleetUnit(getDb(), { fleetId: user.fleetId, id: parsed.data.id }) : undefined;
  if (!unit) notFound();
  const qc = new QueryClient();
  qc.setQueryData(adminUnitKeys.detail(unit.id), unit);
  // The fleet is the signed-in admin's own; the browser's cache holds one fleet, so the key the client reads has no fleet part.
  // eslint-disable-next-line @tanstack/query/exhaustive-deps
  await qc.prefetchQuery({
    queryKey: fleetSettingsKeys.detail(),
    queryFn: async () => (await findFleetSettings(getDb(), { fleetId: user.fleetId })) ?? null,
  });
  return (
    <HydrationBoundary state={dehydrate(qc)}>
      <EditUnitClient id={unit.id} />
    </HydrationBoundary>
  );
}
