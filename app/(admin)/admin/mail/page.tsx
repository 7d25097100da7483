import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { inputClass } from '@/components/ui/field';
import { Panel } from '@/components/ui/panel';
import { requireRole } from '@/lib/auth/guards';
import { listCaughtMessages } from '@/lib/services/mail/list-caught-messages';
import { CaughtMailTable } from './caught-mail-table';

export const metadata = { title: 'Caught mail' };
export const dynamic = 'force-dynamic';

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
          <input name="to" type="email" defaultValue={to ?? ''} className={inputClass} />
        </label>
        <Button type="submit" size="compact">
          Filter
        </Button>
      </form>
      {!configured ? (
        <Panel as="p">
          No mail catcher is configured: mail goes to the real provider, and its inbox is not read here.
        </Panel>
      ) : messages.length === 0 ? (
        <Panel padding="none">
          <EmptyState title={`No message caught${to ? ` for ${to}` : ''}.`} />
        </Panel>
      ) : (
        <CaughtMailTable messages={messages} />
      )}
    </section>
  );
}
