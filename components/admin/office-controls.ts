// Class names for the admin (office) screens: denser than the walk, same palette and outlines.

export const inputClass =
  'min-h-12 w-full rounded-md border-2 border-edge bg-panel px-3 text-lg text-ink placeholder:text-muted aria-[invalid=true]:border-major aria-[invalid=true]:border-slab';

export const selectClass = `${inputClass} px-2`;

type Tone = 'primary' | 'plain' | 'danger' | 'quiet';

const tones: Record<Tone, string> = {
  primary: 'bg-vest text-on-vest border-edge',
  plain: 'bg-panel text-ink border-edge',
  danger: 'bg-major text-on-major border-edge',
  quiet: 'bg-transparent text-ink border-transparent underline underline-offset-4 hover:border-edge',
};

/** A compact slab for office screens: 48 px high, thick outline. */
export const officeButtonClass = (tone: Tone = 'plain') =>
  `inline-flex min-h-12 items-center justify-center gap-2 rounded-md border-slab px-4 text-lg font-bold ${tones[tone]} active:translate-y-px disabled:opacity-60`;

export const panelClass = 'rounded-lg border-slab border-edge bg-panel';
