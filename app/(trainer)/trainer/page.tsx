import { RoleHome } from '@/components/app-shell/role-home';
import { requireRole } from '@/lib/auth/guards';

export default async function TrainerHomePage() {
  const user = await requireRole('trainer');
  return (
    <RoleHome user={user} title="Defect vocabulary">
      <p className="text-xl">The words drivers say, what they match, and how sure the match is.</p>
    </RoleHome>
  );
}
