import type { ReactNode } from 'react';
import { getDb } from '@/lib/db';
import { findFleet } from '@/lib/db/fleets';
import type { SessionUser } from '@/lib/auth/guards';

/** The top of each role's home screen: the fleet and what this view is for. */
export async function RoleHome({ user, title, children }: { user: SessionUser; title: string; children: ReactNode }) {
  const fleet = await findFleet(getDb(), { fleetId: user.fleetId });
  return (
    <section className="space-y-4">
      <p className="text-lg text-muted">{fleet?.name}</p>
      <h1 className="text-3xl font-extrabold">{title}</h1>
      {children}
    </section>
  );
}
