import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { wordsToNumbers } from 'words-to-numbers';
import numbers from '@/grammars/numbers.json';
import commands from '@/grammars/commands.json';
import { commandsSchema, numbersSchema } from '@/lib/schemas/grammar';
import { createNormalizer } from './normalize-text';
import { createQuantityReader } from './read-quantities';

const normalize = createNormalizer(commandsSchema.parse(commands));
const read = createQuantityReader(numbersSchema.parse(numbers));
const readOne = (text: string, timeContext = false) => read(normalize(text), { timeContext });

const ONES = [
  'zero',
  'one',
  'two',
  'three',
  'four',
  'five',
  'six',
  'seven',
  'eight',
  'nine',
  'ten',
  'eleven',
  'twelve',
  'thirteen',
  'fourteen',
  'fifteen',
  'sixteen',
  'seventeen',
  'eighteen',
  'nineteen',
];
const TENS = ['', '', 'twenty', 'thirty', 'forty', 'fifty', 'sixty', 'seventy', 'eighty', 'ninety'];

/** Plain English cardinal for 0..9999 ("three thousand forty two", optional "and" after hundred). */
function spellCardinal(n: number, useAnd: boolean): string {
  const below100 = (x: number) =>
    x < 20 ? (ONES[x] ?? '') : `${TENS[Math.floor(x / 10)] ?? ''}${x % 10 ? ` ${ONES[x % 10] ?? ''}` : ''}`;
  if (n < 100) return below100(n);
  const parts: string[] = [];
  const th = Math.floor(n / 1000);
  const h = Math.floor((n % 1000) / 100);
  const rest = n % 100;
  if (th) parts.push(`${below100(th)} thousand`);
  if (h) parts.push(`${ONES[h] ?? ''} hundred`);
  if (rest) parts.push(`${useAnd && (h || th) ? 'and ' : ''}${below100(rest)}`);
  return parts.join(' ');
}

describe('spoken numbers against a reference library', () => {
  // words-to-numbers (npm) as reference, on plain cardinals only, where it is reliable
  it('agrees with words-to-numbers on generated plain cardinals 0..9999', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 9999 }), fc.boolean(), (n, useAnd) => {
        const text = spellCardinal(n, useAnd);
        const reference = wordsToNumbers(text);
        const ours = readOne(text);
        expect(reference).toBe(n);
        expect(ours).toHaveLength(1);
        expect(ours[0]?.value).toBe(n);
      }),
      { numRuns: 400 },
    );
  });

  it('reads the trade idioms that a general library does not (figures printed)', () => {
    // 60 idioms: tread in 32nds, "one twenty five", halves and quarters, minutes and seconds
    const idioms: [string, number][] = [];
    for (let n = 2; n <= 11; n += 1) idioms.push([`${ONES[n]} thirty seconds`, n]);
    for (const [a, b] of [
      [1, 12],
      [1, 10],
      [1, 15],
      [1, 20],
      [1, 25],
      [1, 30],
      [1, 35],
      [1, 40],
      [1, 45],
      [1, 50],
    ] as const)
      idioms.push([`${ONES[a]} ${spellCardinal(b, false)}`, a * 100 + b]);
    for (let n = 1; n <= 10; n += 1) idioms.push([`${ONES[n]} and a half`, n + 0.5]);
    for (let n = 1; n <= 10; n += 1) idioms.push([`${ONES[n]} and three quarters`, n + 0.75]);
    for (let n = 1; n <= 5; n += 1) idioms.push([`${ONES[n]} and a quarter`, n + 0.25]);
    for (let s = 10; s <= 50; s += 10) idioms.push([`one minute ${spellCardinal(s, false)} seconds`, 60 + s]);
    for (let n = 1; n <= 5; n += 1) idioms.push([`hundred and ${ONES[n]}`, 100 + n]);
    for (let n = 1; n <= 5; n += 1) idioms.push([`${ONES[n]} oh ${ONES[n + 1]}`, n * 100 + n + 1]);
    expect(idioms).toHaveLength(60);
    let referenceRight = 0;
    let oursRight = 0;
    for (const [text, want] of idioms) {
      if (wordsToNumbers(text) === want) referenceRight += 1;
      if (readOne(text)[0]?.value === want) oursRight += 1;
      else console.log(`missed idiom: ${text}`);
    }
    console.log(`trade idioms: ours ${oursRight}/60, words-to-numbers ${referenceRight}/60`);
    expect(oursRight).toBe(60);
  });
});

describe('readQuantities', () => {
  it.each([
    ['five thirty seconds', 5, '32nds'],
    ['6/32', 6, '32nds'],
    ['4 32nds', 4, '32nds'],
    ['three over thirty two', 3, '32nds'],
    ['hundred and five pounds', 105, 'psi'],
    ['ninety five psi', 95, 'psi'],
    ['one oh five psi', 105, 'psi'],
    ['two and a half inches', 2.5, 'in'],
    ['2-1/2 inches', 2.5, 'in'],
    ['two point five inches', 2.5, 'in'],
    ['an inch and a half', 1.5, 'in'],
    ['three quarters of an inch', 0.75, 'in'],
    ['one minute twenty seconds', 80, 's'],
    ['a minute and a half', 90, 's'],
    ['forty five seconds', 45, 's'],
    ['1:20', 80, 's'],
    ['thirty seconds', 30, 's'],
  ] as const)('%s → %d %s', (text, value, unit) => {
    const q = readOne(text);
    expect(q[0]?.value).toBeCloseTo(value, 6);
    expect(q[0]?.unit).toBe(unit);
  });

  it('reads "one twenty" as 125-style hundreds, or as 1:20 in a timing step', () => {
    expect(readOne('one twenty five')[0]?.value).toBe(125);
    expect(readOne('one twenty', true)[0]?.value).toBe(80);
  });

  it('leaves the ambiguous words "to" and "for" alone unless a unit follows', () => {
    expect(readOne('from eighty five to a hundred').map((q) => q.value)).toEqual([85, 100]);
    expect(readOne('tread for thirty seconds')[0]).toMatchObject({ value: 4, unit: '32nds' });
    expect(readOne('go to the fuel island')).toEqual([]);
  });

  it('never throws on arbitrary token lists', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.constantFrom(
            'one',
            'and',
            'a',
            'half',
            'hundred',
            'thirty',
            'seconds',
            'minute',
            'oh',
            '3/0',
            '0/0',
            'point',
            'psi',
            'for',
            'inch',
            'x',
          ),
          { maxLength: 12 },
        ),
        (tokens) => {
          for (const q of read(tokens)) expect(Number.isFinite(q.value)).toBe(true);
        },
      ),
      { numRuns: 300 },
    );
  });
});
