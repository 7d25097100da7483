import type { Metadata } from 'next';
import { AuthFrame } from '@/components/auth/auth-frame';
import { NewPasswordForm } from '@/components/auth/new-password-form';
import { requirePasswordChanger } from '@/lib/auth/guards';
import { Panel } from '@/components/ui/panel';

export const metadata: Metadata = { title: 'Change password' };

export default async function ChangePasswordPage() {
  const { user, mustChangePassword } = await requirePasswordChanger();
  return (
    <AuthFrame title="Change password">
      {mustChangePassword ? (
        <Panel as="p" role="status" className="text-lg">
          You signed in with a temporary password. Choose your own before you carry on: nobody else, the person who
          invited you included, should know it.
        </Panel>
      ) : (
        <p className="text-lg">Every other place you are signed in is signed out when you save.</p>
      )}
      <NewPasswordForm mode="change" email={user.email} name={user.name} />
    </AuthFrame>
  );
}
