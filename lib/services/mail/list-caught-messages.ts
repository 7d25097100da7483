import 'server-only';
import { listCaughtMail } from '@/lib/mail';

/** What the local mail catcher received, newest first; null when a real mail provider is configured. */
export async function listCaughtMessages({ to }: { to?: string } = {}) {
  const all = await listCaughtMail();
  if (all === null) return { configured: false as const, messages: [] };
  return { configured: true as const, messages: to ? all.filter((m) => m.to.includes(to)) : all };
}
