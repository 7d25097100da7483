import 'server-only';
import { getDb } from '@/lib/db';
import { resolveFieldUtterances } from '@/lib/db/vocabulary';
import { recordAudit } from '../platform/record-audit';

/** Take utterances out of the inbox without changing the vocabulary (chatter, noise). */
export async function dismissFieldUtterances({
  fleetId,
  actorId,
  ids,
}: {
  fleetId: string;
  actorId: string;
  ids: string[];
}) {
  return getDb()
    .transaction()
    .execute(async (trx) => {
      const resolved = await resolveFieldUtterances(trx, { fleetId, ids });
      await recordAudit(trx, {
        fleetId,
        actorId,
        action: 'vocabulary.utterances_dismissed',
        entity: 'field_utterance',
        entityId: ids[0]!,
        detail: { count: resolved },
      });
      return { resolved };
    });
}
