import { RoleHome } from '@/components/app-shell/role-home';
import { requireRole } from '@/lib/auth/guards';

export default async function MechanicHomePage() {
  const user = await requireRole('mechanic');
  return (
    <RoleHome user={user} title="Open defects">
      <p className="text-xl">Defects waiting for a repair and your certification, by unit and severity.</p>
    </RoleHome>
  );
}
