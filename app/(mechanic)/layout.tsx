import type { ReactNode } from 'react';
import { AppHeader } from '@/components/app-shell/app-header';
import { OfficeNav } from '@/components/office/office-nav';
import { requireRole } from '@/lib/auth/guards';

// The shop's screens. Supervisors read the queue and the certifications too; only a mechanic
// certifies (the certification route checks that again).
export default async function MechanicLayout({ children }: { children: ReactNode }) {
  const user = await requireRole('mechanic', 'supervisor');
  const view = user.roles.includes('mechanic') ? 'mechanic' : 'supervisor';
  const items = [
    { href: '/mechanic', label: 'Open defects' },
    { href: '/mechanic?status=closed', label: 'Certified' },
    ...(user.roles.includes('supervisor') ? [{ href: '/supervisor', label: 'Units and attention' }] : []),
  ];
  return (
    <>
      <AppHeader user={user} view={view} />
      <main className="mx-auto max-w-6xl px-4 py-6">
        <OfficeNav label="Shop screens" items={items} />
        {children}
      </main>
    </>
  );
}
