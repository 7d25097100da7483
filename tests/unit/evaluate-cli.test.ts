import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../..', import.meta.url));
const tsx = `${root}node_modules/.bin/tsx`;

function startCli(args: string[] = []) {
  const child = spawn(tsx, ['scripts/evaluate.ts', ...args], { cwd: root, stdio: ['pipe', 'pipe', 'pipe'] });
  let buffer = '';
  const lines: string[] = [];
  const waiters: Array<() => void> = [];
  child.stdout.setEncoding('utf8');
  child.stdout.on('data', (chunk: string) => {
    buffer += chunk;
    let index = buffer.indexOf('\n');
    while (index >= 0) {
      lines.push(buffer.slice(0, index));
      buffer = buffer.slice(index + 1);
      index = buffer.indexOf('\n');
    }
    for (const wake of waiters.splice(0)) wake();
  });
  const waitForLines = async (count: number) => {
    while (lines.length < count) await new Promise<void>((resolve) => waiters.push(resolve));
    return lines.slice(0, count);
  };
  const exited = new Promise<number | null>((resolve) => child.on('close', resolve));
  return { child, lines, waitForLines, exited };
}

async function runCli(input: string[], args: string[] = []) {
  const cli = startCli(args);
  cli.child.stdin.end(`${input.join('\n')}\n`);
  const code = await cli.exited;
  return { code, lines: cli.lines };
}

/** An error line is `{"error": "..."}` and nothing else, its message matching. */
function expectErrorLine(line: Record<string, unknown> | undefined, message: RegExp) {
  expect(Object.keys(line ?? {})).toEqual(['error']);
  expect(line?.error).toMatch(message);
}

describe('npm run -s evaluate', () => {
  it('answers malformed lines with an error line and goes on', async () => {
    const input = [
      'this is not json',
      '{"check":"tread_depth","position":"steer","value":3}',
      '{"check":"brake_fade","value":1}',
      '{"check":"pushrod_stroke","chamber":"30"}',
      '{"check":"air_leak","mode":"applied","combination":true,"value":-2}',
      '{"check":"low_air_warning","value":"sixty"}',
      '',
      '{"check":"pushrod_stroke","chamber":"30LS","value":2.125}',
      '{"check":"tread_',
      '{"check":"air_leak","mode":"applied","combination":true,"value":5}',
    ];
    const { code, lines } = await runCli(input);
    expect(code).toBe(0);
    expect(lines).toHaveLength(input.length);
    const out = lines.map((line) => JSON.parse(line) as Record<string, unknown>);
    expectErrorLine(out[0], /not JSON/);
    // 49 CFR 393.75(b): steer tread at least 4/32 in.
    expect(out[1]).toMatchObject({
      check: 'tread_depth',
      verdict: 'fail',
      severity: 'major',
      limit: 4,
      source: '49 CFR 393.75(b)',
    });
    expectErrorLine(out[2], /unknown check/);
    expectErrorLine(out[3], /missing field "value"/);
    expectErrorLine(out[4], /must not be negative/);
    expectErrorLine(out[5], /must be a number/);
    expectErrorLine(out[6], /empty line/);
    // 49 CFR 393.47(e): type 30 long stroke, 2-1/2 in.
    expect(out[7]).toMatchObject({ check: 'pushrod_stroke', verdict: 'pass', severity: null, limit: 2.5 });
    expectErrorLine(out[8], /not JSON/);
    // CDL manual §5.3: applied leakage, combination ≤ 4 psi/min.
    expect(out[9]).toMatchObject({ check: 'air_leak', verdict: 'fail', severity: 'major', limit: 4 });
    for (const line of out.filter((entry) => !('error' in entry))) {
      expect(Object.keys(line)).toEqual(expect.arrayContaining(['check', 'verdict', 'severity', 'limit', 'source']));
    }
  }, 60_000);

  it('writes each verdict as soon as its line is read', async () => {
    const cli = startCli();
    cli.child.stdin.write('{"check":"low_air_warning","value":62}\n');
    const [first] = await cli.waitForLines(1);
    expect(JSON.parse(first ?? '')).toMatchObject({ check: 'low_air_warning', verdict: 'pass' });
    cli.child.stdin.write('{"check":"low_air_warning","value":52}\n');
    const both = await cli.waitForLines(2);
    expect(JSON.parse(both[1] ?? '')).toMatchObject({ verdict: 'fail', severity: 'major' });
    cli.child.stdin.end();
    expect(await cli.exited).toBe(0);
  }, 60_000);

  it('picks the profile from the line or from --profile', async () => {
    const { lines } = await runCli(
      ['{"check":"low_air_warning","value":57}', '{"check":"low_air_warning","value":57,"profile":"us"}'],
      ['--profile', 'ca'],
    );
    // MTO Official Air Brake Handbook: 55 psi (Canada); CDL manual §5.3: 60 psi (US).
    expect(lines.map((line) => JSON.parse(line) as Record<string, unknown>)).toMatchObject([
      { profile: 'ca-nsc13', verdict: 'pass' },
      { profile: 'us-federal', verdict: 'fail' },
    ]);
  }, 60_000);
});
