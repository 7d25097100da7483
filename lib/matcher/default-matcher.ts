import commands from '@/grammars/commands.json';
import numbers from '@/grammars/numbers.json';
import positions from '@/grammars/positions.json';
import vocabulary from '@/grammars/vocabulary.json';
import zones from '@/grammars/zones.json';
import { createMatcher } from './create-matcher';
import type { Matcher } from './types';

let cached: Matcher | null = null;

/** The matcher over the default grammars in grammars/, built once on first use. */
export function getDefaultMatcher(): Matcher {
  cached ??= createMatcher({ vocabulary, commands, positions, numbers, zones });
  return cached;
}
