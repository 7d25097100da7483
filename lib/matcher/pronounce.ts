import { spellToPhonemes } from './letter-to-sound';

/** Word → ARPAbet phonemes (no stress marks), from a table, then by suffix, compound split, spelling rules. */
export type Pronouncer = (word: string) => string[];

const SUFFIXES: { s: string; p: string[]; add?: string }[] = [
  { s: 'ies', p: ['IY', 'Z'], add: 'y' },
  { s: 'ing', p: ['IH', 'NG'] },
  { s: 'ers', p: ['ER', 'Z'] },
  { s: 'er', p: ['ER'] },
  { s: 'ed', p: ['D'] },
  { s: 'es', p: ['Z'] },
  { s: 's', p: ['Z'] },
];

/**
 * Build a pronouncer over `table` (word → "P H O N E S"). A word not in the table is tried as a
 * table word plus a suffix ("blinkers"), then as two table words ("crossmember" = cross + member),
 * then by spelling rules.
 */
export function createPronouncer(table: ReadonlyMap<string, string> | Readonly<Record<string, string>>): Pronouncer {
  const get =
    table instanceof Map
      ? (w: string) => (table as ReadonlyMap<string, string>).get(w)
      : (w: string) => (Object.hasOwn(table, w) ? (table as Record<string, string>)[w] : undefined);
  const cache = new Map<string, string[]>();
  const split = (s: string | undefined) => (s ? s.split(' ').filter(Boolean) : null);
  const pronounce = (word: string): string[] => {
    const w = word.toLowerCase();
    const hit = cache.get(w);
    if (hit) return hit;
    let out = split(get(w));
    if (!out) {
      for (const suf of SUFFIXES) {
        if (w.length > suf.s.length + 2 && w.endsWith(suf.s)) {
          const base = split(get(w.slice(0, -suf.s.length) + (suf.add ?? '')));
          if (base) {
            out = [...base, ...suf.p];
            break;
          }
        }
      }
    }
    if (!out && w.length >= 6) {
      for (let k = w.length - 3; k >= 3; k -= 1) {
        const a = split(get(w.slice(0, k)));
        const b = a ? split(get(w.slice(k))) : null;
        if (a && b) {
          out = [...a, ...b];
          break;
        }
      }
    }
    out ??= spellToPhonemes(w);
    if (cache.size > 5000) cache.clear();
    cache.set(w, out);
    return out;
  };
  return pronounce;
}

