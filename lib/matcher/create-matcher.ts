import Fuse from 'fuse.js';
import { grammarSchema } from '@/lib/schemas/grammar';
import type { CommandId, MeasureKind, Unit } from '@/lib/schemas/grammar';
import { createNormalizer } from './normalize-text';
import { getPhoneticKey } from './phonetic-key';
import { createPronouncer, encodePhonemes, getPhonemeSimilarityFast } from './pronounce';
import bundledPronunciations from './pronunciations.json';
import { createQuantityReader } from './read-quantities';
import type { Quantity } from './read-quantities';
import type { MatchAlternative, MatchContext, MatchResult, Matcher, NbestAlternative } from './types';

export type MatcherOptions = {
  /** Word → ARPAbet phonemes; default: the default vocabulary's (lib/matcher/pronunciations.json). Spelling rules cover the rest. */
  pronunciations?: Readonly<Record<string, string>>;
};

/** Sound-alike matches at or above this phoneme similarity are offered, always to confirm. */
const SOUND_MIN = 0.5;

/** At or above this score a finding or measurement is recorded directly; below it the UI asks "did you mean …?". */
export const CONFIRM_THRESHOLD = 0.75;
/** Below this score nothing is offered as the reading: the result is `unknown` (alternatives may still be listed). */
export const ACCEPT_THRESHOLD = 0.55;

type Resolved = { word: string; sim: number };
type PhraseRef = { owner: number; words: string[]; idf: number[]; weightSum: number };
type Coverage = {
  owner: number;
  cov: number;
  mass: number;
  phrase: number;
  tokens: Set<number>;
  words: string[];
  exact: boolean;
};
type PositionHit = { id: string; group: string; start: number; end: number };

const GROUP_ORDER = ['side', 'end', 'axle_group', 'axle', 'dual', 'height'];

/** Words that carry a command said as a sentence or a question without changing it ("can you", "let us", "please"). */
const CARRIERS = new Set(
  'can could would will you we i let us please go ahead and just want to like the a an that this it me now so then do need am are is ok okay alright'.split(
    ' ',
  ),
);
/** What each command may be said about ("the next item", "the last one", "a picture of that"). */
const COMMAND_OBJECTS: Partial<Record<CommandId, Set<string>>> = Object.fromEntries(
  Object.entries({
    next: 'one item zone step thing section on to next',
    previous: 'one item zone step thing last to previous',
    repeat: 'one item thing last again said say you what did was more time that it',
    finish: 'inspection walk with whole this done finished all here now for today check',
    undo: 'last one thing finding item said wait no oops entry',
    photo: 'of picture photo take shot pic',
    pause: 'second minute moment on me for bit wait',
    yes: 'that is it one correct right yes yeah',
    no: 'that is it not one wrong no',
    ok: 'here it this side with on everything all is looks the zone so far of good',
  }).map(([k, v]) => [k, new Set(v.split(' '))]),
);
/** Share of the n-best weight that must agree on a reading for it to be recorded without asking (0.6, 0.75 and 0.9 tried on bench:speech; 0.9 records the fewest wrong). */
const NBEST_AGREEMENT = 0.9;
/** Share of the heard words a finding must explain to be recorded from speech without asking. */
const NBEST_COVERAGE = 0.8;
/** Weights of n-best alternatives by rank when the recogniser gives no confidence. */
const RANK_WEIGHTS = [1, 0.6, 0.45, 0.35, 0.3];
/** Words after a reading that qualify it without changing it ("five thirty seconds roughly", "one ten psi cold"). */
const READING_QUALIFIERS = new Set(
  'about roughly approximately around even exactly maybe or so cold hot give take left reads reading measured measures got at'.split(
    ' ',
  ),
);
const MEASURE_RANGES: Record<Unit, [number, number]> = {
  '32nds': [0, 32],
  psi: [0, 200],
  s: [0, 1800],
  min: [0, 30],
  in: [0, 60],
  count: [0, 1000],
};

function getLevenshteinSimilarity(a: string, b: string): number {
  if (a === b) return 1;
  const m = a.length;
  const n = b.length;
  if (m === 0 || n === 0) return 0;
  let prev = Array.from({ length: n + 1 }, (_, j) => j);
  for (let i = 1; i <= m; i += 1) {
    const cur = [i];
    for (let j = 1; j <= n; j += 1) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      cur.push(Math.min((prev[j] ?? 0) + 1, (cur[j - 1] ?? 0) + 1, (prev[j - 1] ?? 0) + cost));
    }
    prev = cur;
  }
  return 1 - (prev[n] ?? Math.max(m, n)) / Math.max(m, n);
}

/** Plural to singular for matching only: "lights" → "light", "batteries" → "battery"; "glass", "chassis" stay. */
function stemWord(w: string): string {
  if (w.length > 4 && w.endsWith('ies')) return `${w.slice(0, -3)}y`;
  if (w.length > 3 && w.endsWith('s') && !/(ss|us|is)$/.test(w) && /^[a-z]+$/.test(w)) return w.slice(0, -1);
  return w;
}

function round3(x: number): number {
  return Math.round(x * 1000) / 1000;
}

/**
 * Build a matcher from grammar data (validated with zod; throws on a malformed grammar).
 * Pure: no I/O, safe in the browser and in Node.
 */
