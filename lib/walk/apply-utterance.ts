// What one understood utterance (or tap) does to the walk: the steps to record and what to say
// back. Pure: the matcher's reading in, a decision out, so that voice, typing, taps, the server
// and tests all go through the same door.
import vocabulary from '@/grammars/vocabulary.json' with { type: 'json' };
import type { MatchAlternative, MatchResult } from '@/lib/matcher';
import type { Vocabulary, ZoneItem } from '@/lib/schemas/grammar';
import { judgeReading, measureUnit, type CheckContext } from './check-input';
import { findUndoableStep, mapItemAnswers, type ItemAnswer, type ProgressStep } from './progress';
import { resolveTerm } from './severity';
import { notCheckedReasonLabel, type NotCheckedReason, type ReadingInput, type StepKind } from './step';
import type { WalkZone } from './zones';

/** A step as the walk builds it; the store adds its id, order and device time. */
export type StepDraft = {
  zone: string;
  item: string | null;
  kind: StepKind;
  heard: string | null;
  alternatives: string[];
  inputMode: 'voice' | 'tap' | 'typed';
  termKey: string | null;
  position: string | null;
  score: number | null;
  resolution: 'auto' | 'confirmed' | 'corrected' | null;
  undoesStepId: string | null;
  reading: ReadingInput | null;
  notCheckedReason: NotCheckedReason | null;
  note: string | null;
  // Shown on the device; the server works these out again and its answer is the one recorded.
  label?: string;
  verdict?: 'pass' | 'fail' | null;
  severity?: 'minor' | 'major' | null;
  limit?: string | null;
  source?: string | null;
  message?: string | null;
};

/** A match that waits for the driver's "yes" or a pick among the alternatives. */
export type PendingMatch = {
  heard: string;
  alternatives: string[];
  inputMode: 'voice' | 'typed';
  top: {
    termKey: string;
    component: string;
    condition: string;
    position: string | null;
    severity: 'minor' | 'major' | null;
    score: number;
    itemId: string | null;
  };
  others: MatchAlternative[];
  /** After a "no": the alternatives are shown as buttons. */
  declined: boolean;
};

export type WalkContext = {
  zones: readonly WalkZone[];
  zoneIndex: number;
  steps: readonly ProgressStep[];
  pending: PendingMatch | null;
  vocabulary: Vocabulary;
  profile: string;
  checkContext: CheckContext;
};

/** What the walk does next. Fields left out change nothing. */
export type WalkOutcome = {
  record: StepDraft[];
  /** Spoken (and shown large) after the steps are recorded. */
  say: string | null;
  /** Shown large, when it differs from what is spoken ('' shows nothing new: a question has its own panel). */
  show?: string;
  moveTo?: number;
  /** null clears the question waiting for a yes; a value asks one. */
  pending?: PendingMatch | null;
  declinePending?: true;
  /** Screen actions the core cannot do itself. */
  action?: 'photo' | 'pause' | 'review';
};

const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
export const formatReading = (value: number, unit: string) =>
  unit === '32nds' ? `${value}/32 in` : `${value} ${unit}`;

/** A step draft with nothing but its zone: the fields each kind of step fills in start empty. */
export const blankStep = (zone: string): Omit<StepDraft, 'kind' | 'inputMode'> => ({
  zone,
  item: null,
  heard: null,
  alternatives: [],
  termKey: null,
  position: null,
  score: null,
  resolution: null,
  undoesStepId: null,
  reading: null,
  notCheckedReason: null,
  note: null,
});

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

// ---- one step each: the same builders serve taps and voice

