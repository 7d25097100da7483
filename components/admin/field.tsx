import type { ReactNode } from 'react';

/**
 * A labelled form control with its hint and its error beside it. `children` receives the ids
 * to wire up: the control gets `id`, `aria-describedby` and `aria-invalid`.
 */
export function Field({
  id,
  label,
  hint,
  error,
  className = '',
  children,
}: {
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  className?: string;
  children: (control: { id: string; 'aria-describedby'?: string; 'aria-invalid': boolean }) => ReactNode;
}) {
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [errorId, hintId].filter(Boolean).join(' ') || undefined;
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-base font-bold">
        {label}
      </label>
      {children({ id, 'aria-describedby': describedBy, 'aria-invalid': Boolean(error) })}
      {error ? <FieldError id={errorId!} message={error} /> : null}
      {hint ? (
        <p id={hintId} className="text-sm text-muted">
          {hint}
        </p>
      ) : null}
    </div>
  );
}

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
