import type { ReactNode } from 'react';
import type { Role } from '@/lib/auth/roles';
import type { SessionUser } from '@/lib/schemas/session';
import { AppHeader } from './app-header';

/** The frame of one role's screens: the header bar for this user and view, then the page. */
export function RoleLayout({ user, role, children }: { user: SessionUser; role: Role; children: ReactNode }) {
  return (
    <>
      <AppHeader user={user} view={role} />
      <main className="mx-auto max-w-6xl px-4 py-6">{children}</main>
    </>
  );
}
