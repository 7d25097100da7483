import { describe, expect, it } from 'vitest';
import commands from '@/grammars/commands.json';
import { commandsSchema } from '@/lib/schemas/grammar';
import { createNormalizer, MAX_INPUT_CHARS } from './normalize-text';
import { getPhoneticKey } from './phonetic-key';

const normalize = createNormalizer(commandsSchema.parse(commands));

describe('normalizeText', () => {
  it.each([
    ["There's a BREAK light out!", 'there is a brake light out'],
    ['Left tyre, uh, low', 'left tire uh low'],
    ['lugnut loose', 'lug nut loose'],
    ['gladhands leaking', 'glad hands leaking'],
    ['U-bolt cracked', 'u bolt cracked'],
    ["won't lock", 'will not lock'],
    ['125psi', '125 psi'],
    ['2-1/2 inches', '2 1/2 inch'],
    ['5/32', '5/32'],
    ['driver’s side', 'driver side'],
    ['Café réfrigéré', 'cafe refrigere'],
  ])('%s → %s', (raw, want) => {
    expect(normalize(raw).join(' ')).toBe(want);
  });

  it('returns nothing for empty, overlong or symbol-only input', () => {
    expect(normalize('')).toEqual([]);
    expect(normalize('a'.repeat(MAX_INPUT_CHARS + 1))).toEqual([]);
    expect(normalize('🚛🚛 ##')).toEqual([]);
  });
});

describe('getPhoneticKey', () => {
  it('gives sound-alike spellings one key', () => {
    expect(getPhoneticKey('brake')).toBe(getPhoneticKey('break'));
    expect(getPhoneticKey('chafed')).toBe(getPhoneticKey('chaffed'));
    expect(getPhoneticKey('kingpin')).toBe(getPhoneticKey('kingpen'));
    expect(getPhoneticKey('muffler')).not.toBe(getPhoneticKey('mirror'));
  });
});
