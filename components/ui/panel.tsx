import type { ComponentPropsWithoutRef, ElementType } from 'react';
import { cx } from './cx';

export type PanelPadding = 'none' | 'sm' | 'md';
export type PanelTone = 'edge' | 'quiet' | 'major' | 'minor' | 'pass';

const paddings: Record<PanelPadding, string> = { none: '', sm: 'p-3', md: 'p-4' };
const tones: Record<PanelTone, string> = {
  edge: 'border-slab border-edge',
  quiet: 'border-2 border-edge/30',
  major: 'border-slab border-major',
  minor: 'border-slab border-minor',
  pass: 'border-slab border-pass',
};

/** Classes of a raised surface, for elements that cannot be a Panel. */
export function panelClass({ padding = 'md', tone = 'edge' }: { padding?: PanelPadding; tone?: PanelTone } = {}) {
  return cx('rounded-lg bg-panel', tones[tone], paddings[padding]);
}

type PanelOwnProps<T extends ElementType> = {
  as?: T;
  padding?: PanelPadding;
  tone?: PanelTone;
  className?: string;
};

/** A raised surface with a thick outline: the box every screen groups its content in. */
export function Panel<T extends ElementType = 'div'>({
  as,
  padding = 'md',
  tone = 'edge',
  className,
  ...rest
}: PanelOwnProps<T> & Omit<ComponentPropsWithoutRef<T>, keyof PanelOwnProps<T>>) {
  const Tag: ElementType = as ?? 'div';
  return <Tag className={cx(panelClass({ padding, tone }), className)} {...rest} />;
}
