import type { ReactNode } from 'react';
import { RoleLayout } from '@/components/app-shell/role-layout';
import { requireRole } from '@/lib/auth/guards';

export default async function TrainerLayout({ children }: { children: ReactNode }) {
  const user = await requireRole('trainer');
  return (
    <RoleLayout user={user} role="trainer">
      {children}
    </RoleLayout>
  );
}
