import Link from 'next/link';
import type { ReactNode } from 'react';
import { roleLabel, roles } from '@/lib/auth/roles';
import { ruleProfileLabel } from '@/lib/schemas/fleet';
import type { AdminSummary } from '@/lib/schemas/admin';
import { buttonClass } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';
import { statusWords } from '@/lib/walk/name-finding';

const actionWords: Record<string, string> = {
  'user.invited': 'invited',
  'user.renamed': 'renamed',
  'user.roles_changed': 'changed the roles of',
  'user.deactivated': 'deactivated',
  'user.reactivated': 'reactivated',
  'unit.created': 'added unit',
  'unit.updated': 'edited unit',
  'unit.retired': 'retired unit',
  'unit.in_service': 'put back in service unit',
  'unit.out_of_service': 'put out of service unit',
  'fleet.settings_changed': 'changed the fleet settings',
};

function describe(action: string, detail: unknown): string {
  const d = (detail ?? {}) as { email?: string; name?: string; unitNumber?: string };
  const what = d.unitNumber ?? d.name ?? d.email ?? '';
  return `${actionWords[action] ?? statusWords(action)} ${action.startsWith('fleet.') ? '' : what}`.trim();
}

function Card({
  title,
  href,
  linkLabel,
  children,
}: {
  title: string;
  href: string;
  linkLabel: string;
  children: ReactNode;
}) {
  return (
    <section className={`${panelClass({ padding: 'none' })} flex flex-col gap-3 p-4`} aria-labelledby={`card-${href}`}>
      <h2 id={`card-${href}`} className="text-xl font-extrabold">
        {title}
      </h2>
      <div className="flex-1">{children}</div>
      <Link href={href} className={buttonClass('plain', 'compact')}>
        {linkLabel}
      </Link>
    </section>
  );
}

const Stat = ({ n, label }: { n: number | string; label: string }) => (
  <p className="flex items-baseline gap-2">
    <span className="text-3xl font-extrabold">{n}</span>
    <span className="text-lg">{label}</span>
  </p>
);

/** The admin's first screen: the fleet at a glance, with the way into each section. */
export function AdminOverview({ summary }: { summary: AdminSummary }) {
  const { fleet, users, units, recent } = summary;
  const when = new Intl.DateTimeFormat('en-US', {
    timeZone: summary.timezone,
    dateStyle: 'medium',
    timeStyle: 'short',
  });
  return (
    <div className="flex flex-col gap-5">
      <header>
        <p className="text-lg text-muted">{fleet.name}</p>
        <h1 className="text-3xl font-extrabold">Fleet administration</h1>
      </header>
      <div className="grid gap-4 md:grid-cols-3">
        <Card title="People" href="/admin/users" linkLabel="Invite and manage people">
          <Stat n={users.active} label="active" />
          <ul className="flex flex-wrap gap-x-3 text-base text-muted">
            {roles.map((r) => (
              <li key={r} className="whitespace-nowrap">
                {users.byRole[r]} {roleLabel[r].toLowerCase()}
                {users.byRole[r] === 1 ? '' : 's'}
              </li>
            ))}
          </ul>
          {users.inactive ? <p className="text-base text-muted">{users.inactive} deactivated</p> : null}
        </Card>
        <Card title="Units" href="/admin/units" linkLabel="Add and edit units">
          <Stat n={units.tractors} label={units.tractors === 1 ? 'tractor' : 'tractors'} />
          <Stat n={units.trailers} label={units.trailers === 1 ? 'trailer' : 'trailers'} />
          {units.outOfService ? (
            <p className="mt-1 inline-flex items-center gap-1 rounded bg-major px-2 font-extrabold text-on-major">
              <span aria-hidden="true">▬</span> {units.outOfService} OUT OF SERVICE
            </p>
          ) : (
            <p className="text-base">
              <span aria-hidden="true" className="text-pass">
                ✓{' '}
              </span>
              None out of service
            </p>
          )}
          {units.retired ? <p className="text-base text-muted">{units.retired} retired</p> : null}
        </Card>
        <Card title="Fleet settings" href="/admin/settings" linkLabel="Change settings">
          <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-base">
            <dt className="text-muted">Pre-trip at least</dt>
            <dd className="font-bold">{fleet.minPretripMinutes} min</dd>
            <dt className="text-muted">Post-trip at least</dt>
            <dd className="font-bold">{fleet.minPosttripMinutes} min</dd>
            <dt className="text-muted">Steer / drive / trailer</dt>
            <dd className="font-bold">
              {fleet.tirePressureTargets.steer} / {fleet.tirePressureTargets.drive} /{' '}
              {fleet.tirePressureTargets.trailer} psi
            </dd>
            <dt className="text-muted">Rules</dt>
            <dd className="font-bold">{ruleProfileLabel[fleet.ruleProfile].split(':')[0]}</dd>
          </dl>
        </Card>
      </div>
      <section className={`${panelClass({ padding: 'none' })} p-4`} aria-labelledby="recent-heading">
        <h2 id="recent-heading" className="mb-2 text-xl font-extrabold">
          Recent changes
        </h2>
        {recent.length === 0 ? <p className="text-lg text-muted">No admin changes yet.</p> : null}
        <ol className="flex flex-col divide-y-2 divide-edge/20">
          {recent.map((r) => (
            <li key={r.id} className="flex flex-wrap justify-between gap-x-4 py-2 text-lg">
              <span>
                <b>{r.actorName ?? 'Someone'}</b> {describe(r.action, r.detail)}
              </span>
              <time dateTime={r.createdAt} className="text-base text-muted">
                {when.format(new Date(r.createdAt))}
              </time>
            </li>
          ))}
        </ol>
      </section>
    </div>
  );
}
