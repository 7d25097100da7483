import type { ReactNode } from 'react';
import { RoleLayout } from '@/components/app-shell/role-layout';
import { OfficeNav } from '@/components/office/office-nav';
import { requireRole } from '@/lib/auth/guards';

const items = [
  { href: '/supervisor', label: 'Units and attention' },
  { href: '/supervisor/reports', label: 'Reports' },
  { href: '/supervisor/dashboard', label: 'Trends' },
  { href: '/mechanic', label: 'Defect queue' },
];

export default async function SupervisorLayout({ children }: { children: ReactNode }) {
  const user = await requireRole('supervisor');
  return (
    <RoleLayout user={user} role="supervisor">
      <OfficeNav label="Supervisor screens" items={items} />
      {children}
    </RoleLayout>
  );
}
