import type { Metadata } from 'next';
import { buttonClass } from '@/components/ui/button';

export const metadata: Metadata = { title: 'No connection' };

// What the service worker shows for a screen it has not kept on this device while there is no
// connection. A plain link (not next/link): it asks the worker again, which serves the kept home
// screen when there is one.
export default function OfflinePage() {
  return (
    <main className="mx-auto flex min-h-dvh max-w-xl flex-col justify-center gap-6 px-5">
      <h1 className="text-3xl font-extrabold">No connection</h1>
      <p className="text-xl">
        This screen is not kept on this phone yet. Your home screen, the units and any walk you opened while online work
        without a signal; steps you record wait on the phone and are sent when the connection is back.
      </p>
      <a href="/driver" className={buttonClass('primary')}>
        Go to my walk-arounds
      </a>
    </main>
  );
}
