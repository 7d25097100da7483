import 'server-only';
import { getDb } from '@/lib/db';
import { upsertTestSet } from '@/lib/db/vocabulary';
import type { SaveTestSetBody } from '@/lib/schemas/vocabulary';
import { parseTestSetOrThrow } from './load-test-set';
import { recordAudit } from '../platform/record-audit';

/** Import a labelled JSONL set as the fleet's own (replacing the one it had). */
export async function saveTestSet({
  fleetId,
  actorId,
  body,
}: {
  fleetId: string;
  actorId: string;
  body: SaveTestSetBody;
}) {
  const items = parseTestSetOrThrow(body.jsonl);
  const jsonl = `${body.jsonl
    .split('\n')
    .filter((l) => l.trim())
    .join('\n')}\n`;
  return getDb()
    .transaction()
    .execute(async (trx) => {
      const row = await upsertTestSet(trx, {
        fleetId,
        name: body.name,
        jsonl,
        lineCount: items.length,
        updatedBy: actorId,
      });
      await recordAudit(trx, {
        fleetId,
        actorId,
        action: 'vocabulary.test_set_imported',
        entity: 'vocabulary_test_set',
        entityId: row.id,
        detail: { name: body.name, lines: items.length },
      });
      return { name: row.name, count: row.lineCount, source: 'fleet' as const, updatedAt: row.updatedAt.toISOString() };
    });
}
