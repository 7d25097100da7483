import 'server-only';
import { listCaughtMail } from '@/lib/mail';

/**
 * What the local mail catcher received for this fleet, newest first; null when a real mail
 * provider is configured. Another fleet's messages are never listed, whatever `to` asks for.
 */
export async function listCaughtMessages({ fleetId, to }: { fleetId: string; to?: string }) {
  const all = await listCaughtMail({ fleetId });
  if (all === null) return { configured: false as const, messages: [] };
  return { configured: true as const, messages: to ? all.filter((m) => m.to.includes(to)) : all };
}
