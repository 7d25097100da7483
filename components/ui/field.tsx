import type { ReactNode } from 'react';
import { cx } from './cx';

/** The office screens' text inputs and selects; an invalid one gets a thicker, red outline. */
export const inputClass =
  'min-h-12 w-full rounded-md border-2 border-edge bg-panel px-3 text-lg text-ink placeholder:text-muted aria-[invalid=true]:border-slab aria-[invalid=true]:border-major';

export const selectClass = `${inputClass} px-2`;

/** The driver's screens' text inputs: as tall as a slab button (64 px), for a gloved thumb. */
export const slabInputClass =
  'min-h-target w-full rounded-lg border-slab border-edge bg-panel px-4 text-xl text-ink placeholder:text-muted aria-[invalid=true]:border-major';

export type FieldControlProps = { id: string; 'aria-describedby'?: string; 'aria-invalid': boolean };

/**
 * A labelled form control with its hint and its error beside it. `children` receives the props
 * to spread on the control: `id`, `aria-describedby` (error, then hint) and `aria-invalid`.
 */
export function Field({
  id,
  label,
  hint,
  error,
  className,
  children,
}: {
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  className?: string;
  children: (control: FieldControlProps) => ReactNode;
}) {
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [errorId, hintId].filter(Boolean).join(' ') || undefined;
  return (
    <div className={cx('flex flex-col gap-1', className)}>
      <label htmlFor={id} className="text-base font-bold">
        {label}
      </label>
      {children({ id, 'aria-describedby': describedBy, 'aria-invalid': Boolean(error) })}
      {error ? <FieldError id={errorId} message={error} /> : null}
      {hint ? (
        <p id={hintId} className="text-sm text-muted">
          {hint}
        </p>
      ) : null}
    </div>
  );
}

/** One field's error: a glyph and words, not colour alone. */
export function FieldError({ id, message }: { id?: string; message: string }) {
  return (
    <p id={id} className="text-base font-bold text-major">
      <span aria-hidden="true">▲ </span>
      {message}
    </p>
  );
}

/** The message at the top of a form: what went wrong as a whole, or that it saved. */
export function FormNotice({ kind, children }: { kind: 'error' | 'saved'; children: ReactNode }) {
  return kind === 'error' ? (
    <p role="alert" className="rounded-md border-slab border-major bg-panel p-3 text-lg font-bold text-major">
      <span aria-hidden="true">▲ </span>
      {children}
    </p>
  ) : (
    <p role="status" className="rounded-md border-slab border-pass bg-panel p-3 text-lg font-bold text-pass">
      <span aria-hidden="true">✓ </span>
      {children}
    </p>
  );
}
