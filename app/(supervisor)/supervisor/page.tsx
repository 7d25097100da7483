import { RoleHome } from '@/components/app-shell/role-home';
import { requireRole } from '@/lib/auth/guards';

export default async function SupervisorHomePage() {
  const user = await requireRole('supervisor');
  return (
    <RoleHome user={user} title="Fleet at a glance">
      <p className="text-xl">Units in and out of service, and the inspections that need a look.</p>
    </RoleHome>
  );
}
