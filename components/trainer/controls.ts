// Dense office controls for the trainer screens (same palette and type as the rest).

export const fieldClass =
  'min-h-10 w-full rounded-md border-2 border-edge/60 bg-ground px-2 py-1 text-base text-ink focus:border-edge focus:outline-none';

export const chipClass =
  'inline-flex items-center gap-1 rounded-full border-2 border-edge/40 bg-ground px-2.5 py-0.5 text-sm';

export const pct = (x: number) => `${(x * 100).toFixed(1)} %`;
