import 'server-only';
import { sql } from 'kysely';
import commands from '@/grammars/commands.json' with { type: 'json' };
import numbers from '@/grammars/numbers.json' with { type: 'json' };
import positions from '@/grammars/positions.json' with { type: 'json' };
import vocabulary from '@/grammars/vocabulary.json' with { type: 'json' };
import zones from '@/grammars/zones.json' with { type: 'json' };
import type { DB } from '@/lib/db';
import { grammarSchema, type Grammar } from '@/lib/schemas/grammar';
import type { VersionSummary } from '@/lib/schemas/vocabulary';

// Grammar columns are read as text: the camel-case plugin would rewrite the keys inside jsonb.

let defaultGrammar: Grammar | null = null;

/** Freezes a parsed document all the way down, so that a shared copy cannot be changed by one caller for all. */
function deepFreeze<T>(value: T): T {
  if (value && typeof value === 'object' && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const v of Object.values(value)) deepFreeze(v);
  }
  return value;
}

/**
 * The grammars/ files as one document. The files ship with the build and never change while
 * the app runs, so they are checked once and the same frozen document is shared.
 */
export function getDefaultGrammar(): Grammar {
  defaultGrammar ??= deepFreeze(grammarSchema.parse({ vocabulary, commands, positions, numbers, zones }));
  return defaultGrammar;
}

/** A stored grammar as a full document: a bare vocabulary (older rows) gets the other parts from the default files. */
export function toFullGrammar(raw: unknown): Grammar {
  const defaults = { vocabulary, commands, positions, numbers, zones };
  const doc =
    raw && typeof raw === 'object' && 'vocabulary' in raw
      ? { ...defaults, ...(raw as object) }
      : { ...defaults, vocabulary: raw };
  return grammarSchema.parse(doc);
}

const summaryColumns = [
  'v.id',
  'v.label',
  'v.status',
  'v.basedOnId',
  'v.publishedAt',
  'v.createdAt',
  'v.updatedAt',
  'u.name as publishedBy',
] as const;

type SummaryRow = {
  id: string;
  label: string;
  status: VersionSummary['status'];
  basedOnId: string | null;
  publishedAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
  publishedBy: string | null;
};

const toSummary = (r: SummaryRow, inspections = 0): VersionSummary => ({
  id: r.id,
  label: r.label,
  status: r.status,
  basedOnId: r.basedOnId,
  publishedAt: r.publishedAt?.toISOString() ?? null,
  publishedBy: r.publishedBy,
  createdAt: r.createdAt.toISOString(),
  updatedAt: r.updatedAt.toISOString(),
  inspections,
});

/** The fleet's versions, the draft first, then published ones newest first, with how many inspections used each. */
export async function listVocabularyVersions(db: DB, { fleetId }: { fleetId: string }): Promise<VersionSummary[]> {
  const rows = await db
    .selectFrom('vocabularyVersion as v')
    .leftJoin('appUser as u', 'u.id', 'v.publishedBy')
    .select(summaryColumns)
    .select((eb) =>
      eb
        .selectFrom('inspection as i')
        .select((x) => x.fn.countAll<string>().as('n'))
        .whereRef('i.vocabularyVersionId', '=', 'v.id')
        .as('inspections'),
    )
    .where('v.fleetId', '=', fleetId)
    .orderBy(sql`v.status = 'draft'`, 'desc')
    .orderBy(sql`coalesce(v.published_at, v.created_at)`, 'desc')
    .execute();
  return rows.map((r) => toSummary(r, Number(r.inspections ?? 0)));
}

/** One version of the fleet with its full grammar, or undefined. */
export async function findVocabularyVersion(db: DB, { fleetId, id }: { fleetId: string; id: string }) {
  const row = await db
    .selectFrom('vocabularyVersion as v')
    .leftJoin('appUser as u', 'u.id', 'v.publishedBy')
    .select(summaryColumns)
    .select(sql<string>`v.grammar::text`.as('grammarText'))
    .where('v.fleetId', '=', fleetId)
    .where('v.id', '=', id)
    .executeTakeFirst();
  if (!row) return undefined;
  const { grammarText, ...rest } = row;
  const { inspections: _n, ...summary } = toSummary(rest);
  return { ...summary, grammar: toFullGrammar(JSON.parse(grammarText)) };
}

