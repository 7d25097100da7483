import type { ReactNode } from 'react';
import { RoleLayout } from '@/components/app-shell/role-layout';

export default function SupervisorLayout({ children }: { children: ReactNode }) {
  return <RoleLayout role="supervisor">{children}</RoleLayout>;
}
