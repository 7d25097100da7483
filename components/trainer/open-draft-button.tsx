'use client';

import { useOpenDraftMutation } from '@/lib/queries/vocabulary';
import { buttonClass } from '@/components/ui/button';

/** Opens the fleet's draft (a copy of the newest published version). */
export function OpenDraftButton({ label = 'Open a draft' }: { label?: string }) {
  const open = useOpenDraftMutation();
  return (
    <span className="inline-flex flex-col gap-1">
      <button
        type="button"
        className={buttonClass('primary', 'compact')}
        disabled={open.isPending}
        onClick={() => open.mutate()}
      >
        {open.isPending ? 'Opening…' : label}
      </button>
      {open.error && (
        <span role="alert" className="text-sm font-bold text-major">
          {open.error.message}
        </span>
      )}
    </span>
  );
}
