'use client';

import { useState } from 'react';
import { Field, FormNotice, inputClass } from '@/components/ui/field';
import { firstError, readFailure, type FieldErrors } from '@/components/admin/form-errors';
import { useRetireUnitMutation } from '@/lib/queries/admin';
import type { UnitDto } from '@/lib/schemas/units';
import { buttonClass } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';

/** Retiring is for good: a second, explicit step, with an optional reason for the record. */
export function RetirePanel({ unit }: { unit: UnitDto }) {
  const retire = useRetireUnitMutation(unit.id);
  const [confirming, setConfirming] = useState(false);
  const [reason, setReason] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const [failure, setFailure] = useState<string | null>(null);

  async function onRetire() {
    setFailure(null);
    try {
      await retire.mutateAsync({ reason: reason.trim() || undefined });
    } catch (err) {
      const f = readFailure(err);
      setErrors(f.fields);
      setFailure(f.message);
    }
  }

  return (
    <section aria-labelledby="retire-heading" className={`${panelClass({ padding: 'none' })} flex flex-col gap-3 p-4`}>
      <h2 id="retire-heading" className="text-xl font-extrabold">
        Retire this unit
      </h2>
      <p className="text-base text-muted">
        For a unit sold, scrapped or returned. Its inspections and repairs stay on record, its number is not reused, and
        drivers can no longer pick it.
      </p>
      {confirming ? (
        <div className={`flex flex-col gap-3 ${panelClass({ tone: 'major', padding: 'sm' })}`}>
          <Field id="retire-reason" label="Reason (optional)" error={firstError(errors, 'reason')}>
            {(c) => (
              <input
                {...c}
                className={inputClass}
                value={reason}
                onChange={(e) => setReason(e.target.value)}
                placeholder="e.g. sold, end of lease"
              />
            )}
          </Field>
          <div className="flex flex-wrap gap-2">
            <button
              type="button"
              className={buttonClass('danger', 'compact')}
              disabled={retire.isPending}
              onClick={() => void onRetire()}
            >
              Yes, retire unit {unit.unitNumber}
            </button>
            <button type="button" className={buttonClass('plain', 'compact')} onClick={() => setConfirming(false)}>
              Keep it
            </button>
          </div>
        </div>
      ) : (
        <div>
          <button type="button" className={buttonClass('plain', 'compact')} onClick={() => setConfirming(true)}>
            Retire…
          </button>
        </div>
      )}
      {failure ? <FormNotice kind="error">{failure}</FormNotice> : null}
    </section>
  );
}
