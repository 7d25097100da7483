import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import { getEnv } from '@/lib/env';

export type OutgoingMail = { to: string[]; subject: string; text: string; html?: string };

const globalForMail = globalThis as unknown as { rigcallMail?: Transporter };

function transport(): Transporter {
  if (!globalForMail.rigcallMail) globalForMail.rigcallMail = nodemailer.createTransport(getEnv().SMTP_URL);
  return globalForMail.rigcallMail;
}

/** Send one message through the configured SMTP server (the local catcher, or the provider). */
export async function sendMail(mail: OutgoingMail): Promise<{ messageId: string }> {
  const info = await transport().sendMail({ from: getEnv().MAIL_FROM, ...mail });
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

export type CaughtMail = { id: string; receivedAt: string; from: string | null; to: string[]; subject: string };

/** What the local mail catcher received (development and tests; absent with a real provider). */
export async function listCaughtMail(): Promise<CaughtMail[] | null> {
  const url = getEnv().MAIL_CATCHER_URL;
  if (!url) return null;
  const res = await fetch(`${url}/messages`, { cache: 'no-store' });
  if (!res.ok) throw new Error(`mail catcher answered ${res.status}`);
  const body = (await res.json()) as { messages: CaughtMail[] };
  return body.messages;
}
