import Link from 'next/link';
import { ThemeToggle } from '@/components/app-shell/theme-toggle';
import { slabClass } from '@/components/ui/slab-button';
import { findPageUser } from '@/lib/auth/guards';

export default async function HomePage() {
  const user = await findPageUser();
  return (
    <main className="mx-auto flex min-h-dvh max-w-2xl flex-col gap-8 px-5 py-8">
      <div className="flex items-center justify-between">
        <p className="text-3xl font-extrabold tracking-tight">
          Rig<span className="rounded bg-vest px-1 text-on-vest">Call</span>
        </p>
        <ThemeToggle />
      </div>
      <section className="space-y-4">
        <h1 className="text-4xl leading-tight font-extrabold">Say what you see. Walk the rig. Roll safe.</h1>
        <p className="text-xl">
          Walk the pre-trip zone by zone and speak your findings with gloves on, or tap the big buttons. RigCall matches
          each finding, judges tread, air and brake readings against the rules, and keeps the unit off the road when a
          defect is major, until a mechanic certifies the repair.
        </p>
      </section>
      <div className="space-y-3">
        {user ? (
          <Link href="/go" className={slabClass('primary')}>
            Continue as {user.name}
          </Link>
        ) : (
          <Link href="/sign-in" className={slabClass('primary')}>
            Sign in
          </Link>
        )}
      </div>
      <ul className="space-y-3 text-lg">
        <li className="rounded-lg border-slab border-edge bg-panel p-4">
          <span className="font-bold">Drivers:</span> pre-trip and post-trip walk-arounds by voice, photos of defects,
          the last report reviewed before you drive.
        </li>
        <li className="rounded-lg border-slab border-edge bg-panel p-4">
          <span className="font-bold">Mechanics:</span> the open-defect queue, repairs recorded and certified.
        </li>
        <li className="rounded-lg border-slab border-edge bg-panel p-4">
          <span className="font-bold">Supervisors:</span> every report and its transcript of findings, units out of
          service, records ready for an audit.
        </li>
      </ul>
      <p className="text-base text-muted">
        Local regulations and your carrier&apos;s licensed maintenance practice decide what may be driven. RigCall
        records the inspection; it does not replace it.
      </p>
    </main>
  );
}