/** A reading at an item, judged as the server will judge it. */
export function recordReading(
  ctx: Pick<WalkContext, 'profile' | 'checkContext'>,
  zoneId: string,
  item: ZoneItem,
  value: number,
  via: { inputMode: StepDraft['inputMode']; heard: string | null },
): WalkOutcome {
  const unit = measureUnit[item.measure!];
  const verdict = judgeReading(item, { value }, ctx.checkContext, ctx.profile);
  if (!verdict.judged && verdict.error) return { record: [], say: null, show: `▲ ${verdict.error}` };
  const r = verdict.judged ? verdict.result : null;
  const text = `${cap(item.label)}, ${formatReading(value, unit)}. ${r ? (r.verdict === 'pass' ? 'Pass.' : r.severity === 'major' ? 'Major defect.' : 'Minor defect.') : 'Recorded.'}`;
  return {
    record: [
      {
        ...blankStep(zoneId),
        item: item.id,
        kind: 'measurement',
        heard: via.heard,
        inputMode: via.inputMode,
        reading: { value },
        label: `${item.label}: ${formatReading(value, unit)}`,
        verdict: r?.verdict ?? null,
        severity: r?.severity ?? null,
        limit: r?.limit != null ? `${r.limit} ${r.unit}` : null,
        source: r?.source ?? null,
        message: r?.message ?? null,
      },
    ],
    say: text,
  };
}

export type FindingInput = {
  termKey: string;
  position: string | null;
  score: number | null;
  resolution: StepDraft['resolution'];
  heard: string | null;
  alternatives: string[];
  inputMode: StepDraft['inputMode'];
  itemId: string | null;
};

/** A finding, with its severity under the inspection's rule profile. */
export function recordFinding(
  ctx: Pick<WalkContext, 'vocabulary' | 'profile'>,
  zoneId: string,
  f: FindingInput,
): WalkOutcome {
  const term = resolveTerm(ctx.vocabulary, f.termKey, ctx.profile);
  const [componentId, conditionId] = f.termKey.split(':');
  const words = {
    component: term?.component ?? componentId ?? '',
    condition: term?.condition ?? conditionId ?? '',
    position: f.position,
    severity: term?.severity ?? 'major',
  };
  return {
    record: [
      {
        ...blankStep(zoneId),
        item: f.itemId,
        kind: 'defect',
        termKey: f.termKey,
        position: f.position,
        score: f.score,
        resolution: f.resolution,
        heard: f.heard,
        alternatives: f.alternatives,
        inputMode: f.inputMode,
        label: `${words.component}, ${words.condition}`,
        severity: words.severity,
      },
    ],
    say: readBackFinding(words),
    pending: null,
  };
}

/** One visual item OK. An item that needs a reading is answered by a number or "not checked". */
export function recordItemOk(
  zoneId: string,
  item: ZoneItem,
  via: { inputMode: StepDraft['inputMode']; heard: string | null; score?: number | null },
): WalkOutcome {
  if (item.measure)
    return { record: [], say: `${cap(item.label)} needs a reading: say or type the number, or mark it not checked.` };
  return {
    record: [
      {
        ...blankStep(zoneId),
        item: item.id,
        kind: 'ok',
        heard: via.heard,
        inputMode: via.inputMode,
        score: via.score ?? null,
        resolution: via.heard ? 'auto' : null,
        label: `${item.label}: OK`,
      },
    ],
    say: null,
    show: `${item.label}: OK.`,
  };
}

/** An item the driver could not check, with the reason from the list. */
export function recordNotChecked(
  zoneId: string,
  item: ZoneItem,
  reason: NotCheckedReason,
  note: string | null,
): WalkOutcome {
  const why = reason === 'other' ? (note ?? 'other') : notCheckedReasonLabel[reason];
  return {
    record: [
      {
        ...blankStep(zoneId),
        item: item.id,
        kind: 'not_checked',
        inputMode: 'tap',
        notCheckedReason: reason,
        note: reason === 'other' ? note : null,
        label: `${item.label}: not checked (${why})`,
      },
    ],
    say: null,
    show: `${cap(item.label)}: not checked, ${why}.`,
  };
}

/**
 * "All good here": the zone's visual items that are still open become OK; readings are never
 * answered this way. The walk moves on when nothing the fleet requires is left open in the zone.
 */
