import { requireRole } from '@/lib/auth/guards';
import { listCaughtMessages } from '@/lib/services/mail/list-caught-messages';

export const metadata = { title: 'Caught mail' };
export const dynamic = 'force-dynamic';

const when = (iso: string) =>
  new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'medium', hourCycle: 'h23' }).format(
    new Date(iso),
  );

function kindOf(subject: string) {
  if (subject.startsWith('OUT OF SERVICE')) return { label: 'OUT OF SERVICE', cls: 'bg-major text-on-major' };
  if (subject.startsWith('Back in service')) return { label: 'back in service', cls: 'border-2 border-pass text-pass' };
  if (subject.startsWith('Repair needed')) return { label: 'repair needed', cls: 'border-2 border-minor text-minor' };
  return { label: 'other', cls: 'border-2 border-edge/40' };
}

// What the local mail catcher received. With a real mail provider configured, there is nothing to show here.
export default async function CaughtMailPage({ searchParams }: { searchParams: Promise<{ to?: string }> }) {
  const admin = await requireRole('admin');
  const { to } = await searchParams;
  const { configured, messages } = await listCaughtMessages({ fleetId: admin.fleetId, to: to || undefined });
  return (
    <section className="space-y-4">
      <h1 className="text-3xl font-extrabold">Caught mail</h1>
      <p className="text-base text-muted">
        Messages of this fleet that the local mail catcher received instead of sending them out. Newest first.
      </p>
      <form className="flex flex-wrap items-end gap-2" method="get">
        <label className="flex flex-col text-sm font-bold">
          To address
          <input
            name="to"
            type="email"
            defaultValue={to ?? ''}
            className="rounded-md border-2 border-edge/50 bg-panel px-2 py-1.5 text-base"
          />
        </label>
        <button type="submit" className="rounded-lg border-slab border-edge bg-panel px-4 py-1.5 font-bold">
          Filter
        </button>
      </form>
      {!configured ? (
        <p className="rounded-lg border-slab border-edge bg-panel p-4">
          No mail catcher is configured: mail goes to the real provider, and its inbox is not read here.
        </p>
      ) : messages.length === 0 ? (
        <p className="rounded-lg border-slab border-edge bg-panel p-4">No message caught{to ? ` for ${to}` : ''}.</p>
      ) : (
        // Wider than a phone: a named stop in the tab order, so a keyboard can scroll it.
        <div
          className="overflow-x-auto rounded-lg border-slab border-edge bg-panel"
          tabIndex={0}
          role="region"
          aria-label="Caught messages"
        >
          <table className="w-full min-w-[760px] text-base">
            <thead className="text-left text-sm tracking-wide text-muted uppercase">
              <tr>
                <th className="px-3 py-2">Received</th>
                <th className="px-3 py-2">Kind</th>
                <th className="px-3 py-2">Subject</th>
                <th className="px-3 py-2">To</th>
              </tr>
            </thead>
            <tbody>
              {messages.map((m) => {
                const k = kindOf(m.subject);
                return (
                  <tr key={m.id} className="border-t border-edge/15 align-top" data-testid="caught-mail">
                    <td className="px-3 py-2 whitespace-nowrap tabular-nums">{when(m.receivedAt)}</td>
                    <td className="px-3 py-2">
                      <span className={`inline-block rounded px-2 text-sm font-extrabold whitespace-nowrap ${k.cls}`}>
                        {k.label}
                      </span>
                    </td>
                    <td className="px-3 py-2 font-bold">{m.subject}</td>
                    <td className="px-3 py-2 text-sm">{m.to.join(', ')}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
