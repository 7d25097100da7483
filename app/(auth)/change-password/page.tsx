import type { Metadata } from 'next';
import { AuthFrame } from '@/components/auth/auth-frame';
import { NewPasswordForm } from '@/components/auth/new-password-form';
import { requirePasswordChanger } from '@/lib/auth/guards';

export const metadata: Metadata = { title: 'Change password' };

export default async function ChangePasswordPage() {
  const { user, mustChangePassword } = await requirePasswordChanger();
  return (
    <AuthFrame title="Change password">
      {mustChangePassword ? (
        <p role="status" className="rounded-lg border-slab border-edge bg-panel p-4 text-lg">
          You signed in with a temporary password. Choose your own before you carry on: nobody else, the person who
          invited you included, should know it.
        </p>
      ) : (
        <p className="text-lg">Every other place you are signed in is signed out when you save.</p>
      )}
      <NewPasswordForm mode="change" email={user.email} name={user.name} />
    </AuthFrame>
  );
}
