import type { ButtonHTMLAttributes, ReactNode } from 'react';

type Tone = 'primary' | 'plain' | 'danger';

const tones: Record<Tone, string> = {
  primary: 'bg-vest text-on-vest border-edge',
  plain: 'bg-panel text-ink border-edge',
  danger: 'bg-major text-on-major border-edge',
};

export const slabClass = (tone: Tone = 'plain') =>
  `flex min-h-target w-full items-center justify-center gap-3 rounded-lg border-slab px-5 py-3 text-xl font-bold tracking-wide ${tones[tone]} active:translate-y-px disabled:opacity-60`;

/** A full-width slab with a thick outline: at least 64 px high, for a gloved thumb. */
export function SlabButton({
  tone = 'plain',
  children,
  className = '',
  ...rest
}: ButtonHTMLAttributes<HTMLButtonElement> & { tone?: Tone; children: ReactNode }) {
  return (
    <button type="button" className={`${slabClass(tone)} ${className}`} {...rest}>
      {children}
    </button>
  );
}
