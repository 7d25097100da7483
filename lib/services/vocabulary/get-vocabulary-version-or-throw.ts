import 'server-only';
import type { DB } from '@/lib/db';
import { findVocabularyVersion } from '@/lib/db/vocabulary';
import { AppError } from '@/lib/errors';

/** One of the fleet's versions with its full grammar; 404 for a missing id or another fleet's. */
export async function getVocabularyVersionOrThrow(db: DB, { fleetId, id }: { fleetId: string; id: string }) {
  const version = await findVocabularyVersion(db, { fleetId, id });
  if (!version) throw new AppError('not_found', 'No such vocabulary version in this fleet.');
  return version;
}

/** The same, and it must still be a draft (published versions never change). */
export async function getDraftVersionOrThrow(db: DB, { fleetId, id }: { fleetId: string; id: string }) {
  const version = await getVocabularyVersionOrThrow(db, { fleetId, id });
  if (version.status !== 'draft')
    throw new AppError(
      'conflict',
      `Version “${version.label}” is published and cannot change. Start a new draft from it.`,
    );
  return version;
}
