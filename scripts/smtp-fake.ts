// Development and test SMTP server: accepts every message (no auth, no TLS), keeps it, and lists
// what arrived over HTTP so people and tests can read the mail the app sent.
//   SMTP  on TW_FAKE_HOST:TW_SMTP_PORT     (default 127.0.0.1:54325; 0 = any free port)
//   HTTP  on TW_FAKE_HOST:TW_MAILBOX_PORT  (default 127.0.0.1:54326)
//     GET    /messages[?to=address&limit=n]  {"messages":[{to,subject,text,html,date,…}]} newest first
//     DELETE /messages                        {"deleted":n}
//   (the same on "/", so DEV_MAILBOX_URL works with or without the /messages suffix)
//   TW_MAIL_FILE: JSON file that keeps the mail across restarts (optional).
import { randomUUID } from 'node:crypto';
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { announceReady, fatal, onStop, portFromEnv } from './fakes/fake-lifecycle';
import { Mailbox } from './fakes/mailbox';

const MAX_MESSAGE_BYTES = 25 * 1024 * 1024;

function addressesOf(field: AddressObject | AddressObject[] | undefined): string {
  if (!field) return '';
  return (Array.isArray(field) ? field : [field]).map((a) => a.text).join(', ');
}

function createSmtpServer(mailbox: Mailbox): SMTPServer {
  return new SMTPServer({
    secure: false,
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    banner: 'Trenchwork SMTP fake',
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          if (stream.sizeExceeded) {
            const error = new Error('Message exceeds the fake mailbox size limit') as Error & { responseCode: number };
            error.responseCode = 552;
            return callback(error);
          }
          const recipients = session.envelope.rcptTo.map((r) => r.address.toLowerCase());
          const sender = session.envelope.mailFrom;
          mailbox.add({
            id: randomUUID(),
            to: recipients.join(', '),
            recipients,
            from: addressesOf(parsed.from) || (sender ? sender.address : ''),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : undefined,
            date: new Date().toISOString(),
            attachments: parsed.attachments.map((a) => ({ filename: a.filename ?? '', contentType: a.contentType, size: a.size })),
          });
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
}

function sendJson(res: ServerResponse, status: number, body: unknown): void {
  const payload = JSON.stringify(body);
  res.writeHead(status, { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store', 'content-length': Buffer.byteLength(payload) });
  res.end(payload);
}

function handleHttp(mailbox: Mailbox, req: IncomingMessage, res: ServerResponse): void {
  const url = new URL(req.url ?? '/', 'http://mailbox.invalid');
  if (url.pathname === '/health') return sendJson(res, 200, { ok: true, messages: mailbox.size });
  if (url.pathname !== '/messages' && url.pathname !== '/') {
    return sendJson(res, 404, { error: { code: 'not_found', message: `No route ${url.pathname}; use /messages.` } });
  }
  if (req.method === 'GET' || req.method === 'HEAD') {
    const limitParam = url.searchParams.get('limit');
    const limit = limitParam === null ? undefined : Number(limitParam);
    if (limit !== undefined && (!Number.isInteger(limit) || limit < 1)) {
      return sendJson(res, 400, { error: { code: 'invalid_request', message: 'limit must be a positive integer.', fields: { limit: 'positive integer' } } });
    }
    return sendJson(res, 200, { messages: mailbox.list({ to: url.searchParams.get('to') ?? undefined, limit }) });
  }
  if (req.method === 'DELETE') return sendJson(res, 200, { deleted: mailbox.clear() });
  res.setHeader('allow', 'GET, HEAD, DELETE');
  return sendJson(res, 405, { error: { code: 'method_not_allowed', message: `${req.method} is not supported on ${url.pathname}.` } });
}

function listen(server: { listen(port: number, host: string, cb: () => void): unknown; once(event: 'error', cb: (e: Error) => void): unknown }, port: number, host: string, what: string): Promise<void> {
  return new Promise((resolve, reject) => {
    server.once('error', (error: Error) => reject(new Error(`${what} could not listen on ${host}:${port}: ${error.message}`)));
    server.listen(port, host, () => resolve());
  });
}

async function main(): Promise<void> {
  const host = process.env.TW_FAKE_HOST || '127.0.0.1';
  const mailbox = new Mailbox(process.env.TW_MAIL_FILE || undefined);
  const smtp = createSmtpServer(mailbox);
  const http = createServer((req, res) => {
    try {
      handleHttp(mailbox, req, res);
    } catch (error) {
      sendJson(res, 500, { error: { code: 'internal', message: (error as Error).message } });
    }
  });
  smtp.on('error', (error) => console.error(`smtp: ${error.message}`));

  await listen(smtp, portFromEnv('TW_SMTP_PORT', 54325), host, 'SMTP');
  await listen(http, portFromEnv('TW_MAILBOX_PORT', 54326), host, 'mailbox HTTP');
  const smtpPort = (smtp.server.address() as AddressInfo).port;
  const httpPort = (http.address() as AddressInfo).port;

  onStop(async () => {
    mailbox.flush();
    http.closeAllConnections();
    await Promise.all([new Promise<void>((r) => smtp.close(() => r())), new Promise<void>((r) => http.close(() => r()))]);
  });
  announceReady('smtp-fake', { smtpPort, httpPort, messages: mailbox.size });
}

main().catch(fatal);
