/**
 * A small English letter-to-sound fallback: spelling → ARPAbet phonemes without stress marks, for
 * words that the precomputed pronunciation table (lib/matcher/pronunciations.json, from the CMU
 * pronouncing dictionary) does not hold. Rough by design: it only has to put a misheard word near
 * the vocabulary word it sounds like, for phoneme edit distance. Pure.
 */

type Rule = { g: string; p: string[]; at?: 'start' | 'end'; before?: RegExp };

const VOWELS = /[aeiouy]/;

// longest graphemes first; `before` tests the letter after the grapheme
const RULES: Rule[] = [
  { g: 'ouble', p: ['AH', 'B', 'AH', 'L'] },
  { g: 'tion', p: ['SH', 'AH', 'N'] },
  { g: 'sion', p: ['ZH', 'AH', 'N'] },
  { g: 'ture', p: ['CH', 'ER'] },
  { g: 'ough', p: ['AO'] },
  { g: 'augh', p: ['AO'] },
  { g: 'eigh', p: ['EY'] },
  { g: 'igh', p: ['AY'] },
  { g: 'tch', p: ['CH'] },
  { g: 'dge', p: ['JH'] },
  { g: 'ous', p: ['AH', 'S'] },
  { g: 'sch', p: ['S', 'K'] },
  { g: 'kn', p: ['N'], at: 'start' },
  { g: 'wr', p: ['R'], at: 'start' },
  { g: 'ps', p: ['S'], at: 'start' },
  { g: 'mb', p: ['M'], at: 'end' },
  { g: 'le', p: ['AH', 'L'], at: 'end' },
  { g: 'ed', p: ['D'], at: 'end' },
  { g: 'es', p: ['Z'], at: 'end' },
  { g: 'ch', p: ['CH'] },
  { g: 'sh', p: ['SH'] },
  { g: 'th', p: ['TH'] },
  { g: 'ph', p: ['F'] },
  { g: 'wh', p: ['W'] },
  { g: 'ck', p: ['K'] },
  { g: 'ng', p: ['NG'] },
  { g: 'gh', p: ['G'], at: 'start' },
  { g: 'gh', p: [] },
  { g: 'qu', p: ['K', 'W'] },
  { g: 'ee', p: ['IY'] },
  { g: 'ea', p: ['IY'] },
  { g: 'oo', p: ['UW'] },
  { g: 'ou', p: ['AW'] },
  { g: 'ow', p: ['OW'], at: 'end' },
  { g: 'ow', p: ['AW'] },
  { g: 'oi', p: ['OY'] },
  { g: 'oy', p: ['OY'] },
  { g: 'ai', p: ['EY'] },
  { g: 'ay', p: ['EY'] },
  { g: 'au', p: ['AO'] },
  { g: 'aw', p: ['AO'] },
  { g: 'ei', p: ['EY'] },
  { g: 'ey', p: ['IY'], at: 'end' },
  { g: 'ie', p: ['IY'], at: 'end' },
  { g: 'ue', p: ['UW'] },
  { g: 'oa', p: ['OW'] },
  { g: 'ar', p: ['AA', 'R'] },
  { g: 'er', p: ['ER'] },
  { g: 'ir', p: ['ER'] },
  { g: 'ur', p: ['ER'] },
  { g: 'or', p: ['AO', 'R'] },
  { g: 'c', p: ['S'], before: /[eiy]/ },
  { g: 'c', p: ['K'] },
  { g: 'g', p: ['JH'], before: /[eiy]/ },
  { g: 'g', p: ['G'] },
  { g: 'x', p: ['K', 'S'] },
  { g: 'j', p: ['JH'] },
  { g: 'y', p: ['Y'], at: 'start' },
  { g: 'y', p: ['IY'], at: 'end' },
  { g: 'y', p: ['IH'] },
  { g: 'a', p: ['AE'] },
  { g: 'e', p: ['EH'] },
  { g: 'i', p: ['IH'] },
  { g: 'o', p: ['AA'] },
  { g: 'u', p: ['AH'] },
  { g: 'b', p: ['B'] },
  { g: 'd', p: ['D'] },
  { g: 'f', p: ['F'] },
  { g: 'h', p: ['HH'] },
  { g: 'k', p: ['K'] },
  { g: 'l', p: ['L'] },
  { g: 'm', p: ['M'] },
  { g: 'n', p: ['N'] },
  { g: 'p', p: ['P'] },
  { g: 'r', p: ['R'] },
  { g: 's', p: ['S'] },
  { g: 't', p: ['T'] },
  { g: 'v', p: ['V'] },
  { g: 'w', p: ['W'] },
  { g: 'z', p: ['Z'] },
];

const LONG: Record<string, string> = { a: 'EY', e: 'IY', i: 'AY', o: 'OW', u: 'UW' };

/** Phonemes for a lower-case word by spelling rules (letters other than a–z are skipped). */
export function spellToPhonemes(word: string): string[] {
  const w = word.toLowerCase().replace(/[^a-z]/g, '');
  const out: string[] = [];
  let i = 0;
  while (i < w.length) {
    const c = w[i] ?? '';
    // doubled consonants sound once
    if (i > 0 && c === w[i - 1] && !VOWELS.test(c)) {
      i += 1;
      continue;
    }
    // silent final e (not in short words like "be")
    if (c === 'e' && i === w.length - 1 && w.length > 2) break;
    // vowel + one consonant + final e: the long vowel ("bike", "hole", "plate")
    const v = LONG[c];
    if (v && i === w.length - 3 && w[w.length - 1] === 'e' && !VOWELS.test(w[i + 1] ?? 'a')) {
      out.push(v);
      i += 1;
      continue;
    }
    let done = false;
    for (const r of RULES) {
      if (!w.startsWith(r.g, i)) continue;
      if (r.at === 'start' && i !== 0) continue;
      if (r.at === 'end' && i + r.g.length !== w.length) continue;
      if (r.before && !r.before.test(w[i + r.g.length] ?? '')) continue;
      out.push(...r.p);
      i += r.g.length;
      done = true;
      break;
    }
    if (!done) i += 1;
  }
  return out;
}
