import 'server-only';
import { getDb } from '@/lib/db';
import { getVocabularyVersionOrThrow } from './get-vocabulary-version-or-throw';

export const grammarFiles = ['vocabulary', 'commands', 'positions', 'numbers', 'zones'] as const;
export type GrammarFile = (typeof grammarFiles)[number];

/** A version in the grammars/ file format: one file's content, or all five keyed by file name. */
export async function exportGrammar({ fleetId, id, file }: { fleetId: string; id: string; file?: GrammarFile }) {
  const version = await getVocabularyVersionOrThrow(getDb(), { fleetId, id });
  const slug =
    version.label
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '') || 'version';
  if (file) return { filename: `${file}.json`, body: version.grammar[file], label: version.label };
  return { filename: `rigcall-grammar-${slug}.json`, body: version.grammar, label: version.label };
}

/** The grammars/ files' own layout: one-space indent and a final newline. */
export function formatGrammarFile(value: unknown): string {
  return `${JSON.stringify(value, null, 1)}\n`;
}
