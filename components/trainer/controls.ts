// Dense office controls for the trainer screens (same palette and type as the rest).

export const buttonClass = (tone: 'primary' | 'plain' | 'danger' = 'plain') =>
  `inline-flex min-h-10 shrink-0 items-center whitespace-nowrap justify-center gap-2 rounded-md border-2 border-edge px-3 py-1.5 text-base font-bold disabled:opacity-50 ${
    tone === 'primary'
      ? 'bg-vest text-on-vest'
      : tone === 'danger'
        ? 'bg-major text-on-major'
        : 'bg-panel text-ink hover:bg-ground'
  }`;

export const fieldClass =
  'min-h-10 w-full rounded-md border-2 border-edge/60 bg-ground px-2 py-1 text-base text-ink focus:border-edge focus:outline-none';

export const cardClass = 'rounded-lg border-2 border-edge/25 bg-panel p-4';

export const chipClass =
  'inline-flex items-center gap-1 rounded-full border-2 border-edge/40 bg-ground px-2.5 py-0.5 text-sm';

export const pct = (x: number) => `${(x * 100).toFixed(1)} %`;
