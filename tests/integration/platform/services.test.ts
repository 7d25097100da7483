import { createHash, randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { GET as health } from '@/app/api/health/route';
import { sendMail } from '@/lib/mail';
import { getObjectBytes, presignPut, putObject } from '@/lib/storage';
import { readJson } from '../../setup/read-json';

const catcher = () => {
  const url = process.env.MAIL_CATCHER_URL;
  if (!url) throw new Error('MAIL_CATCHER_URL is not set');
  return url;
};

async function waitForMail(to: string, ms = 5000) {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    const res = await fetch(`${catcher()}/messages?to=${encodeURIComponent(to)}`);
    const { messages } = (await res.json()) as { messages: { id: string; subject: string }[] };
    if (messages.length) return messages;
    await new Promise((r) => setTimeout(r, 100));
  }
  return [];
}

describe('local services', () => {
  it('GET /api/health reports database, mail and storage ok (the version only to a signed-in user)', async () => {
    const res = await health(new Request('http://127.0.0.1/api/health'), { params: Promise.resolve({}) });
    expect(res.status).toBe(200);
    const body = await readJson<{ ok: boolean; version?: string; services: Record<string, string> }>(res);
    expect(body).toMatchObject({ ok: true, services: { database: 'ok', mail: 'ok', storage: 'ok' } });
    expect(body.version).toBeUndefined();
  });

  it('a mail sent by the app reaches the catcher, with text and HTML', async () => {
    const to = `shop-${randomUUID().slice(0, 8)}@test.example`;
    const fleetId = randomUUID();
    await sendMail({
      fleetId,
      to: [to],
      subject: 'Unit 214 out of service',
      text: 'Steer tire bulge, major.',
      html: '<p>Steer tire <b>bulge</b>, major.</p>',
    });
    const messages = await waitForMail(to);
    expect(messages).toHaveLength(1);
    const full = await readJson<{ subject: string; to: string[]; text: string; html: string; fleetId: string }>(
      await fetch(`${catcher()}/messages/${messages[0]!.id}`),
    );
    // The catcher files the message under its fleet, from the header the app sets.
    expect(full).toMatchObject({ subject: 'Unit 214 out of service', to: [to], fleetId });
    expect(full.text).toContain('Steer tire bulge, major.');
    expect(full.html).toContain('<b>bulge</b>');
  });

  it('an object put through the S3 SDK reads back byte for byte', async () => {
    const key = `test/${randomUUID()}.bin`;
    const bytes = new Uint8Array(70_000).map((_, i) => (i * 31) % 251);
    await putObject(key, bytes, 'application/octet-stream');
    const back = await getObjectBytes(key);
    expect(createHash('sha256').update(back.bytes).digest('hex')).toBe(
      createHash('sha256').update(bytes).digest('hex'),
    );
  });

  it('a presigned PUT URL accepts an upload that the SDK then reads', async () => {
    const key = `test/${randomUUID()}.jpg`;
    const url = await presignPut(key, 'image/jpeg');
    const payload = new TextEncoder().encode('not really a jpeg, but bytes');
    const put = await fetch(url, { method: 'PUT', body: payload, headers: { 'content-type': 'image/jpeg' } });
    expect(put.status).toBe(200);
    const back = await getObjectBytes(key);
    expect(new TextDecoder().decode(back.bytes)).toBe('not really a jpeg, but bytes');
    expect(back.contentType).toBe('image/jpeg');
  });
});
