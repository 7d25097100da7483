import type { Metadata } from 'next';
import { findSafeNextPath } from '@/lib/http/find-safe-next-path';
import { SignInForm } from './sign-in-form';
import { Panel } from '@/components/ui/panel';

export const metadata: Metadata = { title: 'Sign in' };

function ownOrigin(): string {
  try {
    return new URL(process.env.NEXTAUTH_URL ?? '').origin;
  } catch {
    return 'http://localhost';
  }
}

export default async function SignInPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const sp = await searchParams;
  // Parsed against our own origin the way the browser will read it; anything else goes home.
  const next = findSafeNextPath(typeof sp.next === 'string' ? sp.next : undefined, ownOrigin());
  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col justify-center gap-6 px-5 py-8">
      <p className="text-3xl font-extrabold tracking-tight">
        Rig<span className="rounded bg-vest px-1 text-on-vest">Call</span>
      </p>
      <h1 className="text-4xl font-extrabold">Sign in</h1>
      {sp.signedOut ? (
        <Panel as="p" role="status" className="text-lg">
          You are signed out.
        </Panel>
      ) : null}
      <SignInForm next={next} />
      <a href="/forgot-password" className="text-lg font-bold underline">
        Forgot password?
      </a>
    </main>
  );
}
