import { RoleHome } from '@/components/app-shell/role-home';
import { requireRole } from '@/lib/auth/guards';

export default async function DriverHomePage() {
  const user = await requireRole('driver');
  return (
    <RoleHome user={user} title="Today's walk-around">
      <p className="text-xl">Start a pre-trip or post-trip inspection of your tractor and trailer.</p>
    </RoleHome>
  );
}
