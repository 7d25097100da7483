// What the walk does with one understood utterance. Pure: the matcher's reading in, a decision
// out, so that voice, typing and tests all go through the same door.
import vocabulary from '@/grammars/vocabulary.json' with { type: 'json' };
import type { MatchAlternative, MatchResult, WalkZone } from '@/lib/matcher';
import type { CommandId, Vocabulary } from '@/lib/schemas/grammar';
import type { ItemAnswer } from './walk-progress';

export type Decision =
  | { do: 'zone_ok' }
  | { do: 'item_ok'; itemId: string }
  | { do: 'command'; command: CommandId }
  | { do: 'reading'; itemId: string; value: number }
  | { do: 'no_reading_here'; measure: string }
  | {
      do: 'finding';
      termKey: string;
      component: string;
      condition: string;
      position: string | null;
      severity: 'minor' | 'major' | null;
      score: number;
      needsConfirmation: boolean;
      alternatives: MatchAlternative[];
      itemId: string | null;
    }
  | { do: 'not_understood' };

/** The first open item of the zone: where a bare reading or "flat" applies. */
export function findFocusItem(zone: WalkZone, answers: ReadonlyMap<string, ItemAnswer>) {
  return zone.items.find((i) => !answers.has(i.id)) ?? null;
}

const defaultVocabulary = vocabulary as unknown as Vocabulary;

/**
 * Choices to offer after a "no": the matcher's runners-up, then the zone's other components that
 * can have the same condition, then other conditions of the same component.
 */
export function listChoices(
  top: { termKey: string; heard?: string },
  matcherAlternatives: readonly MatchAlternative[],
  zone: WalkZone,
  vocab: Vocabulary = defaultVocabulary,
  max = 4,
): MatchAlternative[] {
  const [componentId, conditionId] = top.termKey.split(':');
  const seen = new Set([top.termKey, ...matcherAlternatives.map((a) => a.termId)]);
  const out = [...matcherAlternatives];
  const conditionName = (id: string) => vocab.conditions.find((c) => c.id === id)?.name ?? id;
  const add = (compId: string, condId: string) => {
    const comp = vocab.components.find((c) => c.id === compId);
    const key = `${compId}:${condId}`;
    if (!comp || seen.has(key) || !comp.defects.some((d) => d.condition === condId)) return;
    seen.add(key);
    out.push({ termId: key, component: comp.name, condition: conditionName(condId), score: 0 });
  };
  for (const item of zone.items) add(item.component, conditionId ?? '');
  // Zone components the driver named: their conditions, the same one first.
  const heard = ` ${(top.heard ?? '').toLowerCase()} `;
  for (const item of zone.items) {
    const comp = vocab.components.find((c) => c.id === item.component);
    if (
      !comp ||
      !comp.phrases.some((p) => heard.includes(` ${p.toLowerCase()} `) || heard.includes(` ${p.toLowerCase()}s `))
    )
      continue;
    const conds = comp.defects.map((d) => d.condition);
    for (const c of [
      ...conds.filter((c) => c === conditionId || c.includes(conditionId ?? '-') || (conditionId ?? '').includes(c)),
      ...conds,
    ])
      add(comp.id, c);
  }
  for (const d of vocab.components.find((c) => c.id === componentId)?.defects ?? [])
    add(componentId ?? '', d.condition);
  return out.slice(0, max);
}

/** `vocab` is the inspection's own vocabulary version (the default files when not given). */
export function decideFromMatch(
  result: MatchResult,
  zone: WalkZone,
  answers: ReadonlyMap<string, ItemAnswer>,
  vocab: Vocabulary = defaultVocabulary,
): Decision {
  switch (result.kind) {
    case 'command':
      return result.command === 'ok'
        ? { do: 'zone_ok' }
        : result.command
          ? { do: 'command', command: result.command }
          : { do: 'not_understood' };
    case 'ok': {
      if (result.componentId) {
        const item =
          zone.items.find((i) => i.component === result.componentId && !i.measure) ??
          zone.items.find((i) => i.component === result.componentId);
        if (item) return { do: 'item_ok', itemId: item.id };
      }
      return { do: 'zone_ok' };
    }
    case 'measurement': {
      if (result.value === null || !result.measure) return { do: 'not_understood' };
      const candidates = zone.items.filter(
        (i) =>
          i.measure === result.measure || (result.measure === 'ground_clearance' && i.measure === 'ground_clearance'),
      );
      // The two leakage tests differ only in the brakes: "applied" or "released".
      const words = result.input.toLowerCase();
      const leakMode = /\b(applied|apply|pressed|held|holding|foot on|on the brake)/.test(words)
        ? 'applied'
        : /\b(released|release|static|off the brake|brakes off)/.test(words)
          ? 'static'
          : null;
      const byMode = leakMode ? candidates.filter((i) => i.id.includes(leakMode)) : [];
      const byComponent = byMode.length
        ? byMode
        : result.componentId
          ? candidates.filter((i) => i.component === result.componentId)
          : candidates;
      const pool = byComponent.length ? byComponent : candidates;
      const item = pool.find((i) => !answers.has(i.id)) ?? pool[0];
      return item
        ? { do: 'reading', itemId: item.id, value: result.value }
        : { do: 'no_reading_here', measure: result.measure };
    }
    case 'defect': {
      if (!result.termId || !result.component || !result.condition) return { do: 'not_understood' };
      const item = zone.items.find((i) => i.component === result.componentId) ?? null;
      return {
        do: 'finding',
        termKey: result.termId,
        component: result.component,
        condition: result.condition,
        position: result.position,
        severity: result.severity,
        score: result.score,
        needsConfirmation: result.needsConfirmation,
        alternatives: result.needsConfirmation
          ? listChoices({ termKey: result.termId, heard: result.input }, result.alternatives, zone, vocab)
          : result.alternatives,
        itemId: item?.id ?? null,
      };
    }
    default:
      return { do: 'not_understood' };
  }
}

const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** What the app says back after recording a finding, short enough to hear over an idling engine. */
export function readBackFinding(f: {
  component: string;
  condition: string;
  position: string | null;
  severity: 'minor' | 'major' | null;
}): string {
  const where = f.position ? `${f.position} ` : '';
  const sev = f.severity === 'major' ? ' Major: out of service.' : f.severity === 'minor' ? ' Minor.' : '';
  return `${cap(where + f.component)}, ${f.condition}.${sev}`;
}
