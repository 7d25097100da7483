import type { Metadata } from 'next';
import { requireRole } from '@/lib/auth/guards';
import { getDb } from '@/lib/db';
import { listUsableUnits } from '@/lib/db/units';
import { StartClient } from './start-client';

export const metadata: Metadata = { title: 'Start an inspection' };

export default async function StartPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const user = await requireRole('driver');
  const kind = (await searchParams).kind === 'post_trip' ? 'post_trip' : 'pre_trip';
  const units = await listUsableUnits(getDb(), { fleetId: user.fleetId });
  const pick = (u: (typeof units)[number]) => ({
    id: u.id,
    unitNumber: u.unitNumber,
    status: u.status,
    label: [u.make, u.model].filter(Boolean).join(' '),
  });
  return (
    <StartClient
      kind={kind}
      driverName={user.name}
      tractors={units.filter((u) => u.kind === 'tractor').map(pick)}
      trailers={units.filter((u) => u.kind === 'trailer').map(pick)}
    />
  );
}
