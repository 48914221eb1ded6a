import { createServer as createHttpServer, type Server as HttpServer } from 'node:http';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export interface StoredMessage {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  headers: Record<string, string>;
}

export interface FakeMailServer {
  smtpPort: number;
  httpUrl: string;
  messages: StoredMessage[];
  close(): Promise<void>;
}

const MAX_KEPT = 2_000;

/**
 * A local SMTP server that accepts every message and keeps it in memory, with a small
 * JSON API beside it (GET /messages, DELETE /messages) for the admin outbox page and the tests.
 */
export async function createFakeMailServer(opts: {
  smtpPort: number;
  httpPort: number;
  host?: string;
}): Promise<FakeMailServer> {
  const host = opts.host ?? '127.0.0.1';
  const messages: StoredMessage[] = [];
  let nextId = 1;

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: 5 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const headers: Record<string, string> = {};
          for (const [k, v] of parsed.headers) headers[k] = typeof v === 'string' ? v : JSON.stringify(v);
          messages.push({
            id: nextId++,
            receivedAt: new Date().toISOString(),
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to: session.envelope.rcptTo.map((r) => r.address.toLowerCase()),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : '',
            headers,
          });
          if (messages.length > MAX_KEPT) messages.splice(0, messages.length - MAX_KEPT);
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });

  const http = createHttpServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://fake');
    res.setHeader('content-type', 'application/json');
    if (url.pathname === '/messages' && req.method === 'GET') {
      const to = url.searchParams.get('to')?.toLowerCase();
      const list = to ? messages.filter((m) => m.to.includes(to)) : messages;
      res.end(JSON.stringify({ messages: [...list].reverse() }));
    } else if (url.pathname === '/messages' && req.method === 'DELETE') {
      messages.length = 0;
      res.end(JSON.stringify({ ok: true }));
    } else if (url.pathname === '/health') {
      res.end(JSON.stringify({ status: 'available' }));
    } else {
      res.statusCode = 404;
      res.end(JSON.stringify({ error: 'not found' }));
    }
  });

  await new Promise<void>((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(opts.smtpPort, host, () => resolve());
  });
  await new Promise<void>((resolve, reject) => {
    http.once('error', reject);
    http.listen(opts.httpPort, host, () => resolve());
  });
  const smtpPort = (smtp.server.address() as { port: number }).port;
  const httpPort = ((http as HttpServer).address() as { port: number }).port;

  return {
    smtpPort,
    httpUrl: `http://${host}:${httpPort}`,
    messages,
    close: () =>
      Promise.all([
        new Promise<void>((r) => smtp.close(() => r())),
        new Promise<void>((r) => http.close(() => r())),
      ]).then(() => undefined),
  };
}
