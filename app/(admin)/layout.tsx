import type { ReactNode } from 'react';
import { AdminNav } from '@/components/admin/admin-nav';
import { RoleLayout } from '@/components/app-shell/role-layout';

export default function AdminLayout({ children }: { children: ReactNode }) {
  return (
    <RoleLayout role="admin">
      <AdminNav />
      {children}
    </RoleLayout>
  );
}
