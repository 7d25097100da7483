import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../../', import.meta.url));
const KEYS = [
  'input',
  'kind',
  'command',
  'component',
  'condition',
  'position',
  'severity',
  'value',
  'unit',
  'termId',
  'score',
  'alternatives',
];

describe('npm run -s match (the command-line contract)', () => {
  it('writes one JSON object a line, and nothing else, for every input line', () => {
    const lines = [
      'bulge on the left steer tire',
      'next',
      'all good',
      'steer tread five thirty seconds',
      '',
      'where is my coffee',
      '\u0000\u0007junk',
    ];
    const run = spawnSync('npx', ['tsx', 'scripts/match.ts', '--zone', 'front'], {
      cwd: root,
      input: `${lines.join('\n')}\n`,
      encoding: 'utf8',
      timeout: 60_000,
    });
    expect(run.status).toBe(0);
    const out = run.stdout
      .trimEnd()
      .split('\n')
      .map((l) => JSON.parse(l) as Record<string, unknown>);
    expect(out).toHaveLength(lines.length);
    for (const o of out) for (const k of KEYS) expect(o).toHaveProperty(k);
    expect(out.map((o) => o.kind)).toEqual(['defect', 'command', 'ok', 'measurement', 'unknown', 'unknown', 'unknown']);
    expect(out[0]).toMatchObject({
      component: 'steer tire',
      condition: 'bulge',
      position: 'left',
      severity: 'major',
      termId: 'steer_tire:bulge',
    });
    expect(out[3]).toMatchObject({ value: 5, unit: '32nds', component: 'steer tire' });
  }, 60_000);
});
