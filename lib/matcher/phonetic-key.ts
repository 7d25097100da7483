/**
 * A small sound-alike key for English trade words: "brake"/"break" → "prk", "chafed"/"chaffed" → "xft".
 * Our own reduction: spelling rules to sounds, voiced/unvoiced pairs merged, vowels dropped after the first letter.
 */
export function getPhoneticKey(word: string): string {
  let w = word.toLowerCase().replace(/[^a-z]/g, '');
  if (w.length === 0) return '';
  w = w
    .replace(/^kn/, 'n')
    .replace(/^wr/, 'r')
    .replace(/^ps/, 's')
    .replace(/ph/g, 'f')
    .replace(/gh/g, '')
    .replace(/ck/g, 'k')
    .replace(/sch/g, 'sk')
    .replace(/ch|sh/g, 'x')
    .replace(/th/g, 't')
    .replace(/c(?=[eiy])/g, 's')
    .replace(/c/g, 'k')
    .replace(/q/g, 'k')
    .replace(/x/g, 'x')
    .replace(/dg/g, 'j')
    .replace(/z/g, 's')
    .replace(/v/g, 'f')
    .replace(/b/g, 'p')
    .replace(/d/g, 't')
    .replace(/g/g, 'k');
  const first = w[0] ?? '';
  const rest = w.slice(1).replace(/[aeiouyhw]/g, '');
  const key = (/[aeiouy]/.test(first) ? 'a' : first) + rest;
  return key.replace(/(.)\1+/g, '$1');
}