/** The fleet's open draft, if any. */
export async function findDraftVersionId(db: DB, { fleetId }: { fleetId: string }) {
  const row = await db
    .selectFrom('vocabularyVersion')
    .select('id')
    .where('fleetId', '=', fleetId)
    .where('status', '=', 'draft')
    .orderBy('createdAt', 'desc')
    .limit(1)
    .executeTakeFirst();
  return row?.id;
}

/** The fleet's newest published version, if any. */
export async function findNewestPublishedId(db: DB, { fleetId }: { fleetId: string }) {
  const row = await db
    .selectFrom('vocabularyVersion')
    .select('id')
    .where('fleetId', '=', fleetId)
    .where('status', '=', 'published')
    .orderBy('publishedAt', 'desc')
    .limit(1)
    .executeTakeFirst();
  return row?.id;
}

export async function countVocabularyVersions(db: DB, { fleetId }: { fleetId: string }) {
  const row = await db
    .selectFrom('vocabularyVersion')
    .select((eb) => eb.fn.countAll<string>().as('n'))
    .where('fleetId', '=', fleetId)
    .executeTakeFirstOrThrow();
  return Number(row.n);
}

/** Replace a draft's grammar; undefined when the row is not a draft of this fleet. */
export async function updateDraftGrammar(
  db: DB,
  { fleetId, id, grammar, label }: { fleetId: string; id: string; grammar: Grammar; label?: string },
) {
  return db
    .updateTable('vocabularyVersion')
    .set({ grammar: sql`${JSON.stringify(grammar)}::jsonb`, ...(label ? { label } : {}) })
    .where('fleetId', '=', fleetId)
    .where('id', '=', id)
    .where('status', '=', 'draft')
    .returning(['id', 'updatedAt'])
    .executeTakeFirst();
}

export async function findTestSet(db: DB, { fleetId }: { fleetId: string }) {
  return db
    .selectFrom('vocabularyTestSet')
    .select(['id', 'name', 'jsonl', 'lineCount', 'updatedAt'])
    .where('fleetId', '=', fleetId)
    .executeTakeFirst();
}

export async function upsertTestSet(
  db: DB,
  v: { fleetId: string; name: string; jsonl: string; lineCount: number; updatedBy: string },
) {
  return db
    .insertInto('vocabularyTestSet')
    .values(v)
    .onConflict((oc) =>
      oc
        .column('fleetId')
        .doUpdateSet({ name: v.name, jsonl: v.jsonl, lineCount: v.lineCount, updatedBy: v.updatedBy }),
    )
    .returning(['id', 'name', 'lineCount', 'updatedAt'])
    .executeTakeFirstOrThrow();
}

/** What drivers said that the vocabulary missed or half-caught and no trainer has dealt with yet. */
export async function listOpenFieldUtterances(db: DB, { fleetId, limit }: { fleetId: string; limit: number }) {
  return db
    .selectFrom('fieldUtterance')
    .select(['id', 'zone', 'text', 'normalized', 'outcome', 'termKey', 'score', 'createdAt'])
    .where('fleetId', '=', fleetId)
    .where('resolvedAt', 'is', null)
    .orderBy('createdAt', 'desc')
    .limit(limit)
    .execute();
}

export async function resolveFieldUtterances(db: DB, { fleetId, ids }: { fleetId: string; ids: string[] }) {
  if (ids.length === 0) return 0;
  const r = await db
    .updateTable('fieldUtterance')
    .set({ resolvedAt: new Date() })
    .where('fleetId', '=', fleetId)
    .where('id', 'in', ids)
    .where('resolvedAt', 'is', null)
    .executeTakeFirst();
  return Number(r.numUpdatedRows);
}

/** Field utterances a driver corrected to a term ("did you mean …?" → no → the right one): a labelled set from the field. */
export async function listCorrectedFieldUtterances(db: DB, { fleetId, limit }: { fleetId: string; limit: number }) {
  return db
    .selectFrom('fieldUtterance')
    .select(['text', 'zone', 'termKey'])
    .where('fleetId', '=', fleetId)
    .where('outcome', '=', 'corrected')
    .where('termKey', 'is not', null)
    .orderBy('createdAt', 'desc')
    .limit(limit)
    .execute();
}
