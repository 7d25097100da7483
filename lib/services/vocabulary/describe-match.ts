import 'server-only';
import type { MatchResult } from '@/lib/matcher';
import type { BenchMatch } from '@/lib/schemas/vocabulary';

/** A reading in a trainer's words: "steer tire, bulge", "command: next", "tire pressure 95 psi". */
export function describeMatch(r: MatchResult): BenchMatch {
  const label =
    r.kind === 'defect'
      ? [r.component, r.condition].filter(Boolean).join(', ')
      : r.kind === 'command' || r.kind === 'ok'
        ? `command: ${r.command ?? 'ok'}${r.component ? ` (${r.component})` : ''}`
        : r.kind === 'measurement'
          ? `${(r.measure ?? 'reading').replace(/_/g, ' ')} ${r.value ?? '?'} ${r.unit ?? ''}`.trim()
          : 'nothing matched';
  return {
    kind: r.kind,
    termId: r.termId,
    label,
    score: r.score,
    needsConfirmation: r.needsConfirmation,
    position: r.position,
    severity: r.severity,
    value: r.value,
    unit: r.unit,
    alternatives: r.alternatives.map((a) => ({
      termId: a.termId,
      label: [a.component, a.condition].filter(Boolean).join(', '),
      score: a.score,
    })),
  };
}