/** Edit distance between two phoneme sequences, vowels for vowels cheaper (0.6) than other substitutions. */
export function getPhonemeDistance(a: readonly string[], b: readonly string[]): number {
  const n = b.length;
  let prev = Array.from({ length: n + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i += 1) {
    const cur = [i];
    const x = a[i - 1] ?? '';
    for (let j = 1; j <= n; j += 1) {
      const y = b[j - 1] ?? '';
      const sub = x === y ? 0 : areNear(x, y) ? 0.4 : (isVowel(x) && isVowel(y)) || sameClass(x, y) ? 0.6 : 1;
      cur.push(Math.min((prev[j] ?? 0) + 1, (cur[j - 1] ?? 0) + 1, (prev[j - 1] ?? 0) + sub));
    }
    prev = cur;
  }
  return prev[n] ?? Math.max(a.length, n);
}

/** 1 − distance / longer length: 1 for the same sounds, 0 for nothing in common. */
export function getPhonemeSimilarity(a: readonly string[], b: readonly string[]): number {
  const len = Math.max(a.length, b.length);
  if (len === 0) return 0;
  return Math.max(0, 1 - getPhonemeDistance(a, b) / len);
}

const VOWEL_SET = new Set(['AA', 'AE', 'AH', 'AO', 'AW', 'AY', 'EH', 'ER', 'EY', 'IH', 'IY', 'OW', 'OY', 'UH', 'UW']);
function isVowel(p: string): boolean {
  return VOWEL_SET.has(p);
}
// voiced/unvoiced pairs and nasals a recogniser swaps most
const NEAR = [
  ['P', 'B'],
  ['T', 'D'],
  ['K', 'G'],
  ['F', 'V'],
  ['S', 'Z'],
  ['SH', 'ZH'],
  ['CH', 'JH'],
  ['TH', 'DH'],
  ['M', 'N'],
  ['N', 'NG'],
];
const NEAR_SET = new Set(NEAR.flatMap(([a, b]) => [`${a} ${b}`, `${b} ${a}`]));
// stops, fricatives and affricates, nasals, liquids and glides: a recogniser slips within a class more often than across
const CLASS: Record<string, number> = {};
[
  ['P', 'B', 'T', 'D', 'K', 'G'],
  ['F', 'V', 'TH', 'DH', 'S', 'Z', 'SH', 'ZH', 'HH', 'CH', 'JH'],
  ['M', 'N', 'NG'],
  ['L', 'R', 'W', 'Y', 'ER'],
].forEach((group, i) => {
  for (const p of group) CLASS[p] = i;
});
function sameClass(a: string, b: string): boolean {
  return CLASS[a] !== undefined && CLASS[a] === CLASS[b];
}
function areNear(a: string, b: string): boolean {
  return NEAR_SET.has(`${a} ${b}`);
}

const PHONES = [
  'AA',
  'AE',
  'AH',
  'AO',
  'AW',
  'AY',
  'EH',
  'ER',
  'EY',
  'IH',
  'IY',
  'OW',
  'OY',
  'UH',
  'UW',
  'B',
  'CH',
  'D',
  'DH',
  'F',
  'G',
  'HH',
  'JH',
  'K',
  'L',
  'M',
  'N',
  'NG',
  'P',
  'R',
  'S',
  'SH',
  'T',
  'TH',
  'V',
  'W',
  'Y',
  'Z',
  'ZH',
];
const PHONE_ID = new Map(PHONES.map((p, i) => [p, i]));
const COST = (() => {
  const n = PHONES.length + 1;
  const m = new Float64Array(n * n);
  for (let i = 0; i < n; i += 1)
    for (let j = 0; j < n; j += 1) {
      const a = PHONES[i] ?? '?';
      const b = PHONES[j] ?? '!';
      m[i * n + j] = i === j ? 0 : areNear(a, b) ? 0.4 : (isVowel(a) && isVowel(b)) || sameClass(a, b) ? 0.6 : 1;
    }
  return m;
})();

/** Phonemes as small integers for {@link getPhonemeSimilarityFast}. */
export function encodePhonemes(ph: readonly string[]): Uint8Array {
  return Uint8Array.from(ph.map((p) => PHONE_ID.get(p) ?? PHONES.length));
}

const rowA = new Float64Array(64);
const rowB = new Float64Array(64);
/** {@link getPhonemeSimilarity} over encoded phonemes, without allocation (sequences up to 63 long). */
export function getPhonemeSimilarityFast(a: Uint8Array, b: Uint8Array): number {
  const n = Math.min(b.length, 63);
  const m = Math.min(a.length, 63);
  const len = Math.max(m, n);
  if (len === 0) return 0;
  const w = PHONES.length + 1;
  let prev = rowA;
  let cur = rowB;
  for (let j = 0; j <= n; j += 1) prev[j] = j;
  for (let i = 1; i <= m; i += 1) {
    cur[0] = i;
    const base = (a[i - 1] ?? 0) * w;
    for (let j = 1; j <= n; j += 1) {
      const del = (prev[j] ?? 0) + 1;
      const ins = (cur[j - 1] ?? 0) + 1;
      const sub = (prev[j - 1] ?? 0) + (COST[base + (b[j - 1] ?? 0)] ?? 1);
      cur[j] = del < ins ? (del < sub ? del : sub) : ins < sub ? ins : sub;
    }
    const t = prev;
    prev = cur;
    cur = t;
  }
  return Math.max(0, 1 - (prev[n] ?? len) / len);
}
