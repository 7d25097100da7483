import 'server-only';
import { getDb } from '@/lib/db';
import { resolveFieldUtterances, updateDraftGrammar as writeDraftGrammar } from '@/lib/db/vocabulary';
import { AppError } from '@/lib/errors';
import { createMatcher, createNormalizer } from '@/lib/matcher';
import type { Grammar } from '@/lib/schemas/grammar';
import type { AddPhraseBody } from '@/lib/schemas/vocabulary';
import { addPhraseBodySchema } from '@/lib/schemas/vocabulary';
import { describeMatch } from './describe-match';
import { getDraftVersionOrThrow, getVocabularyVersionOrThrow } from './get-vocabulary-version-or-throw';
import { recordAudit } from '../platform/record-audit';

type Slot = 'component' | 'condition';

// Words that carry no trade meaning in a finding ("there's a … on the …").
const glue = new Set([
  'the',
  'a',
  'an',
  'is',
  'are',
  'was',
  'on',
  'of',
  'my',
  'it',
  'its',
  'there',
  'theres',
  'got',
  'gotten',
  'has',
  'have',
  'this',
  'that',
  'in',
  'at',
  'to',
  'and',
  'be',
  'been',
  'some',
  's',
  'i',
  'we',
  'with',
  'looks',
  'look',
  'like',
  'kind',
  'sort',
  'bit',
  'little',
  'pretty',
  'real',
  'really',
  'just',
]);

/** The component and condition of a term key; 422 when the vocabulary has no such defect. */
export function findTermOrThrow(grammar: Grammar, termKey: string) {
  const [componentId, conditionId] = termKey.split(':');
  const component = grammar.vocabulary.components.find((c) => c.id === componentId);
  const condition = grammar.vocabulary.conditions.find((c) => c.id === conditionId);
  if (!component || !condition)
    throw new AppError('invalid_body', `“${termKey}” is not a term of this vocabulary.`, {
      termKey: ['not in the vocabulary'],
    });
  if (!component.defects.some((d) => d.condition === condition.id)) {
    throw new AppError(
      'invalid_body',
      `“${condition.name}” is not a defect of “${component.name}” in this vocabulary; add it in the editor first.`,
      { termKey: ['not a defect of that component'] },
    );
  }
  return { component, condition };
}

function withPhrase(grammar: Grammar, termKey: string, slot: Slot, phrase: string): Grammar {
  const [componentId, conditionId] = termKey.split(':') as [string, string];
  const next = structuredClone(grammar);
  const target =
    slot === 'component'
      ? next.vocabulary.components.find((c) => c.id === componentId)
      : next.vocabulary.conditions.find((c) => c.id === conditionId);
  if (target && !target.phrases.includes(phrase)) target.phrases.push(phrase);
  return next;
}

/**
 * Which phrase, in which slot, makes the draft read this utterance as the term: the words the
 * term does not explain yet go to the part the driver did not name in known words. Each
 * candidate is tried on a matcher; the one that reads the utterance as the term, surest, wins.
 */
