// A local SMTP catcher for development and tests: accepts every message on loopback and shows them over HTTP
// (GET /messages, GET /messages/:id, DELETE /messages). Never used in production, where SMTP_URL names a provider.
import http from 'node:http';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

const SMTP_PORT = Number(process.env.MAIL_CATCHER_SMTP_PORT ?? 2525);
const HTTP_PORT = Number(process.env.MAIL_CATCHER_HTTP_PORT ?? 2580);
const HOST = '127.0.0.1';
/** Oldest messages are dropped past this many, so a long-running dev server stays small. */
const MAX_MESSAGES = 500;
const MAX_MESSAGE_BYTES = 5 * 1024 * 1024;

const messages = [];
let nextId = 1;

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS'],
  size: MAX_MESSAGE_BYTES,
  banner: 'Epicycle local mail catcher',
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((mail) => {
        messages.push({
          id: String(nextId++),
          receivedAt: new Date().toISOString(),
          from: mail.from?.text ?? '',
          to: session.envelope.rcptTo.map((r) => r.address.toLowerCase()),
          subject: mail.subject ?? '',
          text: mail.text ?? '',
          html: typeof mail.html === 'string' ? mail.html : '',
        });
        while (messages.length > MAX_MESSAGES) messages.shift();
        callback();
      })
      .catch(callback);
  },
});

const server = http.createServer((req, res) => {
  const url = new URL(req.url ?? '/', `http://${HOST}`);
  const send = (status, body) => {
    res.writeHead(status, { 'content-type': 'application/json' });
    res.end(JSON.stringify(body));
  };
  if (req.method === 'GET' && url.pathname === '/health') return send(200, { ok: true, count: messages.length });
  if (req.method === 'GET' && url.pathname === '/messages') {
    const to = url.searchParams.get('to')?.toLowerCase();
    const list = to ? messages.filter((m) => m.to.includes(to)) : messages;
    return send(200, [...list].reverse());
  }
  const one = /^\/messages\/(\d+)$/.exec(url.pathname);
  if (req.method === 'GET' && one) {
    const m = messages.find((x) => x.id === one[1]);
    return m ? send(200, m) : send(404, { error: 'not found' });
  }
  if (req.method === 'DELETE' && url.pathname === '/messages') {
    messages.length = 0;
    return send(200, { ok: true });
  }
  send(404, { error: 'not found' });
});

smtp.listen(SMTP_PORT, HOST, () => {
  server.listen(HTTP_PORT, HOST, () => {
    process.stdout.write(`mail catcher: SMTP ${HOST}:${SMTP_PORT}, messages at http://${HOST}:${HTTP_PORT}/messages\n`);
  });
});
smtp.on('error', (e) => {
  process.stderr.write(`mail catcher SMTP error: ${e.message}\n`);
});
const stop = () => {
  smtp.close(() => server.close(() => process.exit(0)));
  setTimeout(() => process.exit(0), 1000).unref();
};
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
