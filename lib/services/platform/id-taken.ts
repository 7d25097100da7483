import 'server-only';
import { AppError } from '@/lib/errors';

/**
 * The one answer for an id the device chose that is already taken, whoever took it: the same
 * words for this fleet's records and another fleet's, so the answer tells nothing about others.
 */
export function idTakenError(): AppError {
  return new AppError(
    'conflict',
    'That id is already in use. Nothing was saved; the device picks a new id and sends again.',
  );
}
