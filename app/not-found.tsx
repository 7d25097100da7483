import type { Metadata } from 'next';
import Link from 'next/link';
import { buttonClass } from '@/components/ui/button';

export const metadata: Metadata = { title: 'Not found' };

// Our own 404 (an unknown address, or notFound() in any role's page), painted in the app's
// theme: the built-in one follows only the system colour scheme, not the day/night switch.
export default function NotFound() {
  return (
    <main className="mx-auto flex min-h-dvh max-w-xl flex-col justify-center gap-6 px-5">
      <h1 className="text-3xl font-extrabold">Nothing at this address</h1>
      <p className="text-xl">
        The screen or record is not here: the link may be mistyped, or the record belongs to another fleet.
      </p>
      <Link href="/go" className={buttonClass('primary')}>
        Go to my screens
      </Link>
    </main>
  );
}
