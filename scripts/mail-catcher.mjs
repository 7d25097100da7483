// Local mail catcher on loopback, standing in for the hosted mail provider.
// SMTP in (smtp-server), each message parsed (mailparser) and kept as JSON in --dir;
// a small HTTP API lists them for the app's admin page and the tests:
//   GET /messages            newest first, without bodies (?to=ADDRESS, ?fleet=FLEET_ID)
//   GET /messages/:id        one message with text and html
//   DELETE /messages         empty the box
// Usage: node scripts/mail-catcher.mjs --smtp 2525 --http 1080 --dir .data/mail
import crypto from 'node:crypto';
import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

const { values } = parseArgs({
  options: {
    smtp: { type: 'string', default: '2525' },
    http: { type: 'string', default: '1080' },
    dir: { type: 'string', default: '.data/mail' },
  },
});
const dir = values.dir;
fs.mkdirSync(dir, { recursive: true });

const addressList = (a) => (Array.isArray(a) ? a : a ? [a] : []).flatMap((x) => x.value.map((v) => v.address ?? ''));

const headerText = (v) => (typeof v === 'string' && v.trim() ? v.trim() : null);

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS'],
  logger: false,
  size: 25 * 1024 * 1024,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((mail) => {
        const id = `${Date.now().toString(36)}-${crypto.randomBytes(4).toString('hex')}`;
        const record = {
          id,
          receivedAt: new Date().toISOString(),
          // The app names the fleet a message belongs to in this header; the admin page lists per fleet.
          fleetId: headerText(mail.headers.get('x-rigcall-fleet')),
          envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
          envelopeTo: session.envelope.rcptTo.map((r) => r.address),
          from: addressList(mail.from)[0] ?? null,
          to: addressList(mail.to),
          cc: addressList(mail.cc),
          subject: mail.subject ?? '',
          text: mail.text ?? '',
          html: typeof mail.html === 'string' ? mail.html : '',
          attachments: mail.attachments.map((a) => ({
            filename: a.filename,
            contentType: a.contentType,
            size: a.size,
          })),
        };
        fs.writeFileSync(path.join(dir, `${id}.json`), JSON.stringify(record));
        callback();
      })
      .catch((err) => callback(err));
  },
});

function listMessages() {
  return fs
    .readdirSync(dir)
    .filter((f) => f.endsWith('.json'))
    .map((f) => JSON.parse(fs.readFileSync(path.join(dir, f), 'utf8')))
    .sort((a, b) => (a.receivedAt < b.receivedAt ? 1 : a.receivedAt > b.receivedAt ? -1 : b.id.localeCompare(a.id)));
}

const api = http.createServer((req, res) => {
  const send = (status, body) => {
    res.writeHead(status, { 'content-type': 'application/json' });
    res.end(JSON.stringify(body));
  };
  const url = new URL(req.url ?? '/', 'http://127.0.0.1');
  try {
    if (req.method === 'GET' && url.pathname === '/health') return send(200, { ok: true });
    if (req.method === 'GET' && url.pathname === '/messages') {
      const to = url.searchParams.get('to');
      const fleet = url.searchParams.get('fleet');
      const list = listMessages()
        .filter((m) => !to || m.envelopeTo.includes(to) || m.to.includes(to))
        .filter((m) => fleet === null || m.fleetId === fleet)
        .map(({ text: _text, html: _html, ...head }) => head);
      return send(200, { messages: list });
    }
    const one = url.pathname.match(/^\/messages\/([a-z0-9-]+)$/);
    if (req.method === 'GET' && one) {
      const file = path.join(dir, `${one[1]}.json`);
      if (!fs.existsSync(file)) return send(404, { error: 'no such message' });
      return send(200, JSON.parse(fs.readFileSync(file, 'utf8')));
    }
    if (req.method === 'DELETE' && url.pathname === '/messages') {
      for (const f of fs.readdirSync(dir)) if (f.endsWith('.json')) fs.unlinkSync(path.join(dir, f));
      return send(200, { ok: true });
    }
    send(404, { error: 'not found' });
  } catch (err) {
    send(500, { error: String(err) });
  }
});

smtp.listen(Number(values.smtp), '127.0.0.1', () => {
  api.listen(Number(values.http), '127.0.0.1', () => {
    console.log(`mail catcher: smtp 127.0.0.1:${values.smtp}, http 127.0.0.1:${values.http}`);
  });
});

const shutdown = () => {
  api.close();
  smtp.close(() => process.exit(0));
  setTimeout(() => process.exit(0), 2000).unref();
};
process.on('SIGTERM', shutdown);
process.on('SIGINT', shutdown);
