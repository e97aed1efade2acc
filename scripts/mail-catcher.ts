/**
 * The local stand-in for a hosted mail service: an SMTP server on loopback (smtp-server) that
 * keeps every message in memory and lists them over HTTP as JSON for /dev/mailbox and the tests.
 * The app sends through nodemailer exactly as it would to a real relay.
 */
import http from 'node:http';
import { randomUUID } from 'node:crypto';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';

export interface CaughtMessage {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  attachments: { filename: string; contentType: string; size: number; contentBase64: string }[];
}

export interface MailCatcher {
  smtpPort: number;
  httpPort: number;
  messages: CaughtMessage[];
  close(): Promise<void>;
}

const MAX_MESSAGES = 500;

export async function startMailCatcher(options: { smtpPort: number; httpPort: number; host?: string }): Promise<MailCatcher> {
  const host = options.host ?? '127.0.0.1';
  const messages: CaughtMessage[] = [];

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: 25 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const to = session.envelope.rcptTo.map((r) => r.address);
          messages.unshift({
            id: randomUUID(),
            receivedAt: new Date().toISOString(),
            from: parsed.from?.text ?? session.envelope.mailFrom?.toString() ?? '',
            to,
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
            attachments: parsed.attachments.map((a) => ({
              filename: a.filename ?? 'attachment',
              contentType: a.contentType,
              size: a.size,
              contentBase64: a.content.toString('base64'),
            })),
          });
          messages.splice(MAX_MESSAGES);
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });

  const api = http.createServer((req, res) => {
    const send = (status: number, body: unknown) => {
      res.writeHead(status, { 'content-type': 'application/json' });
      res.end(JSON.stringify(body));
    };
    const url = new URL(req.url ?? '/', `http://${host}`);
    if (req.method === 'GET' && url.pathname === '/messages') {
      // The list leaves attachment bodies out; fetch one message for them.
      return send(200, messages.map((m) => ({ ...m, attachments: m.attachments.map(({ contentBase64: _, ...meta }) => meta) })));
    }
    const one = url.pathname.match(/^\/messages\/([\w-]+)$/);
    if (req.method === 'GET' && one) {
      const message = messages.find((m) => m.id === one[1]);
      return message ? send(200, message) : send(404, { error: 'no such message' });
    }
    if (req.method === 'DELETE' && url.pathname === '/messages') {
      messages.splice(0);
      return send(200, { deleted: true });
    }
    if (req.method === 'GET' && url.pathname === '/health') return send(200, { ok: true });
    send(404, { error: 'not found' });
  });

  await new Promise<void>((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(options.smtpPort, host, () => resolve());
  });
  await new Promise<void>((resolve, reject) => {
    api.once('error', reject);
    api.listen(options.httpPort, host, () => resolve());
  });
  const smtpAddress = smtp.server.address();
  const apiAddress = api.address();
  return {
    smtpPort: typeof smtpAddress === 'object' && smtpAddress ? smtpAddress.port : options.smtpPort,
    httpPort: typeof apiAddress === 'object' && apiAddress ? apiAddress.port : options.httpPort,
    messages,
    close: () =>
      new Promise<void>((resolve) => {
        api.close(() => smtp.close(() => resolve()));
      }),
  };
}

function argument(name: string, fallback: number): number {
  const index = process.argv.indexOf(`--${name}`);
  return index > 0 ? Number(process.argv[index + 1]) : fallback;
}

if (process.argv[1]?.endsWith('mail-catcher.ts')) {
  startMailCatcher({ smtpPort: argument('smtp-port', 2525), httpPort: argument('http-port', 2580) })
    .then((catcher) => {
      console.log(`ampwarden: mail catcher on smtp://127.0.0.1:${catcher.smtpPort}, messages at http://127.0.0.1:${catcher.httpPort}/messages`);
      const stop = () => void catcher.close().then(() => process.exit(0));
      process.on('SIGINT', stop);
      process.on('SIGTERM', stop);
    })
    .catch((error: Error) => {
      console.error(`ampwarden: mail catcher could not start: ${error.message}`);
      process.exit(1);
    });
}
