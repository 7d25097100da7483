// A vocabulary term (component:condition) → its plain words and its severity under the
// inspection's rule profile. The phone reads it back, the server records it: the same call.
import { getFindingSeverity } from '@/lib/rules';
import type { Vocabulary } from '@/lib/schemas/grammar';

export type ResolvedTerm = {
  componentId: string;
  component: string;
  condition: string;
  severity: 'minor' | 'major';
  source: string | null;
};

/** A component:condition key → its words and severity under the rule profile; null if unknown. */
export function resolveTerm(vocab: Vocabulary, termKey: string, profile: string): ResolvedTerm | null {
  const [componentId, conditionId] = termKey.split(':');
  const component = vocab.components.find((c) => c.id === componentId);
  const condition = vocab.conditions.find((c) => c.id === conditionId);
  if (!component || !condition) return null;
  const pair = component.defects.find((d) => d.condition === condition.id);
  const sev = getFindingSeverity(
    { componentId: component.id, conditionId: condition.id, severity: pair?.severity, source: pair?.source },
    profile,
  );
  return {
    componentId: component.id,
    component: component.name,
    condition: condition.name,
    severity: sev.severity,
    source: sev.source,
  };
}
