// The seal number read aloud at the rear of a loaded trailer, checked digit by digit against the
// one entered at the start.

const digitWords: Record<string, string> = {
  zero: '0',
  oh: '0',
  o: '0',
  nought: '0',
  one: '1',
  won: '1',
  two: '2',
  to: '2',
  too: '2',
  three: '3',
  tree: '3',
  four: '4',
  for: '4',
  fore: '4',
  five: '5',
  six: '6',
  sicks: '6',
  seven: '7',
  eight: '8',
  ate: '8',
  nine: '9',
  niner: '9',
};
const multipliers: Record<string, number> = { double: 2, triple: 3 };

/** "four seven double one 9" → "47119". Letters in a seal number are kept as they are. */
export function readSpokenSeal(text: string): string {
  const out: string[] = [];
  let repeat = 1;
  for (const raw of text
    .toLowerCase()
    .split(/[\s,.-]+/)
    .filter(Boolean)) {
    if (multipliers[raw]) {
      repeat = multipliers[raw];
      continue;
    }
    const piece = digitWords[raw] ?? (/^[0-9a-z]+$/.test(raw) && raw.length <= 12 ? raw.toUpperCase() : '');
    if (!piece) continue;
    out.push(piece.charAt(0).repeat(repeat - 1) + piece);
    repeat = 1;
  }
  return out.join('');
}

export type SealComparison = { matches: boolean; expected: string; heard: string; wrongPositions: number[] };

/** Compare digit by digit; positions are 1-based, for "digit 3 is wrong". */
export function compareSeal(expected: string, heard: string): SealComparison {
  const a = expected.replace(/[\s-]/g, '').toUpperCase();
  const b = heard.replace(/[\s-]/g, '').toUpperCase();
  const wrongPositions: number[] = [];
  for (let i = 0; i < Math.max(a.length, b.length); i++) if (a[i] !== b[i]) wrongPositions.push(i + 1);
  return { matches: wrongPositions.length === 0 && a.length > 0, expected: a, heard: b, wrongPositions };
}
