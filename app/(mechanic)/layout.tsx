import type { ReactNode } from 'react';
import { RoleLayout } from '@/components/app-shell/role-layout';

export default function MechanicLayout({ children }: { children: ReactNode }) {
  return <RoleLayout role="mechanic">{children}</RoleLayout>;
}
