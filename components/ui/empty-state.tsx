import type { ReactNode } from 'react';
import { cx } from './cx';

/** What a list or table shows when it has nothing: a sentence, and what to do about it. */
export function EmptyState({
  title,
  children,
  action,
  className,
}: {
  title: ReactNode;
  children?: ReactNode;
  action?: ReactNode;
  className?: string;
}) {
  return (
    <div className={cx('flex flex-col items-start gap-2 px-4 py-6 text-muted', className)} data-empty-state="">
      <p className="text-lg font-bold">{title}</p>
      {children ? <div className="text-base">{children}</div> : null}
      {action}
    </div>
  );
}
