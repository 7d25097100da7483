import type { Metadata } from 'next';
import { AuthFrame } from '@/components/auth/auth-frame';
import { ForgotPasswordForm } from './forgot-password-form';

export const metadata: Metadata = { title: 'Forgot password' };

export default function ForgotPasswordPage() {
  return (
    <AuthFrame title="Forgot password">
      <p className="text-lg">Give the address you sign in with. We mail it a link to choose a new password.</p>
      <ForgotPasswordForm />
      <a href="/sign-in" className="text-lg font-bold underline">
        Back to sign-in
      </a>
    </AuthFrame>
  );
}