export function suggestFieldPhrase(
  grammar: Grammar,
  termKey: string,
  text: string,
  zone: string | null = null,
): { slot: Slot; phrase: string } {
  const { component, condition } = findTermOrThrow(grammar, termKey);
  const tokens = createNormalizer(grammar.commands)(text);
  const skip = new Set([
    ...glue,
    ...grammar.commands.fillers,
    ...grammar.positions.axleWords,
    ...grammar.positions.positions.flatMap((p) => p.phrases.flatMap((x) => x.split(' '))),
  ]);
  const words = (xs: string[]) => new Set(xs.flatMap((x) => x.toLowerCase().split(/\s+/)));
  const componentWords = words([component.name, ...component.phrases]);
  const conditionWords = words([condition.name, ...condition.phrases]);
  const meaningful = tokens.filter((t) => !skip.has(t));
  const rest = meaningful.filter((t) => !componentWords.has(t) && !conditionWords.has(t));
  const saidComponent = meaningful.some((t) => componentWords.has(t));
  const saidCondition = meaningful.some((t) => conditionWords.has(t));
  const clip = (xs: string[]) => xs.join(' ').slice(0, 80).trim();
  const candidates: { slot: Slot; phrase: string }[] = [];
  if (rest.length) {
    if (saidComponent && !saidCondition) candidates.push({ slot: 'condition', phrase: clip(rest) });
    if (saidCondition && !saidComponent) candidates.push({ slot: 'component', phrase: clip(rest) });
    candidates.push({ slot: 'condition', phrase: clip(rest) }, { slot: 'component', phrase: clip(rest) });
  }
  const whole = clip(meaningful.length ? meaningful : tokens);
  if (whole)
    candidates.push(
      { slot: saidComponent ? 'condition' : 'component', phrase: whole },
      { slot: saidComponent ? 'component' : 'condition', phrase: whole },
    );
  if (!candidates.length)
    throw new AppError('invalid_body', 'There are no words in this utterance to add.', { text: ['no words'] });
  let best = { ...candidates[0]!, score: -1 };
  const tried = new Set<string>();
  for (const c of candidates) {
    const key = `${c.slot}:${c.phrase}`;
    if (tried.has(key) || !c.phrase) continue;
    tried.add(key);
    const r = createMatcher(withPhrase(grammar, termKey, c.slot, c.phrase)).match(text, { zone });
    const score = r.termId === termKey ? r.score : -0.5;
    if (score > best.score) best = { ...c, score };
    if (score >= 0.9) break;
  }
  return { slot: best.slot, phrase: best.phrase };
}

/** Add what a driver said as a phrase of the chosen term in the draft; the field utterances it answers are marked resolved. */
export async function addFieldPhrase({
  fleetId,
  actorId,
  versionId,
  body: input,
}: {
  fleetId: string;
  actorId: string;
  versionId: string;
  body: AddPhraseBody;
}) {
  const body = addPhraseBodySchema.parse(input);
  return getDb()
    .transaction()
    .execute(async (trx) => {
      await trx.selectFrom('vocabularyVersion').select('id').where('id', '=', versionId).forUpdate().execute();
      const draft = await getDraftVersionOrThrow(trx, { fleetId, id: versionId });
      const first = body.utteranceIds.length
        ? await trx
            .selectFrom('fieldUtterance')
            .select('zone')
            .where('fleetId', '=', fleetId)
            .where('id', 'in', body.utteranceIds)
            .executeTakeFirst()
        : undefined;
      const zone = first?.zone ?? null;
      const { component, condition } = findTermOrThrow(draft.grammar, body.termKey);
      const suggested =
        body.slot && body.phrase
          ? { slot: body.slot, phrase: body.phrase }
          : suggestFieldPhrase(draft.grammar, body.termKey, body.text, zone);
      const slot = body.slot ?? suggested.slot;
      const phrase = (body.phrase ?? suggested.phrase).toLowerCase();
      const grammar = withPhrase(draft.grammar, body.termKey, slot, phrase);
      const saved = await writeDraftGrammar(trx, { fleetId, id: versionId, grammar });
      if (!saved) throw new AppError('conflict', 'This version was published meanwhile and cannot change.');
      const resolved = await resolveFieldUtterances(trx, { fleetId, ids: body.utteranceIds });
      const target = slot === 'component' ? component.name : condition.name;
      await recordAudit(trx, {
        fleetId,
        actorId,
        action: 'vocabulary.phrase_added',
        entity: 'vocabulary_version',
        entityId: versionId,
        detail: { termKey: body.termKey, slot, phrase, heard: body.text, resolved },
      });
      const after = await getVocabularyVersionOrThrow(trx, { fleetId, id: versionId });
      const match = describeMatch(createMatcher(after.grammar).match(body.text, { zone }));
      return { slot, phrase, target, resolved, match };
    });
}
