'use client';

import { createColumnHelper } from '@tanstack/react-table';
import { Table } from '@/components/ui/table';
import { TimeStamp } from '@/components/ui/time-stamp';

export type CaughtMailRow = { id: string; subject: string; to: string[]; receivedAt: string };

function kindOf(subject: string) {
  if (subject.startsWith('OUT OF SERVICE')) return { label: 'OUT OF SERVICE', cls: 'bg-major text-on-major' };
  if (subject.startsWith('Back in service')) return { label: 'back in service', cls: 'border-2 border-pass text-pass' };
  if (subject.startsWith('Repair needed')) return { label: 'repair needed', cls: 'border-2 border-minor text-minor' };
  return { label: 'other', cls: 'border-2 border-edge/40' };
}

const col = createColumnHelper<CaughtMailRow>();
const columns = [
  col.accessor('receivedAt', {
    header: 'Received',
    meta: { className: 'whitespace-nowrap tabular-nums' },
    cell: (c) => <TimeStamp iso={c.getValue()} />,
  }),
  col.accessor((m) => kindOf(m.subject).label, {
    id: 'kind',
    header: 'Kind',
    cell: ({ row }) => {
      const k = kindOf(row.original.subject);
      return (
        <span className={`inline-block rounded px-2 text-sm font-extrabold whitespace-nowrap ${k.cls}`}>{k.label}</span>
      );
    },
  }),
  col.accessor('subject', { header: 'Subject', meta: { className: 'font-bold', card: 'title' } }),
  col.accessor((m) => m.to.join(', '), { id: 'to', header: 'To', meta: { className: 'text-sm' } }),
];

/** What the local mail catcher received, newest first; sortable by any column. */
export function CaughtMailTable({ messages }: { messages: CaughtMailRow[] }) {
  return (
    <Table
      label="Caught messages"
      data={messages}
      columns={columns}
      getRowId={(m) => m.id}
      wide
      tableClassName="sm:min-w-[760px]"
      rowProps={() => ({ 'data-testid': 'caught-mail' })}
    />
  );
}
