import { RoleHome } from '@/components/app-shell/role-home';
import { requireRole } from '@/lib/auth/guards';

export default async function AdminHomePage() {
  const user = await requireRole('admin');
  return (
    <RoleHome user={user} title="Fleet administration">
      <p className="text-xl">People and roles, tractors and trailers, and the fleet's settings.</p>
    </RoleHome>
  );
}
