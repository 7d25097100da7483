import type { Metadata } from 'next';
import { AuthFrame } from '@/components/auth/auth-frame';
import { NewPasswordForm } from '@/components/auth/new-password-form';
import { Panel } from '@/components/ui/panel';

export const metadata: Metadata = { title: 'Choose a new password', referrer: 'no-referrer' };

export default async function ResetPasswordPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { token } = await searchParams;
  return (
    <AuthFrame title="Choose a new password">
      {typeof token === 'string' && token ? (
        <NewPasswordForm mode="reset" token={token} />
      ) : (
        <Panel as="p" role="alert" tone="major" className="text-lg font-bold">
          This link is not complete. Open the whole link from the e-mail, or{' '}
          <a href="/forgot-password" className="underline">
            ask for a new one
          </a>
          .
        </Panel>
      )}
    </AuthFrame>
  );
}
