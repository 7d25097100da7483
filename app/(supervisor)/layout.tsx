import type { ReactNode } from 'react';
import { RoleLayout } from '@/components/app-shell/role-layout';
import { OfficeNav } from '@/components/office/office-nav';

const items = [
  { href: '/supervisor', label: 'Units and attention' },
  { href: '/supervisor/reports', label: 'Reports' },
  { href: '/supervisor/dashboard', label: 'Trends' },
  { href: '/mechanic', label: 'Defect queue' },
];

export default function SupervisorLayout({ children }: { children: ReactNode }) {
  return (
    <RoleLayout role="supervisor">
      <OfficeNav label="Supervisor screens" items={items} />
      {children}
    </RoleLayout>
  );
}
