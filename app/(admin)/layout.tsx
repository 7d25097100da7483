import type { ReactNode } from 'react';
import { AdminNav } from '@/components/admin/admin-nav';
import { RoleLayout } from '@/components/app-shell/role-layout';
import { requireRole } from '@/lib/auth/guards';

export default async function AdminLayout({ children }: { children: ReactNode }) {
  const user = await requireRole('admin');
  return (
    <RoleLayout user={user} role="admin">
      <AdminNav />
      {children}
    </RoleLayout>
  );
}
