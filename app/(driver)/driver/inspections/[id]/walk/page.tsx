import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { requireRole } from '@/lib/auth/guards';
import { getDb } from '@/lib/db';
import { loadWalkOrNull } from '@/lib/services/inspections/load-walk';
import { WalkClient } from './walk-client';

export const metadata: Metadata = { title: 'Walk-around' };

export default async function WalkPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requireRole('driver');
  const { id } = await params;
  const walk = await loadWalkOrNull(getDb(), { fleetId: user.fleetId, driverId: user.id, inspectionId: id });
  if (!walk) notFound();
  return <WalkClient {...walk} driverName={user.name} />;
}