export function recordZoneOk(
  ctx: Pick<WalkContext, 'zones' | 'zoneIndex' | 'steps'> & { isRequired?: (item: ZoneItem) => boolean },
  via: { inputMode: StepDraft['inputMode']; heard: string | null },
): WalkOutcome {
  const zone = ctx.zones[ctx.zoneIndex]!;
  const answers = mapItemAnswers(ctx.zones, ctx.steps);
  const readingsLeft = zone.items.filter((i) => i.measure && !answers.has(i.id) && (ctx.isRequired?.(i) ?? false));
  const last = ctx.zoneIndex >= ctx.zones.length - 1;
  const step: StepDraft = {
    ...blankStep(zone.id),
    kind: 'zone_ok',
    heard: via.heard,
    inputMode: via.inputMode,
    score: via.heard ? 1 : null,
    resolution: via.heard ? 'auto' : null,
    label: `${zone.name}: all good (visual items)`,
  };
  if (readingsLeft.length)
    return {
      record: [step],
      say: `${zone.name}: visual items good. Still to read: ${readingsLeft.map((i) => i.label).join(', ')}.`,
    };
  return {
    record: [step],
    say: last ? `${zone.name}: all good. Last zone done. Review and sign.` : `${zone.name}: all good.`,
    ...(last ? {} : { moveTo: ctx.zoneIndex + 1 }),
  };
}

/** "Undo": take back the last step that counts. */
export function recordTakeBack(
  steps: readonly (ProgressStep & { label?: string })[],
  inputMode: StepDraft['inputMode'],
): WalkOutcome {
  const target = findUndoableStep(steps);
  if (!target) return { record: [], say: 'Nothing to take back.' };
  const what = target.label ?? target.kind;
  return {
    record: [
      {
        ...blankStep(target.zone),
        kind: 'undo',
        undoesStepId: target.id,
        heard: inputMode === 'voice' ? 'undo' : null,
        inputMode,
        label: `took back: ${what}`,
      },
    ],
    say: `Took back: ${what}.`,
  };
}

// ---- the spoken word

const defaultVocabulary = vocabulary as unknown as Vocabulary;

/**
 * Words that only acknowledge: "ok", "good", "fine", "looks good", "pass". Said alone they answer
 * the last question and nothing else; a zone closes on "all good (here)", "front is good" or a tap.
 */
