import Link from 'next/link';
import { ThemeToggle } from '@/components/app-shell/theme-toggle';
import { buttonClass } from '@/components/ui/button';
import { findPageUser } from '@/lib/auth/guards';
import { Panel } from '@/components/ui/panel';

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
          <Link href="/go" className={buttonClass('primary')}>
            Continue as {user.name}
          </Link>
        ) : (
          <Link href="/sign-in" className={buttonClass('primary')}>
            Sign in
          </Link>
        )}
      </div>
      <ul className="space-y-3 text-lg">
        <Panel as="li">
          <span className="font-bold">Drivers:</span> pre-trip and post-trip walk-arounds by voice, photos of defects,
          the last report reviewed before you drive.
        </Panel>
        <Panel as="li">
          <span className="font-bold">Mechanics:</span> the open-defect queue, repairs recorded and certified.
        </Panel>
        <Panel as="li">
          <span className="font-bold">Supervisors:</span> every report and its transcript of findings, units out of
          service, records ready for an audit.
        </Panel>
      </ul>
      <p className="text-base text-muted">
        Local regulations and your carrier&apos;s licensed maintenance practice decide what may be driven. RigCall
        records the inspection; it does not replace it.
      </p>
    </main>
  );
}
