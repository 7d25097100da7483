import { readFileSync, writeFileSync } from 'node:fs';
import { dictionary } from 'cmu-pronouncing-dictionary';
import { createNormalizer } from '@/lib/matcher/normalize-text';
import { createPronouncer } from '@/lib/matcher/pronounce';
import { grammarSchema } from '@/lib/schemas/grammar';

/**
 * `npm run build:pronunciations`: the pronunciations of our vocabulary's words only (component,
 * condition, command, position, number, measure and unit words of grammars/*.json) from the CMU
 * pronouncing dictionary (npm package cmu-pronouncing-dictionary), stress marks dropped, first
 * pronunciation kept. Words it lacks are built from a dictionary word and a suffix, two dictionary
 * words, or the letter-to-sound rules, and listed under `guessed`. Writes lib/matcher/pronunciations.json.
 */
const root = new URL('../', import.meta.url);
const readJson = (p: string): unknown => JSON.parse(readFileSync(new URL(p, root), 'utf8'));
const g = grammarSchema.parse({
  vocabulary: readJson('grammars/vocabulary.json'),
  commands: readJson('grammars/commands.json'),
  positions: readJson('grammars/positions.json'),
  numbers: readJson('grammars/numbers.json'),
  zones: readJson('grammars/zones.json'),
});
const normalize = createNormalizer(g.commands);
const phrases = [
  ...g.vocabulary.components.flatMap((c) => c.phrases),
  ...g.vocabulary.conditions.flatMap((c) => c.phrases),
  ...g.commands.commands.flatMap((c) => c.phrases),
  ...g.commands.fillers,
  ...g.positions.positions.flatMap((p) => p.phrases),
  ...g.positions.axleWords,
  ...Object.keys(g.positions.ordinals),
  ...Object.keys(g.numbers.units),
  ...Object.keys(g.numbers.tens),
  ...Object.keys(g.numbers.scales),
  ...Object.keys(g.numbers.fractions),
  ...Object.values(g.numbers.measureWords).flat(),
  ...Object.values(g.numbers.unitWords).flat(),
  ...g.zones.zones.flatMap((z) => z.phrases),
];
const words = new Set<string>();
for (const p of phrases) for (const w of normalize(p)) if (/^[a-z]+$/.test(w)) words.add(w);
const dict = dictionary as Record<string, string>;
const strip = (s: string) => s.replace(/\d/g, '').replace(/\s+/g, ' ').trim();
const table = new Map<string, string>();
for (const [w, p] of Object.entries(dict)) if (!w.includes('(')) table.set(w, strip(p));
const pronounce = createPronouncer(table);
const out: Record<string, string> = {};
const guessed: string[] = [];
for (const w of [...words].sort()) {
  if (!table.has(w)) guessed.push(w);
  out[w] = pronounce(w).join(' ');
}
writeFileSync(
  new URL('lib/matcher/pronunciations.json', root),
  `${JSON.stringify({ version: 1, source: 'CMU pronouncing dictionary (cmu-pronouncing-dictionary 3.0.0), stress removed', words: out, guessed }, null, 1)}\n`,
);
console.log(`${Object.keys(out).length} words, ${guessed.length} not in the dictionary: ${guessed.join(' ')}`);
