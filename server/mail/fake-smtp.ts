/**
 * A local fake SMTP server for development and tests: it speaks real SMTP (the `smtp-server` package) on 127.0.0.1,
 * accepts every message and keeps it in memory, parsed by mailparser, so tests can read what was delivered.
 * It never relays anything onwards.
 */
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export interface ReceivedMail {
  from: string;
  to: string[];
  subject: string;
  text: string;
  attachments: { filename: string; contentType: string; size: number }[];
  receivedAt: Date;
}

export interface FakeSmtp {
  port: number;
  messages: ReceivedMail[];
  /** Resolves with the first message (already received or arriving within timeoutMs) that matches. */
  waitFor(match: (m: ReceivedMail) => boolean, timeoutMs?: number): Promise<ReceivedMail>;
  close(): Promise<void>;
}

export async function startFakeSmtp(port = 0): Promise<FakeSmtp> {
  const messages: ReceivedMail[] = [];
  const waiters: { match: (m: ReceivedMail) => boolean; resolve: (m: ReceivedMail) => void }[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    banner: 'Kilowatch local fake mail server',
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const mail: ReceivedMail = {
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            attachments: parsed.attachments.map((a) => ({ filename: a.filename ?? '', contentType: a.contentType, size: a.size })),
            receivedAt: new Date(),
          };
          messages.push(mail);
          for (const w of [...waiters]) {
            if (w.match(mail)) {
              waiters.splice(waiters.indexOf(w), 1);
              w.resolve(mail);
            }
          }
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const boundPort = typeof address === 'object' && address ? address.port : port;
  return {
    port: boundPort,
    messages,
    waitFor(match, timeoutMs = 5000) {
      const found = messages.find(match);
      if (found) return Promise.resolve(found);
      return new Promise((resolve, reject) => {
        const waiter = { match, resolve };
        waiters.push(waiter);
        setTimeout(() => {
          const i = waiters.indexOf(waiter);
          if (i >= 0) {
            waiters.splice(i, 1);
            reject(new Error('no matching e-mail reached the fake mail server in time'));
          }
        }, timeoutMs);
      });
    },
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}
