import 'server-only';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { DB } from '@/lib/db';
import { findTestSet } from '@/lib/db/vocabulary';
import { AppError } from '@/lib/errors';
import { parseLabelledJsonl, type LabelledUtterance } from '@/lib/matcher/fixture-scoring';
import { labelledUtteranceSchema } from '@/lib/schemas/vocabulary';

export const defaultTestSetName = 'repository labelled set (utterances.jsonl)';

let defaultJsonl: string | null = null;

const repositorySets = new Map<string, string>();

/** A labelled set kept in the repository (tests/fixtures/matcher/NAME), read once. */
export function readRepositorySet(name: string): string {
  let text = repositorySets.get(name);
  if (text === undefined) {
    text = readFileSync(path.join(process.cwd(), 'tests/fixtures/matcher', path.basename(name)), 'utf8');
    repositorySets.set(name, text);
  }
  return text;
}

/** The repository's labelled utterances: the set a fleet starts with. */
export function readDefaultTestSet(): string {
  defaultJsonl ??= readFileSync(path.join(process.cwd(), 'tests/fixtures/matcher/utterances.jsonl'), 'utf8');
  return defaultJsonl;
}

/** Check JSONL line by line; the messages name the line. */
export function parseTestSetOrThrow(jsonl: string): LabelledUtterance[] {
  const problems: Record<string, string[]> = {};
  const lines = jsonl.split('\n');
  lines.forEach((line, i) => {
    if (!line.trim()) return;
    let value: unknown;
    try {
      value = JSON.parse(line);
    } catch {
      problems[`line ${i + 1}`] = ['is not JSON'];
      return;
    }
    const r = labelledUtteranceSchema.safeParse(value);
    if (!r.success)
      problems[`line ${i + 1}`] = r.error.issues.map((x) => `${x.path.join('.') || 'line'}: ${x.message}`);
    else if (r.data.kind === 'defect' && !r.data.termId) problems[`line ${i + 1}`] = ['a defect line needs a termId'];
  });
  const keys = Object.keys(problems);
  if (keys.length)
    throw new AppError(
      'invalid_body',
      `The labelled set has ${keys.length} bad line${keys.length === 1 ? '' : 's'}, first ${keys[0]}: ${problems[keys[0]!]![0]}`,
      problems,
    );
  const items = parseLabelledJsonl(jsonl);
  if (!items.length) throw new AppError('invalid_body', 'The labelled set is empty.', { jsonl: ['no lines'] });
  return items;
}

/** The fleet's labelled set, or the repository's when the fleet has none of its own. */
export async function loadTestSet(db: DB, { fleetId }: { fleetId: string }) {
  const row = await findTestSet(db, { fleetId });
  if (row)
    return {
      name: row.name,
      source: 'fleet' as const,
      jsonl: row.jsonl,
      items: parseLabelledJsonl(row.jsonl),
      updatedAt: row.updatedAt.toISOString(),
    };
  const jsonl = readDefaultTestSet();
  return {
    name: defaultTestSetName,
    source: 'default' as const,
    jsonl,
    items: parseLabelledJsonl(jsonl),
    updatedAt: null,
  };
}
