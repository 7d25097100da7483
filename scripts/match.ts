import { createInterface } from 'node:readline';
import { getDefaultMatcher } from '@/lib/matcher';
import type { MatchContext } from '@/lib/matcher';

/** `npm run -s match -- [--zone ZONE] [--measure KIND] [--profile us|ca]`: one utterance a line in, one JSON line out. */
function readFlag(args: string[], name: string): string | undefined {
  const i = args.indexOf(`--${name}`);
  if (i >= 0) return args[i + 1];
  const eq = args.find((a) => a.startsWith(`--${name}=`));
  return eq?.slice(name.length + 3);
}

const args = process.argv.slice(2);
const profile = readFlag(args, 'profile');
const ctx: MatchContext = {
  zone: readFlag(args, 'zone') ?? null,
  measure: (readFlag(args, 'measure') as MatchContext['measure']) ?? null,
  component: readFlag(args, 'component') ?? null,
  profile: profile === 'ca' ? 'ca' : 'us',
};
const matcher = getDefaultMatcher();
const rl = createInterface({ input: process.stdin, crlfDelay: Infinity });
rl.on('line', (line) => {
  let out: object;
  try {
    out = matcher.match(line, ctx);
  } catch {
    out = {
      input: line,
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
    };
  }
  process.stdout.write(`${JSON.stringify(out)}\n`);
});
