/**
 * `npm run -s evaluate`: one JSON measurement a line on stdin, one JSON verdict a line on stdout,
 * written as soon as its line is read. A line that cannot be judged gets `{"error": "..."}` and the
 * program goes on. Optional `--profile us|ca` sets the default profile (a line's own `profile` wins).
 */
import { createInterface } from 'node:readline';
import { evaluateMeasurement } from '../lib/rules/index';

function readProfileArgument(argv: readonly string[]): string | undefined {
  const index = argv.indexOf('--profile');
  if (index >= 0) return argv[index + 1];
  const inline = argv.find((arg) => arg.startsWith('--profile='));
  return inline?.slice('--profile='.length);
}

function evaluateLine(line: string, profile: string | undefined): string {
  const text = line.trim();
  if (text === '') return JSON.stringify({ error: 'empty line: expected one JSON measurement' });
  let input: unknown;
  try {
    input = JSON.parse(text);
  } catch {
    return JSON.stringify({ error: `not JSON: ${text.slice(0, 60)}` });
  }
  return JSON.stringify(evaluateMeasurement(input, { profile }));
}

const profile = readProfileArgument(process.argv.slice(2));
const lines = createInterface({ input: process.stdin, crlfDelay: Infinity, terminal: false });
lines.on('line', (line) => {
  process.stdout.write(`${evaluateLine(line, profile)}\n`);
});