const bareWords = new Set([
  'ok',
  'okay',
  'good',
  'fine',
  'clear',
  'pass',
  'passed',
  'passes',
  'alright',
  'great',
  'yes',
  'yeah',
  'yep',
  'looks',
  'look',
  'it',
  'its',
  "it's",
  'is',
  'that',
  "that's",
  'thats',
  's',
  'checks',
  'out',
  'sounds',
  'um',
  'uh',
  'very',
]);
export function isBareAcknowledgement(input: string): boolean {
  const words = input
    .toLowerCase()
    .replace(/\ball right\b/g, 'alright')
    .replace(/[^a-z' ]+/g, ' ')
    .split(/\s+/)
    .filter(Boolean);
  return words.length > 0 && words.every((w) => bareWords.has(w));
}

/** The first open item of the zone: where a bare reading or "flat" applies. */
export function findFocusItem(zone: WalkZone, answers: ReadonlyMap<string, ItemAnswer>) {
  return zone.items.find((i) => !answers.has(i.id)) ?? null;
}

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

/** The item a measurement belongs to in this zone: by test mode, then component, then the first open one. */
function findReadingItem(result: MatchResult, zone: WalkZone, answers: ReadonlyMap<string, ItemAnswer>) {
  const candidates = zone.items.filter((i) => i.measure === result.measure);
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
  return pool.find((i) => !answers.has(i.id)) ?? pool[0] ?? null;
}

/**
 * What one utterance does to the walk. `heard` is what the recogniser returned (its
 * alternatives), `result` the matcher's reading of it in the current zone.
 */
export function applyUtterance(
  ctx: WalkContext & { isRequired?: (item: ZoneItem) => boolean },
  result: MatchResult,
  heard: { alternatives: string[]; inputMode: 'voice' | 'typed' },
): WalkOutcome {
  const zone = ctx.zones[ctx.zoneIndex]!;
  const text = heard.alternatives[0] ?? result.input;
  const via = { inputMode: heard.inputMode, heard: text };
  const waiting = ctx.pending;
  const answers = mapItemAnswers(ctx.zones, ctx.steps);
  const confirm = (w: PendingMatch) =>
    recordFinding(ctx, zone.id, {
      ...w.top,
      resolution: 'confirmed',
      heard: w.heard,
      alternatives: w.alternatives,
      inputMode: w.inputMode,
    });

  // A "did you mean" waits: yes, a bare "ok", or no.
  if (waiting) {
    if (result.kind === 'command' && result.command === 'yes') return confirm(waiting);
    if (result.kind === 'ok' && !result.componentId && isBareAcknowledgement(text)) return confirm(waiting);
    if (result.kind === 'command' && result.command === 'no')
      return { record: [], say: 'Pick one, or say it again.', show: '', declinePending: true };
  }
  const cleared = waiting ? { pending: null } : {};

  if (result.kind === 'ok' || (result.kind === 'command' && result.command === 'ok')) {
    if (result.componentId) {
      const item =
        zone.items.find((i) => i.component === result.componentId && !i.measure) ??
        zone.items.find((i) => i.component === result.componentId);
      if (item) return { ...recordItemOk(zone.id, item, { ...via, score: result.score }), ...cleared };
    }
    if (isBareAcknowledgement(text))
      // A bare "ok" answers the last thing said (a read-back) and nothing else.
      return {
        record: [],
        say: null,
        show: 'OK. To close the zone say “all good here” or tap “All good here”.',
        ...cleared,
      };
    return { ...recordZoneOk(ctx, via), ...cleared };
  }
  if (result.kind === 'command' && result.command) {
    switch (result.command) {
      case 'yes':
      case 'no':
        return { record: [], say: 'Nothing waits for a yes or no.', ...cleared };
      case 'next':
        return { record: [], say: null, moveTo: Math.min(ctx.zones.length - 1, ctx.zoneIndex + 1), ...cleared };
      case 'previous':
        return { record: [], say: null, moveTo: Math.max(0, ctx.zoneIndex - 1), ...cleared };
      case 'repeat':
        return { record: [], say: `${zone.name}. ${zone.items.map((i) => i.label).join(', ')}.`, ...cleared };
      case 'undo':
        return { ...recordTakeBack(ctx.steps, heard.inputMode), ...cleared };
      case 'photo':
        return { record: [], say: null, action: 'photo', ...cleared };
      case 'pause':
        return { record: [], say: null, show: 'Paused. Tap Listen to go on.', action: 'pause', ...cleared };
      case 'finish':
        return { record: [], say: null, action: 'review', ...cleared };
    }
  }
  if (result.kind === 'measurement' && result.value !== null && result.measure) {
    const item = findReadingItem(result, zone, answers);
    if (!item)
      return {
        record: [],
        say: 'No reading of that kind here.',
        show: `No ${result.measure.replace(/_/g, ' ')} to read in this zone.`,
        ...cleared,
      };
    return { ...recordReading(ctx, zone.id, item, result.value, via), ...cleared };
  }
  if (result.kind === 'defect' && result.termId && result.component && result.condition) {
    const itemId = zone.items.find((i) => i.component === result.componentId && !i.measure)?.id ?? null;
    if (result.needsConfirmation) {
      const term = resolveTerm(ctx.vocabulary, result.termId, ctx.profile);
      return {
        record: [],
        say: `Did you mean ${result.component}, ${result.condition}? Yes or no.`,
        show: '',
        pending: {
          heard: text,
          alternatives: heard.alternatives,
          inputMode: heard.inputMode,
          top: {
            termKey: result.termId,
            component: result.component,
            condition: result.condition,
            position: result.position,
            severity: term?.severity ?? result.severity,
            score: result.score,
            itemId,
          },
          others: listChoices(
            { termKey: result.termId, heard: result.input },
            result.alternatives,
            zone,
            ctx.vocabulary,
          ),
          declined: false,
        },
      };
    }
    return recordFinding(ctx, zone.id, {
      termKey: result.termId,
      position: result.position,
      score: result.score,
      resolution: 'auto',
      heard: text,
      alternatives: heard.alternatives,
      inputMode: heard.inputMode,
      itemId,
    });
  }
  // Kept for the trainers: what the vocabulary did not catch.
  return {
    record:
      heard.inputMode === 'voice'
        ? [
            {
              ...blankStep(zone.id),
              kind: 'note',
              heard: text,
              alternatives: heard.alternatives,
              inputMode: 'voice',
              label: `not understood: ${text}`,
            },
          ]
        : [],
    say: 'Not understood.',
    show: `Not understood: “${text}”. Say it again or tap.`,
    ...cleared,
  };
}
