import 'server-only';
import { sql } from 'kysely';
import { getDb } from '@/lib/db';
import { checkMail } from '@/lib/mail';
import { checkStorage } from '@/lib/storage';
import packageJson from '@/package.json' with { type: 'json' };

export type Health = {
  ok: boolean;
  version: string;
  services: { database: 'ok' | 'down'; mail: 'ok' | 'down'; storage: 'ok' | 'down' };
};

async function checkDatabase(): Promise<boolean> {
  try {
    await sql`select 1`.execute(getDb());
    return true;
  } catch {
    return false;
  }
}

/** Is each service the app needs answering right now? */
export async function checkHealth(): Promise<Health> {
  const [database, mail, storage] = await Promise.all([checkDatabase(), checkMail(), checkStorage()]);
  const state = (ok: boolean): 'ok' | 'down' => (ok ? 'ok' : 'down');
  return {
    ok: database && mail && storage,
    version: packageJson.version,
    services: { database: state(database), mail: state(mail), storage: state(storage) },
  };
}
