import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import type SMTPTransport from 'nodemailer/lib/smtp-transport';
import { getEnv } from '@/lib/env';

/** `fleetId`: whose mail this is; it travels in a header so the local catcher can list it per fleet. */
export type OutgoingMail = { fleetId: string; to: string[]; subject: string; text: string; html?: string };

/** The header that names a message's fleet (read by scripts/mail-catcher.mjs). */
export const fleetHeader = 'X-RigCall-Fleet';

/** An SMTP transport (SMTP_URL), so a sent message's info is typed. */
type SmtpTransporter = Transporter<SMTPTransport.SentMessageInfo, SMTPTransport.Options>;

const globalForMail = globalThis as unknown as { rigcallMail?: SmtpTransporter };

function transport(): SmtpTransporter {
  if (!globalForMail.rigcallMail) globalForMail.rigcallMail = nodemailer.createTransport(getEnv().SMTP_URL);
  return globalForMail.rigcallMail;
}

/** Send one message through the configured SMTP server (the local catcher, or the provider). */
export async function sendMail({ fleetId, ...mail }: OutgoingMail): Promise<{ messageId: string }> {
  const headers: Record<string, string> = { [fleetHeader]: fleetId };
  const info = (await transport().sendMail({ from: getEnv().MAIL_FROM, ...mail, headers })) as { messageId: string };
  return { messageId: info.messageId };
}

/** True when the SMTP server answers and accepts our greeting. */
export async function checkMail(): Promise<boolean> {
  try {
    await transport().verify();
    return true;
  } catch {
    return false;
  }
}

export type CaughtMail = {
  id: string;
  receivedAt: string;
  fleetId: string | null;
  from: string | null;
  to: string[];
  subject: string;
};

/**
 * What the local mail catcher received for one fleet (development and tests; absent with a real
 * provider). A message without the fleet header belongs to nobody and is never listed.
 */
export async function listCaughtMail({ fleetId }: { fleetId: string }): Promise<CaughtMail[] | null> {
  const url = getEnv().MAIL_CATCHER_URL;
  if (!url) return null;
  const res = await fetch(`${url}/messages?fleet=${encodeURIComponent(fleetId)}`, {
    cache: 'no-store',
    signal: AbortSignal.timeout(5_000),
  });
  if (!res.ok) throw new Error(`mail catcher answered ${res.status}`);
  const body = (await res.json()) as { messages: CaughtMail[] };
  // Checked here too, so an older catcher that ignores ?fleet= still shows nothing of others'.
  return body.messages.filter((m) => m.fleetId === fleetId);
}