export function createMatcher(grammarInput: unknown, options: MatcherOptions = {}): Matcher {
  const grammar = grammarSchema.parse(grammarInput);
  const { vocabulary, commands, positions, numbers } = grammar;
  const normalize = createNormalizer(commands);
  const readQuantities = createQuantityReader(numbers);
  const fillers = new Set([...commands.fillers, 'please', 'hey', 'uh', 'um']);
  const components = vocabulary.components;
  const conditions = vocabulary.conditions;
  const conditionIndex = new Map(conditions.map((c, i) => [c.id, i]));
  const componentIndex = new Map(components.map((c, i) => [c.id, i]));
  const pairs = new Map<string, { us: 'minor' | 'major'; ca: 'minor' | 'major'; source: string }>();
  for (const comp of components) {
    for (const d of comp.defects) pairs.set(`${comp.id}:${d.condition}`, { ...d.severity, source: d.source });
  }
  const componentsByCondition = new Map<number, number[]>();
  for (const [ci, comp] of components.entries()) {
    for (const d of comp.defects) {
      const di = conditionIndex.get(d.condition);
      if (di === undefined) continue;
      const list = componentsByCondition.get(di) ?? [];
      list.push(ci);
      componentsByCondition.set(di, list);
    }
  }

  // ---- phrase tables with IDF weights (word rarity across owners) ----
  const buildPhrases = (owners: { phrases: string[] }[]) => {
    const refs: PhraseRef[] = [];
    const df = new Map<string, Set<number>>();
    owners.forEach((o, owner) => {
      for (const p of o.phrases) {
        const words = normalize(p).map(stemWord);
        if (words.length === 0) continue;
        refs.push({ owner, words, idf: [], weightSum: 0 });
        for (const w of words) {
          const s = df.get(w) ?? new Set<number>();
          s.add(owner);
          df.set(w, s);
        }
      }
    });
    const n = owners.length;
    const byWord = new Map<string, number[]>();
    refs.forEach((r, idx) => {
      r.idf = r.words.map((w) => Math.log(1 + n / (df.get(w)?.size ?? 1)) * (fillers.has(w) ? 0.3 : 1));
      r.weightSum = r.idf.reduce((a, b) => a + b, 0);
      for (const w of new Set(r.words)) {
        const list = byWord.get(w) ?? [];
        list.push(idx);
        byWord.set(w, list);
      }
    });
    return { refs, byWord };
  };
  const compTable = buildPhrases(components);
  const condTable = buildPhrases(conditions);

  // ---- commands ----
  const commandByKey = new Map<string, CommandId>();
  /** Keys that are a phrase as written (the others are phrases without their filler words: "move" for "move on"). */
  const saidCommandKeys = new Set<string>();
  const stripFillers = (ws: string[]) => ws.filter((w) => !fillers.has(w));
  for (const c of commands.commands) {
    for (const p of c.phrases) {
      const ws = normalize(p);
      commandByKey.set(ws.join(' '), c.id);
      saidCommandKeys.add(ws.join(' '));
    }
  }
  for (const c of commands.commands) {
    for (const p of c.phrases) {
      const stripped = stripFillers(normalize(p)).join(' ');
      if (stripped && !commandByKey.has(stripped)) commandByKey.set(stripped, c.id);
    }
  }
  const commandPhrases = [...saidCommandKeys]
    .map((k) => ({ words: k.split(' '), id: commandByKey.get(k) }))
    .filter((x): x is { words: string[]; id: CommandId } => x.id !== undefined)
    .sort((a, b) => b.words.length - a.words.length);
  const commandKeys = [...commandByKey.keys()];
  const okWords = new Set(['good', 'fine', 'ok', 'okay', 'clear']);
  const negators = new Set(['no', 'not', 'never', 'nothing', 'without']);
  const zoneWords = new Set(
    grammar.zones.zones
      .flatMap((z) => z.phrases.flatMap((p) => normalize(p)))
      .concat(['side', 'tractor', 'trailer', 'truck', 'unit', 'zone']),
  );

  // ---- positions ----
  const positionPhrases = positions.positions
    .flatMap((p) => p.phrases.map((ph) => ({ id: p.id, group: p.group, words: normalize(ph) })))
    .filter((p) => p.words.length > 0)
    .sort((a, b) => b.words.length - a.words.length);
  const axleWords = new Set(positions.axleWords);
  const ordinals = Object.entries(positions.ordinals).map(([k, v]) => ({ words: normalize(k), value: v }));

  // ---- measurement words ----
  const measurePhrases = (Object.entries(numbers.measureWords) as [MeasureKind, string[]][])
    .flatMap(([kind, ps]) => ps.map((p) => ({ kind, words: normalize(p) })))
    .filter((p) => p.words.length > 0)
    .sort((a, b) => b.words.length - a.words.length);
  const unitPhraseWords = new Set(Object.values(numbers.unitWords).flatMap((ps) => ps.flatMap((p) => normalize(p))));

  // ---- the lexicon: every word we know, fuzzy + sound-alike lookup for the rest ----
  const contentWords = new Set<string>([...compTable.byWord.keys(), ...condTable.byWord.keys()]);
  for (const p of positionPhrases) for (const w of p.words) contentWords.add(w);
  for (const p of measurePhrases) for (const w of p.words) contentWords.add(w);
  const numberWords = new Set([
    ...Object.keys(numbers.units),
    ...Object.keys(numbers.tens),
    ...Object.keys(numbers.scales),
    ...Object.keys(numbers.fractions),
    'point',
    'and',
  ]);
  const knownWords = new Set<string>([...contentWords, ...numberWords, ...fillers, ...unitPhraseWords, ...axleWords]);
  for (const k of commandKeys) for (const w of k.split(' ')) knownWords.add(w);
  const lexiconList = [...contentWords].filter((w) => w.length >= 3 && !/^\d/.test(w));
  // fuse.js over single words, one small index per first letter: a misheard word keeps its first sound far more often than not
  const lexiconByLetter = new Map<string, Fuse<string>>();
  for (const letter of new Set(lexiconList.map((w) => w[0] ?? ''))) {
    const words = lexiconList.filter((w) => w[0] === letter);
    lexiconByLetter.set(
      letter,
      new Fuse(words, { includeScore: true, threshold: 0.34, ignoreLocation: true, minMatchCharLength: 2 }),
    );
  }
  const byPhonetic = new Map<string, string[]>();
  for (const w of lexiconList) {
    const k = getPhoneticKey(w);
    if (k.length < 2) continue;
    const list = byPhonetic.get(k) ?? [];
    list.push(w);
    byPhonetic.set(k, list);
  }
  const resolveCache = new Map<string, Resolved[]>();
  const resolveToken = (t: string): Resolved[] => {
    const hit = resolveCache.get(t);
    if (hit) return hit;
    let out: Resolved[] = [];
    if (knownWords.has(t)) out = [{ word: t, sim: 1 }];
    else if (/^[a-z]+$/.test(t)) {
      const stems = [
        t.endsWith('ies') ? `${t.slice(0, -3)}y` : '',
        t.endsWith('es') ? t.slice(0, -2) : '',
        t.endsWith('s') ? t.slice(0, -1) : '',
        t.endsWith('ed') ? t.slice(0, -1) : '',
        t.endsWith('ing') ? t.slice(0, -3) : '',
      ];
      const stem = stems.find((s) => s.length >= 2 && contentWords.has(s));
      if (stem) out = [{ word: stem, sim: 0.97 }];
      if (out.length === 0 && t.length >= 6) {
        for (let k = 3; k <= t.length - 3; k += 1) {
          const a = t.slice(0, k);
          const b = t.slice(k);
          if (contentWords.has(a) && contentWords.has(b)) {
            out = [
              { word: a, sim: 0.95 },
              { word: b, sim: 0.95 },
            ];
            break;
          }
        }
      }
      if (out.length === 0 && t.length >= 3) {
        const same = byPhonetic.get(getPhoneticKey(t));
        if (same) out = same.slice(0, 3).map((word) => ({ word, sim: 0.8 }));
      }
      if (out.length === 0 && t.length >= 4) {
        out = (lexiconByLetter.get(t[0] ?? '')?.search(t, { limit: 3 }) ?? [])
          .map((r) => ({ word: r.item, sim: 0.85 * (1 - (r.score ?? 1)) }))
          .filter((r) => r.sim >= 0.6 && Math.abs(r.word.length - t.length) <= 3);
      }
    }
    if (resolveCache.size > 5000) resolveCache.clear();
    resolveCache.set(t, out);
    return out;
  };

  // ---- sounds: what a recogniser's slip sounds like ("their fire" ≈ "steer tire", "doubled" ≈ "bulge") ----
  const pronounce = createPronouncer(options.pronunciations ?? bundledPronunciations.words);
  const wordSounds = lexiconList
    .map((w) => ({ word: w, ph: encodePhonemes(pronounce(w)) }))
    .filter((x) => x.ph.length >= 2);
  const spanSounds: { words: string[]; ph: Uint8Array }[] = [];
  {
    const seenSpan = new Set<string>();
    for (const r of [...compTable.refs, ...condTable.refs]) {
      const key = r.words.join(' ');
      if (r.words.length !== 2 || seenSpan.has(key) || r.words.some((w) => fillers.has(w))) continue;
      seenSpan.add(key);
      spanSounds.push({ words: r.words, ph: encodePhonemes(r.words.flatMap(pronounce)) });
    }
  }
  const soundCache = new Map<string, Resolved[]>();
  /** A word we do not know, by its sounds: the two nearest vocabulary words at SOUND_MIN or above. */
  const resolveBySound = (t: string): Resolved[] => {
    const hit = soundCache.get(t);
    if (hit) return hit;
    const ph = encodePhonemes(pronounce(t));
    const found: Resolved[] = [];
    if (ph.length >= 2) {
      for (const ws of wordSounds) {
        if (Math.abs(ws.ph.length - ph.length) > 2) continue;
        const sim = getPhonemeSimilarityFast(ph, ws.ph);
        if (sim >= SOUND_MIN) found.push({ word: ws.word, sim: Math.min(0.85, sim) });
      }
    }
    const out = found.sort((a, b) => b.sim - a.sim).slice(0, 2);
    if (soundCache.size > 5000) soundCache.clear();
    soundCache.set(t, out);
    return out;
  };
  /** Two heard words against two-word vocabulary phrases, across the word boundary. */
  const resolveSpanBySound = (a: string, b: string): { words: string[]; sim: number } | null => {
    const key = `${a} ${b}`;
    const hit = soundCache.get(key);
    if (hit) return hit.length === 2 ? { words: hit.map((h) => h.word), sim: hit[0]?.sim ?? 0 } : null;
    const ph = encodePhonemes([...pronounce(a), ...pronounce(b)]);
    let best: { words: string[]; sim: number } | null = null;
    for (const sp of spanSounds) {
      if (Math.abs(sp.ph.length - ph.length) > 2) continue;
      const sim = getPhonemeSimilarityFast(ph, sp.ph);
      if (sim >= SOUND_MIN && (!best || sim > best.sim)) best = { words: sp.words, sim };
    }
    const sim = best ? Math.min(0.85, best.sim) : 0;
    soundCache.set(key, best ? best.words.map((word) => ({ word, sim })) : []);
    return best ? { words: best.words, sim } : null;
  };

  const scoreTable = (table: ReturnType<typeof buildPhrases>, resolved: Resolved[][]): Coverage[] => {
    const best = new Map<string, { sim: number; token: number }>();
    resolved.forEach((rs, ti) => {
      for (const r of rs) {
        const cur = best.get(r.word);
        if (!cur || cur.sim < r.sim) best.set(r.word, { sim: r.sim, token: ti });
      }
    });
    // first pass without allocation: best phrase per owner, and the owner's fully said phrases
    type Acc = { owner: number; cov: number; mass: number; phrase: number; exact: boolean; full: number[] };
    const byOwner = new Map<number, Acc>();
    const seen = new Set<number>();
    for (const w of best.keys()) {
      for (const idx of table.byWord.get(w) ?? []) {
        if (seen.has(idx)) continue;
        seen.add(idx);
        const ref = table.refs[idx];
        if (!ref) continue;
        let got = 0;
        let exact = false;
        for (let k = 0; k < ref.words.length; k += 1) {
          const b = best.get(ref.words[k] ?? '');
          if (b) {
            got += (ref.idf[k] ?? 0) * b.sim;
            if (b.sim >= 0.95) exact = true;
          }
        }
        const cov = got / (ref.weightSum || 1);
        let cur = byOwner.get(ref.owner);
        if (!cur) {
          cur = { owner: ref.owner, cov, mass: got, phrase: idx, exact, full: [] };
          byOwner.set(ref.owner, cur);
        } else if (cov > cur.cov + 1e-9 || (Math.abs(cov - cur.cov) < 1e-9 && got > cur.mass)) {
          cur.cov = cov;
          cur.mass = got;
          cur.phrase = idx;
          cur.exact = exact;
        }
        if (cov >= 0.99) cur.full.push(idx);
      }
    }
    const ranked = [...byOwner.values()].sort((a, b) => b.cov - a.cov || b.mass - a.mass);
    // second pass for the leaders only: which tokens and words they explain
    return ranked.map((a, rank): Coverage => {
      const tokens = new Set<number>();
      const words: string[] = [];
      if (rank < 12) {
        const ref = table.refs[a.phrase];
        for (const w of ref?.words ?? []) {
          const b = best.get(w);
          if (b) {
            tokens.add(b.token);
            words.push(w);
          }
        }
        // every fully said phrase of the same owner explains its tokens ("drive tire … dual")
        if (a.cov >= 0.99) {
          for (const idx of a.full)
            for (const w of table.refs[idx]?.words ?? []) {
              const b = best.get(w);
              if (b) tokens.add(b.token);
            }
        }
      }
      return { owner: a.owner, cov: a.cov, mass: a.mass, phrase: a.phrase, tokens, words, exact: a.exact };
    });
  };

  const findPositions = (tokens: string[], quantities: Quantity[]): PositionHit[] => {
    const hits: PositionHit[] = [];
    const taken = new Set<number>();
    for (let i = 0; i < tokens.length; i += 1) {
      if (axleWords.has(tokens[i] ?? '')) {
        const q = quantities.find(
          (x) => x.start === i + 1 && x.unit === null && Number.isInteger(x.value) && x.value >= 1 && x.value <= 6,
        );
        if (q) {
          hits.push({ id: `axle ${q.value}`, group: 'axle', start: i, end: q.end });
          for (let k = i; k < q.end; k += 1) taken.add(k);
          continue;
        }
        for (const o of ordinals) {
          const s = i - o.words.length;
          if (s >= 0 && o.words.every((w, k) => tokens[s + k] === w)) {
            hits.push({ id: `axle ${o.value}`, group: 'axle', start: s, end: i + 1 });
            for (let k = s; k <= i; k += 1) taken.add(k);
            break;
          }
        }
      }
    }
    for (let i = 0; i < tokens.length; i += 1) {
      if (taken.has(i)) continue;
      for (const p of positionPhrases) {
        if (p.words.every((w, k) => tokens[i + k] === w && !taken.has(i + k))) {
          hits.push({ id: p.id, group: p.group, start: i, end: i + p.words.length });
          for (let k = i; k < i + p.words.length; k += 1) taken.add(k);
          i += p.words.length - 1;
          break;
        }
      }
    }
    return hits;
  };

  const formatPositions = (hits: PositionHit[], exclude: Set<number>): string[] => {
    const kept = hits.filter((h) => {
      if (h.group === 'side') return true;
      for (let k = h.start; k < h.end; k += 1) if (!exclude.has(k)) return true;
      return false;
    });
    const seen = new Set<string>();
    return kept
      .sort((a, b) => GROUP_ORDER.indexOf(a.group) - GROUP_ORDER.indexOf(b.group))
      .filter((h) => {
        const key = h.group === 'axle' ? 'axle' : h.group;
        if (seen.has(key)) return false;
        seen.add(key);
        return true;
      })
      .map((h) => h.id);
  };

  const emptyResult = (input: string): MatchResult => ({
    input,
    kind: 'unknown',
    command: null,
    component: null,
    condition: null,
    position: null,
    severity: null,
    value: null,
    unit: null,
    termId: null,
    score: 0,
    alternatives: [],
    componentId: null,
    conditionId: null,
    system: null,
    measure: null,
    positions: [],
    severities: null,
    source: null,
    needsConfirmation: false,
  });

  const matchCommand = (tokens: string[]): { id: CommandId; score: number } | null => {
    const raw = tokens.join(' ');
    const stripped = stripFillers(tokens).join(' ');
    const exact = commandByKey.get(raw) ?? (stripped ? commandByKey.get(stripped) : undefined);
    // a phrase said as written is sure; one found only once its filler words are gone ("all move" → "move") is asked
    if (exact) return { id: exact, score: saidCommandKeys.has(raw) || saidCommandKeys.has(stripped) ? 1 : 0.9 };
    const content = stripFillers(tokens);
    const each = content.map((w) => commandByKey.get(w));
    if (content.length > 1 && content.length <= 4 && each.every((c) => c !== undefined)) {
      // "yep correct" → yes; "ok next" → next (the last word that moves the walk wins over an acknowledgement)
      const ids = each.filter((c): c is CommandId => c !== undefined);
      const moving = ids.filter((c) => c !== 'ok' && c !== 'yes');
      const id = moving.length > 0 ? moving[moving.length - 1] : ids[ids.length - 1];
      if (id && (moving.length <= 1 || moving.every((c) => c === id))) return { id, score: 1 };
    }
    if (tokens.length > 4 || stripped.length < 3) return null;
    if (stripFillers(tokens).some((w) => (contentWords.has(stemWord(w)) || numberWords.has(w)) && !commandByKey.has(w)))
      return null;
    let best: { id: CommandId; score: number } | null = null;
    for (const k of commandKeys) {
      if (k.length < 4) continue;
      const sim = getLevenshteinSimilarity(stripped, k);
      if (sim >= 0.75 && (!best || sim > best.score))
        best = { id: commandByKey.get(k) ?? 'repeat', score: Math.min(0.9, sim) };
    }
    return best;
  };

  /**
   * A command said as a sentence or a question ("can you say that again", "let's finish the
   * inspection"): a command phrase, and every other word a carrier word or an object that command
   * takes. The utterance must be explained whole; the score stays below 1.
   */
  const matchCommandSentence = (tokens: string[]): { id: CommandId; score: number } | null => {
    if (tokens.length < 2 || tokens.length > 12) return null;
    for (const ph of commandPhrases) {
      const n = ph.words.length;
      for (let i = 0; i + n <= tokens.length; i += 1) {
        if (!ph.words.every((w, k) => tokens[i + k] === w)) continue;
        const objects = COMMAND_OBJECTS[ph.id] ?? new Set<string>();
        const rest = tokens.filter((_, j) => j < i || j >= i + n);
        const ok = rest.every(
          (w) =>
            CARRIERS.has(w) ||
            objects.has(w) ||
            (fillers.has(w) && !commandByKey.has(w)) ||
            commandByKey.get(w) === ph.id ||
            ((ph.id === 'next' || ph.id === 'previous' || ph.id === 'ok') && zoneWords.has(w)),
        );
        if (ok && rest.length > 0) return { id: ph.id, score: 0.95 };
      }
    }
    return null;
  };

  const zoneIds = new Set<string>(grammar.zones.zones.map((z) => z.id));
  const unitWordSet = new Set([...unitPhraseWords]);
  const isNumberish = (w: string | undefined) =>
    w !== undefined && (numberWords.has(w) || /^\d+$/.test(w)) && w !== 'and';
  /** A recogniser's slips inside a number: "twenty too inches" → two, "one end three quarters" → and. */
  const fixNumberSlips = (ws: string[]): string[] =>
    ws.map((w, i) => {
      if (
        (w === 'to' || w === 'too') &&
        isNumberish(ws[i - 1]) &&
        (i === ws.length - 1 || unitWordSet.has(ws[i + 1] ?? ''))
      )
        return 'two';
      if (w === 'end' && isNumberish(ws[i - 1]) && isNumberish(ws[i + 1])) return 'and';
      return w;
    });

  const match = (text: string, rawCtx: MatchContext = {}): MatchResult => {
    const input = typeof text === 'string' ? text : '';
    // an unknown zone or component id is ignored rather than trusted
    const ctx: MatchContext = {
      ...rawCtx,
      zone: rawCtx?.zone && zoneIds.has(rawCtx.zone) ? rawCtx.zone : null,
      component: rawCtx?.component && componentIndex.has(rawCtx.component) ? rawCtx.component : null,
    };
    const result = emptyResult(input);
    let tokens: string[];
    try {
      tokens = fixNumberSlips(normalize(input));
    } catch {
      return result;
    }
    if (tokens.length === 0) return result;
    const profile = ctx.profile ?? 'us';

    // 1. commands and "all good"
    const plain = matchCommand(tokens);
    const cmd = plain?.score === 1 ? plain : (matchCommandSentence(tokens) ?? plain);
    if (!cmd && tokens.every((t) => fillers.has(t))) return result;
    if (cmd) {
      return {
        ...result,
        kind: cmd.id === 'ok' ? 'ok' : 'command',
        command: cmd.id,
        termId: `command:${cmd.id}`,
        score: round3(cmd.score),
        needsConfirmation: cmd.score < 0.95,
      };
    }

    const resolved = tokens.map((t) => resolveToken(stemWord(t)));
    // words the spelling lexicon cannot place are tried by sound, alone and with a neighbour
    const soundTokens = new Set<number>();
    /** "token:word" pairs that only the sound pass gave (the spelling lexicon did not). */
    const soundPairs = new Set<string>();
    const addSound = (i: number, rs: Resolved[]) => {
      const spelled = new Set((resolved[i] ?? []).map((r) => r.word));
      for (const r of rs) if (!spelled.has(r.word)) soundPairs.add(`${i}:${r.word}`);
      resolved[i] = [...(resolved[i] ?? []), ...rs];
      soundTokens.add(i);
    };
    const isOpen = (i: number) => {
      const t = tokens[i] ?? '';
      // not a word we know, and not placed by spelling with any certainty
      return /^[a-z]{2,}$/.test(t) && !knownWords.has(t) && (resolved[i] ?? []).every((r) => r.sim < 0.9);
    };
    const plainly = (table: { byWord: Map<string, number[]> }) =>
      resolved.some((rs) => rs.some((r) => r.sim >= 0.95 && table.byWord.has(r.word) && !fillers.has(r.word)));
    const soundPass = !(plainly(compTable) && plainly(condTable));
    for (let i = 0; soundPass && i < tokens.length; i += 1) {
      if (!isOpen(i) || (tokens[i]?.length ?? 0) < 3) continue;
      const rs = resolveBySound(tokens[i] ?? '');
      if (rs.length > 0) addSound(i, rs);
    }
    for (let i = 0; soundPass && i + 1 < tokens.length; i += 1) {
      const a = tokens[i] ?? '';
      const b = tokens[i + 1] ?? '';
      if (!(soundTokens.has(i) || soundTokens.has(i + 1) || isOpen(i) || isOpen(i + 1))) continue;
      if (!/^[a-z]+$/.test(a) || !/^[a-z]+$/.test(b)) continue;
      const span = resolveSpanBySound(a, b);
      if (!span) continue;
      addSound(i, [{ word: span.words[0] ?? '', sim: span.sim }]);
      addSound(i + 1, [{ word: span.words[1] ?? '', sim: span.sim }]);
    }
    const measureHits: { kind: MeasureKind; start: number; end: number }[] = [];
    for (let i = 0; i < tokens.length; i += 1) {
      for (const p of measurePhrases) {
        if (p.words.every((w, k) => tokens[i + k] === w)) {
          measureHits.push({ kind: p.kind, start: i, end: i + p.words.length });
          i += p.words.length - 1;
          break;
        }
      }
    }
    const explicitKind = [...measureHits].sort((a, b) => b.end - b.start - (a.end - a.start))[0]?.kind ?? null;
    // "one twenty five" is a time (1 min 25 s) only when the reading is a build-up time: a
    // measurement named in the utterance ("governor cut out …") wins over the step being measured.
    const allQuantities = readQuantities(tokens, { timeContext: (explicitKind ?? ctx.measure) === 'air_buildup' });
    const posHits = findPositions(tokens, allQuantities);
    // "axle 3" is a position, not a reading
    const quantities = allQuantities.filter(
      (q) => !posHits.some((h) => h.group === 'axle' && q.start >= h.start && q.end <= h.end),
    );
    // "all good on the front", "passenger side looks good": the OK family around position and zone words
    const withoutPlaces = tokens.filter((t, i) => !zoneWords.has(t) && !posHits.some((h) => i >= h.start && i < h.end));
    const okAround =
      withoutPlaces.length > 0 && withoutPlaces.length < tokens.length ? matchCommand(withoutPlaces) : null;
    if (
      withoutPlaces.length > 0 &&
      withoutPlaces.length < tokens.length &&
      ((okAround?.id === 'ok' && okAround.score === 1) || matchCommandSentence(withoutPlaces)?.id === 'ok')
    ) {
      const pos = formatPositions(posHits, new Set());
      return {
        ...result,
        kind: 'ok',
        command: 'ok',
        termId: 'command:ok',
        score: 0.95,
        position: pos.join(' ') || null,
        positions: pos,
      };
    }
    // a component comes from component words: "side" in "passenger side" is a place, not a side marker
    const placeTokens = new Set<number>();
    for (const h of posHits)
      if (h.group === 'side' || h.group === 'end') for (let k = h.start; k < h.end; k += 1) placeTokens.add(k);
    const compCov = scoreTable(compTable, resolved).filter(
      (c) => c.tokens.size === 0 || ![...c.tokens].every((t) => placeTokens.has(t)),
    );
    // a condition said after "no", "not" or "never" is denied, not reported ("no leaks", "not flat")
    let denied = false;
    const condCov = scoreTable(condTable, resolved).filter((c) => {
      if (c.tokens.size === 0) return true;
      const first = Math.min(...c.tokens);
      const before = [tokens[first - 1], fillers.has(tokens[first - 1] ?? '') ? tokens[first - 2] : undefined];
      const negated = before.some((w, k) => w !== undefined && negators.has(w) && !c.tokens.has(first - 1 - k));
      if (negated && c.cov >= 0.6) denied = true;
      return !negated;
    });
    const bestComp = compCov[0];

    const numberTokens = new Set<number>();
    for (const q of quantities) for (let k = q.start; k < q.end; k += 1) numberTokens.add(k);
    const positionTokens = new Set<number>();
    for (const h of posHits) for (let k = h.start; k < h.end; k += 1) positionTokens.add(k);
    const contentIdx = tokens.map((t, i) => (fillers.has(t) && !numberTokens.has(i) ? -1 : i)).filter((i) => i >= 0);

    const componentFields = (c: Coverage | undefined, threshold: number) => {
      if (!c || c.cov < threshold || !c.exact) return null;
      const comp = components[c.owner];
      if (!comp) return null;
      return { comp, tokens: c.tokens };
    };

    // 2. measurements
    if (quantities.length > 0) {
      const ctxMeasure0 = ctx.measure ?? null;
      // "one ten sec" at a pressure step: "psi" misheard as "sec" after a pressure-sized number
      if (ctxMeasure0 && numbers.measureUnits[ctxMeasure0] === 'psi') {
        for (const [qi, q] of quantities.entries())
          if (q.unit === 's' && q.value >= 20 && q.value <= 200 && tokens[q.end - 1] === 'second')
            quantities[qi] = { ...q, unit: 'psi' };
      }
      const withUnit = quantities.find((q) => q.unit !== null);
      const unitKind = (u: Unit | null): MeasureKind | null => {
        if (u === '32nds') return 'tread_depth';
        // seconds alone are a build-up time only in the air-brake tests ("back in a minute" is not)
        if (u === 's') return ctx.zone === 'air_brake_tests' ? 'air_buildup' : null;
        if (u === 'psi') return ctx.zone === 'air_brake_tests' ? null : 'tire_pressure';
        return null;
      };
      const ctxMeasure = ctx.measure ?? null;
      const compatible = (k: MeasureKind | null, u: Unit | null) =>
        k !== null && (u === null || numbers.measureUnits[k] === u || (u === 's' && k === 'air_leak'));
      let kind: MeasureKind | null = explicitKind;
      if (!kind && ctxMeasure && compatible(ctxMeasure, withUnit?.unit ?? null)) kind = ctxMeasure;
      if (!kind) kind = unitKind(withUnit?.unit ?? null);
      if (!kind && ctxMeasure && withUnit?.unit === 'psi' && numbers.measureUnits[ctxMeasure] === 'psi')
        kind = ctxMeasure;
      if (kind) {
        const want = numbers.measureUnits[kind];
        // tread said in fractions of an inch ("an eighth of an inch", "quarter inch") is read in 32nds
        const inchTread =
          want === '32nds' ? quantities.find((x) => x.unit === 'in' && x.value > 0 && x.value <= 1) : undefined;
        const q =
          quantities.find((x) => x.unit === want) ??
          inchTread ??
          [...quantities].reverse().find((x) => x.unit === null);
        if (q) {
          let value = q.value;
          if (q.unit === null && q.fractionOnly && want === '32nds') value = q.value * 32;
          if (q === inchTread) value = q.value * 32;
          const [lo, hi] = MEASURE_RANGES[want];
          const explained = new Set<number>([...numberTokens, ...positionTokens]);
          for (const h of measureHits) for (let k = h.start; k < h.end; k += 1) explained.add(k);
          const comp = componentFields(bestComp, 0.6);
          if (comp) for (const k of comp.tokens) explained.add(k);
          const unexplained = contentIdx.filter(
            (i) =>
              !explained.has(i) && !unitPhraseWords.has(tokens[i] ?? '') && !READING_QUALIFIERS.has(tokens[i] ?? ''),
          ).length;
          const fromWords = explicitKind !== null || q.unit !== null;
          const kindFromWords = explicitKind !== null || (ctxMeasure !== null && kind === ctxMeasure);
          const allowed = kindFromWords ? (fromWords ? 3 : 1) : 0;
          const acceptable = value >= lo && value <= hi && Number.isFinite(value) && unexplained <= allowed;
          if (acceptable) {
            const score = explicitKind && q.unit ? 1 : fromWords ? 0.92 : 0.85;
            const exclude = comp ? comp.tokens : new Set<number>();
            const pos = formatPositions(posHits, exclude);
            const compId = comp?.comp.id ?? ctx.component ?? null;
            const compEntry = compId ? components[componentIndex.get(compId) ?? -1] : undefined;
            return {
              ...result,
              kind: 'measurement',
              component: compEntry?.name ?? null,
              componentId: compEntry?.id ?? null,
              system: compEntry?.system ?? null,
              position: pos.length ? pos.join(' ') : null,
              positions: pos,
              value: round3(value),
              unit: want,
              measure: kind,
              termId: `measure:${kind}`,
              score: round3(Math.max(0, score - 0.05 * unexplained)),
              needsConfirmation: score - 0.05 * unexplained < CONFIRM_THRESHOLD,
            };
          }
        }
      }
    }

    // 3. findings: component × condition slots
    const explainedBase = new Set<number>([...positionTokens, ...numberTokens]);
    const topComps = compCov.filter((c) => c.cov >= 0.5).slice(0, 10);
    const topConds = condCov.filter((c) => c.cov >= 0.6).slice(0, 6);
    const ctxComp = ctx.component ? componentIndex.get(ctx.component) : undefined;
    const compIsExact = (ci: number) => topComps.some((c) => c.owner === ci && c.exact);
    type Cand = { comp: number; cond: number; score: number; tokens: Set<number>; sound?: boolean; plain?: boolean };
    const restsOnSound = (toks: Set<number>, words: string[]) =>
      [...toks].some((t) => words.some((w) => soundPairs.has(`${t}:${w}`)));
    const cands: Cand[] = [];
    const contentCount = Math.max(1, contentIdx.length);
    const occurrences = new Map<string, number>();
    for (const rs of resolved) for (const r of rs) occurrences.set(r.word, (occurrences.get(r.word) ?? 0) + 1);
    const scorePair = (
      ci: number,
      compScore: number,
      compTokens: Set<number>,
      d: Coverage,
      compWords: string[] = [],
    ) => {
      const comp = components[ci];
      const cond = conditions[d.owner];
      if (!comp || !cond || !pairs.has(`${comp.id}:${cond.id}`)) return;
      let cs = compScore;
      // a word said once cannot be both the component and the condition ("air" in "air bag leaking")
      const shared = compWords.filter((w) => d.words.includes(w) && (occurrences.get(w) ?? 0) < 2).length;
      if (compWords.length > 0 && shared === compWords.length) cs *= 0.5;
      const used = new Set<number>([...explainedBase, ...compTokens, ...d.tokens]);
      const expl = contentIdx.filter((i) => used.has(i)).length / contentCount;
      let bonus = 0;
      if (ctx.zone) bonus += comp.zones.includes(ctx.zone as never) ? 0.03 : -0.04;
      if (ctxComp === ci) bonus += 0.03;
      bonus += 0.02 * Math.min(2, Math.max(0, compTokens.size - 1)) - 0.03 * shared;
      const exact = d.exact || [...compTokens].length > 0 ? d.exact || compIsExact(ci) : false;
      let score = 0.45 * cs + 0.3 * d.cov + 0.25 * expl + bonus;
      if (!exact) score *= 0.85;
      score = Math.max(0, score);
      const sound = restsOnSound(compTokens, compWords) || restsOnSound(d.tokens, d.words);
      // both slots heard as said (not only by spelling likeness); a component from the step or the zone counts as said
      const plain = d.exact && (compTokens.size === 0 || compIsExact(ci));
      cands.push({ comp: ci, cond: d.owner, score, tokens: used, sound, plain });
    };
    for (const d of topConds) {
      for (const c of topComps) scorePair(c.owner, c.cov, c.tokens, d, c.words);
      // a bare condition ("flat") on the item in front of the driver
      if (ctxComp !== undefined && !topComps.some((c) => c.owner === ctxComp && c.cov >= 0.99))
        scorePair(ctxComp, 0.75, new Set(), d);
      // a bare condition that only one component of the current zone can have ("builds slow" in the air-brake tests)
      else if (ctxComp === undefined && ctx.zone && d.cov >= 0.9) {
        const inZone = (componentsByCondition.get(d.owner) ?? []).filter((ci) =>
          components[ci]?.zones.includes(ctx.zone as never),
        );
        const only = inZone[0];
        if (inZone.length === 1 && only !== undefined && !topComps.some((c) => c.owner === only))
          scorePair(only, 0.7, new Set(), d);
      }
    }
    // "no fire extinguisher": "no" before a component that can be missing
    const missingIdx = conditionIndex.get('missing');
    if (cands.length === 0 && topConds.length === 0 && missingIdx !== undefined) {
      for (const c of topComps.slice(0, 3)) {
        const first = Math.min(...c.tokens);
        if (c.cov >= 0.9 && c.exact && tokens[first - 1] === 'no') {
          const tokensNo = new Set([first - 1]);
          scorePair(
            c.owner,
            c.cov,
            c.tokens,
            { owner: missingIdx, cov: 0.9, mass: 1, phrase: -1, tokens: tokensNo, words: ['no'], exact: true },
            c.words,
          );
        }
      }
    }
    // on a tie the more serious finding leads ("a nail and it's hissing" is the air leak) and the other is offered
    const majorOf = (c: Cand) =>
      pairs.get(`${components[c.comp]?.id}:${conditions[c.cond]?.id}`)?.[profile] === 'major' ? 1 : 0;
    cands.sort((a, b) => (Math.abs(b.score - a.score) < 0.005 ? majorOf(b) - majorOf(a) : 0) || b.score - a.score);
    const alternativesOf = (list: Cand[]): MatchAlternative[] =>
      list.slice(0, 4).map((c) => ({
        termId: `${components[c.comp]?.id}:${conditions[c.cond]?.id}`,
        component: components[c.comp]?.name ?? '',
        condition: conditions[c.cond]?.name ?? '',
        score: round3(Math.min(1, c.score)),
      }));
    // a sound-alike reading must explain most of what was said (chatter has sound-alikes too)
    const usesSound = (c: Cand) => c.sound === true;
    const explains = (c: Cand) => contentIdx.filter((i) => c.tokens.has(i)).length / contentCount;
    for (let k = cands.length - 1; k >= 0; k -= 1) {
      const c = cands[k];
      if (c && (usesSound(c) || c.plain === false) && explains(c) < 0.75) cands.splice(k, 1);
    }
    const best = cands[0];
    // a reading that rests on a sound-alike word is a candidate to confirm, never recorded as heard
    const bySound = best !== undefined && (usesSound(best) || best.plain === false);
    if (!best || best.score < ACCEPT_THRESHOLD) {
      // "left steer tire looks good": an item-level OK
      const comp = componentFields(bestComp, 0.9);
      if (comp && (tokens.some((t) => okWords.has(t)) || denied) && (condCov[0]?.cov ?? 0) < 0.6) {
        const pos = formatPositions(posHits, comp.tokens);
        return {
          ...result,
          kind: 'ok',
          command: 'ok',
          component: comp.comp.name,
          componentId: comp.comp.id,
          system: comp.comp.system,
          position: pos.join(' ') || null,
          positions: pos,
          termId: `${comp.comp.id}:ok`,
          score: round3(0.9 * (bestComp?.cov ?? 0)),
          needsConfirmation: true,
        };
      }
      // a condition with no component word ("it's loose on the passenger side"): ask what, do not guess
      const lone = topConds[0];
      if (cands.length === 0 && lone && lone.cov >= 0.9 && ctxComp === undefined && !topComps.some((c) => c.exact)) {
        const cond = conditions[lone.owner];
        if (cond) {
          const pos = formatPositions(posHits, new Set());
          return {
            ...result,
            condition: cond.name,
            conditionId: cond.id,
            position: pos.join(' ') || null,
            positions: pos,
            question: `what is ${cond.name}?`,
          };
        }
      }
      if (cands.length === 0 && ctx.zone && topConds[0]) {
        // a bare condition: offer the zone's components that can have it, for "did you mean …?"
        const d = topConds[0];
        for (const ci of componentsByCondition.get(d.owner) ?? []) {
          if (components[ci]?.zones.includes(ctx.zone as never))
            cands.push({ comp: ci, cond: d.owner, score: 0.3 * d.cov, tokens: new Set() });
        }
      }
      return { ...result, alternatives: alternativesOf(cands) };
    }
    const comp = components[best.comp];
    const cond = conditions[best.cond];
    if (!comp || !cond) return result;
    const pair = pairs.get(`${comp.id}:${cond.id}`);
    const compTokens = topComps.find((c) => c.owner === best.comp)?.tokens ?? new Set<number>();
    const pos = formatPositions(posHits, compTokens);
    const q = quantities.find((x) => x.unit !== null);
    return {
      ...result,
      kind: 'defect',
      component: comp.name,
      condition: cond.name,
      componentId: comp.id,
      conditionId: cond.id,
      system: comp.system,
      position: pos.length ? pos.join(' ') : null,
      positions: pos,
      severity: pair ? pair[profile] : null,
      severities: pair ? { us: pair.us, ca: pair.ca } : null,
      source: pair?.source ?? null,
      value: q ? round3(q.value) : null,
      unit: q?.unit ?? null,
      termId: `${comp.id}:${cond.id}`,
      coverage: round3(explains(best)),
      score: round3(Math.min(bySound ? CONFIRM_THRESHOLD - 0.01 : 1, best.score)),
      alternatives: alternativesOf(cands.slice(1)),
      needsConfirmation: bySound || best.score < CONFIRM_THRESHOLD,
    };
  };

  const matchAlternatives = (alternatives: readonly string[], ctx: MatchContext = {}): MatchResult => {
    const list = Array.isArray(alternatives) ? alternatives.filter((a) => typeof a === 'string').slice(0, 5) : [];
    if (list.length === 0) return emptyResult('');
    let best: { r: MatchResult; s: number } | null = null;
    list.forEach((alt, i) => {
      const r = match(alt, ctx);
      const s = (r.kind === 'unknown' ? 0 : 1) + r.score * (1 - 0.03 * i);
      if (!best || s > best.s) best = { r, s };
    });
    const chosen = (best as { r: MatchResult; s: number } | null)?.r ?? emptyResult(list[0] ?? '');
    return chosen;
  };

  /**
   * The recogniser's n-best list with its confidences: every alternative is matched, readings that
   * agree pool their weight (confidence, or rank when the recogniser gives none), and the reading
   * with the most weighted score wins. Agreement raises the score, disagreement lowers it; a reading
   * that the first alternative does not carry is always asked first.
   */
  const matchNbest = (alternatives: readonly NbestAlternative[], ctx: MatchContext = {}): MatchResult => {
    const list = (Array.isArray(alternatives) ? alternatives : [])
      .filter((a): a is NbestAlternative => typeof (a as NbestAlternative | null)?.transcript === 'string')
      .slice(0, 5);
    const first = list[0];
    if (!first) return emptyResult('');
    const weights = list.map((a, i) => {
      const c = a.confidence;
      return typeof c === 'number' && Number.isFinite(c) && c >= 0
        ? Math.min(1, Math.max(0.01, c))
        : (RANK_WEIGHTS[i] ?? 0.1);
    });
    const total = weights.reduce((a, b) => a + b, 0) || 1;
    const results = list.map((a) => match(a.transcript, ctx));
    const keyOf = (r: MatchResult) =>
      r.kind === 'unknown' ? null : r.kind === 'measurement' ? `${r.termId}=${r.value}` : `${r.kind}:${r.termId}`;
    const groups = new Map<string, { weight: number; mass: number; best: MatchResult; inFirst: boolean }>();
    results.forEach((r, i) => {
      const k = keyOf(r);
      if (k === null) return;
      const w = weights[i] ?? 0;
      const g = groups.get(k);
      if (!g) groups.set(k, { weight: w, mass: w * r.score, best: r, inFirst: i === 0 });
      else {
        g.weight += w;
        g.mass += w * r.score;
        if (r.score > g.best.score) g.best = r;
      }
    });
    const ranked = [...groups.values()].sort((a, b) => b.mass - a.mass);
    const top = ranked[0];
    const merged = (own: MatchAlternative[], skip: string | null): MatchAlternative[] => {
      const out: MatchAlternative[] = [];
      const seen = new Set<string>(skip ? [skip] : []);
      const push = (a: MatchAlternative) => {
        if (seen.has(a.termId) || out.length >= 4) return;
        seen.add(a.termId);
        out.push(a);
      };
      for (const g of ranked)
        if (g.best.kind === 'defect' && g.best.termId)
          push({
            termId: g.best.termId,
            component: g.best.component ?? '',
            condition: g.best.condition ?? '',
            score: round3((g.best.score * g.weight) / total),
          });
      for (const a of own) push(a);
      for (const r of results) for (const a of r.alternatives) push(a);
      return out;
    };
    if (!top) {
      const r0 = results[0] ?? emptyResult(first.transcript);
      return { ...r0, alternatives: merged(r0.alternatives, null) };
    }
    const agreement = top.weight / total;
    const score = round3(Math.min(1, top.best.score * (0.7 + 0.3 * agreement)));
    return {
      ...top.best,
      score,
      alternatives: merged(top.best.alternatives, top.best.kind === 'defect' ? top.best.termId : null),
      // with several alternatives, a reading is recorded without asking only when most of their weight agrees on it
      needsConfirmation:
        top.best.needsConfirmation ||
        !top.inFirst ||
        (list.length > 1 && agreement < NBEST_AGREEMENT) ||
        (top.best.coverage !== undefined && top.best.coverage !== null && top.best.coverage < NBEST_COVERAGE) ||
        (top.best.kind !== 'command' && top.best.kind !== 'ok' && score < CONFIRM_THRESHOLD),
    };
  };

  const phraseCount =
    new Set(components.flatMap((c) => c.phrases)).size +
    new Set(conditions.flatMap((c) => c.phrases)).size +
    new Set(commands.commands.flatMap((c) => c.phrases)).size;

  return { match, matchAlternatives, matchNbest, phraseCount };
}
