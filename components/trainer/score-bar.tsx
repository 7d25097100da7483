import { CONFIRM_THRESHOLD } from '@/lib/matcher';

/** A match score as a number and a bar with the "ask the driver" mark; the words say which side it is on. */
export function ScoreBar({ score }: { score: number }) {
  const sure = score >= CONFIRM_THRESHOLD;
  return (
    <span className="inline-flex items-center gap-2 tabular-nums">
      <span className="relative inline-block h-2.5 w-24 rounded-sm bg-ground ring-1 ring-edge/40" aria-hidden>
        <span
          className={`absolute inset-y-0 left-0 rounded-sm ${sure ? 'bg-pass' : 'bg-minor'}`}
          style={{ width: `${Math.round(score * 100)}%` }}
        />
        <span className="absolute inset-y-[-3px] w-0.5 bg-ink" style={{ left: `${CONFIRM_THRESHOLD * 100}%` }} />
      </span>
      <span className="font-bold">{score.toFixed(2)}</span>
      <span className="text-sm text-muted">{score === 0 ? '' : sure ? 'sure' : 'asks “did you mean”'}</span>
    </span>
  );
}
