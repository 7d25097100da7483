/** Longest utterance we try to read; anything longer is not speech from the walk. */
export const MAX_INPUT_CHARS = 400;

export type NormalizeTables = {
  contractions: Readonly<Record<string, string>>;
  replacements: Readonly<Record<string, string>>;
};

export type Normalizer = (raw: string) => string[];

type Replacement = { from: string[]; to: string[] };

/**
 * Build the text normaliser: case, accents, punctuation, contractions, digit/letter runs
 * ("125psi"), fractions ("5/32", "2-1/2"), and the recogniser's usual confusions (break → brake).
 * Filler words are kept here; the matcher gives them no weight.
 */
export function createNormalizer(tables: NormalizeTables): Normalizer {
  const contractions = new Map(Object.entries(tables.contractions));
  const replacements: Replacement[] = Object.entries(tables.replacements)
    .map(([from, to]) => ({ from: from.split(' '), to: to.split(' ').filter(Boolean) }))
    .sort((a, b) => b.from.length - a.from.length);
  const byFirst = new Map<string, Replacement[]>();
  for (const r of replacements) {
    const head = r.from[0] ?? '';
    const list = byFirst.get(head) ?? [];
    list.push(r);
    byFirst.set(head, list);
  }

  return (raw: string): string[] => {
    if (typeof raw !== 'string' || raw.length === 0 || raw.length > MAX_INPUT_CHARS) return [];
    let text = raw
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .toLowerCase()
      .replace(/[\u2018\u2019\u02bc`]/g, "'")
      .replace(/(\d),(\d{3})/g, '$1$2')
      .replace(/(\d)-(\d+\/\d+)/g, '$1 $2')
      .replace(/(\d)\s*\/\s*(\d)/g, '$1/$2')
      .replace(/(\d)([a-z])/g, '$1 $2')
      .replace(/([a-z])(\d)/g, '$1 $2')
      .replace(/[^a-z0-9'/.:\s]/g, ' ')
      .replace(/(^|\s)[./:']+|[./:']+(?=\s|$)/g, ' ');
    text = text.replace(/\.(?!\d)/g, ' ');
    const words: string[] = [];
    for (const w of text.split(/\s+/)) {
      if (!w) continue;
      const expanded = contractions.get(w);
      if (expanded) words.push(...expanded.split(' '));
      else words.push(w.replace(/'s$/, '').replace(/'/g, ''));
    }
    const out: string[] = [];
    for (let i = 0; i < words.length;) {
      const w = words[i] ?? '';
      if (w === '') {
        i += 1;
        continue;
      }
      const candidates = byFirst.get(w);
      let applied = false;
      if (candidates) {
        for (const r of candidates) {
          if (r.from.every((f, k) => words[i + k] === f)) {
            out.push(...r.to);
            i += r.from.length;
            applied = true;
            break;
          }
        }
      }
      if (!applied) {
        out.push(w);
        i += 1;
      }
    }
    return out.slice(0, 40);
  };
}
