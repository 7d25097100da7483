'use client';

import { useQuery } from '@tanstack/react-query';
import { FormNotice } from '@/components/ui/field';
import { adminUsersQuery } from '@/lib/queries/admin';
import { InviteForm } from './invite-form';
import { PersonRow } from './person-row';
import { panelClass } from '@/components/ui/panel';

export function UsersClient({ selfId }: { selfId: string }) {
  const { data: users, error, isPending } = useQuery(adminUsersQuery());
  const active = users?.filter((u) => u.active).length ?? 0;
  return (
    <div className="flex flex-col gap-4">
      <header>
        <h1 className="text-3xl font-extrabold">People</h1>
        <p className="text-lg text-muted">{users ? `${active} active, ${users.length - active} deactivated` : ' '}</p>
      </header>
      <div className="grid items-start gap-6 lg:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="lg:col-start-2 lg:row-start-1">
          <InviteForm />
        </div>
        <section
          aria-label="Everyone in the fleet"
          className={`${panelClass({ padding: 'none' })} px-4 lg:col-start-1 lg:row-start-1`}
        >
          {error ? <FormNotice kind="error">{error.message}</FormNotice> : null}
          {isPending ? <p className="py-4 text-lg">Loading people…</p> : null}
          <ul>
            {users?.map((u) => (
              <PersonRow key={u.id} person={u} isSelf={u.id === selfId} />
            ))}
          </ul>
        </section>
      </div>
    </div>
  );
}
