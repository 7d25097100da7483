import type { ReactNode } from 'react';
import { RoleLayout } from '@/components/app-shell/role-layout';
import { requireRole } from '@/lib/auth/guards';

export default async function DriverLayout({ children }: { children: ReactNode }) {
  const user = await requireRole('driver');
  return (
    <RoleLayout user={user} role="driver">
      {children}
    </RoleLayout>
  );
}
