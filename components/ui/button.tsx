import type { ButtonHTMLAttributes, ReactNode } from 'react';
import { cx } from './cx';

export type ButtonTone = 'primary' | 'plain' | 'danger' | 'quiet';
export type ButtonSize = 'slab' | 'touch' | 'compact';

const tones: Record<ButtonTone, string> = {
  primary: 'border-edge bg-vest text-on-vest',
  plain: 'border-edge bg-panel text-ink hover:bg-ground',
  danger: 'border-edge bg-major text-on-major',
  quiet: 'border-transparent bg-transparent text-ink underline underline-offset-4 hover:border-edge',
};

const sizes: Record<ButtonSize, string> = {
  // The walk: a full-width slab at least 64 px high, for a gloved thumb.
  slab: 'min-h-target w-full gap-3 rounded-lg px-5 py-3 text-xl tracking-wide',
  // The same height beside a text field on the walk: as wide as its words.
  touch: 'min-h-target min-w-target shrink-0 gap-3 rounded-lg px-4 text-xl',
  // Office screens: denser, still 44 px or more.
  compact: 'min-h-11 shrink-0 gap-2 rounded-md px-4 py-1.5 text-base',
};

/**
 * The one button look: a thick outline, the vest colour for the one primary action of a screen.
 * Also for links that act as buttons (`<Link className={buttonClass('primary')}>`).
 * Focus rings come from the global `:focus-visible` rule.
 */
export function buttonClass(tone: ButtonTone = 'plain', size: ButtonSize = 'slab'): string {
  return cx(
    'inline-flex items-center justify-center border-slab text-center font-bold active:translate-y-px disabled:cursor-not-allowed disabled:opacity-60',
    sizes[size],
    tones[tone],
  );
}

export function Button({
  tone = 'plain',
  size = 'slab',
  type = 'button',
  className,
  children,
  ...rest
}: ButtonHTMLAttributes<HTMLButtonElement> & { tone?: ButtonTone; size?: ButtonSize; children: ReactNode }) {
  return (
    <button type={type} className={cx(buttonClass(tone, size), className)} {...rest}>
      {children}
    </button>
  );
}
