import type { ReactNode } from 'react';
import { RoleLayout } from '@/components/app-shell/role-layout';

export default function TrainerLayout({ children }: { children: ReactNode }) {
  return <RoleLayout role="trainer">{children}</RoleLayout>;
}
