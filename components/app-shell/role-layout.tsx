import type { ReactNode } from 'react';
import { requireRole } from '@/lib/auth/guards';
import type { Role } from '@/lib/auth/roles';
import { AppHeader } from './app-header';

/** The frame of one role's screens. Pages check the role again themselves. */
export async function RoleLayout({ role, children }: { role: Role; children: ReactNode }) {
  const user = await requireRole(role);
  return (
    <>
      <AppHeader user={user} view={role} />
      <main className="mx-auto max-w-6xl px-4 py-6">{children}</main>
    </>
  );
}
