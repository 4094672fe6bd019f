import nodemailer, { type Transporter } from 'nodemailer';
import type { DbOrTx } from '../db/client';
import { mailOutbox } from '../db/schema';

export interface MailSettings {
  host: string;
  port: number;
  secure: boolean;
  user?: string;
  password?: string;
  from: string;
}

export interface OutgoingMail {
  companyId: string | null;
  to: string;
  subject: string;
  text: string;
  attachments?: { filename: string; content: Buffer; contentType: string }[];
}

export interface Mailer {
  /** Sends over SMTP and records the message (sent or failed) in the outbox. Never throws for a delivery failure. */
  send(db: DbOrTx, mail: OutgoingMail): Promise<{ ok: boolean; error?: string }>;
  close(): void;
}

export function createMailer(settings: MailSettings): Mailer {
  const transport: Transporter = nodemailer.createTransport({
    host: settings.host,
    port: settings.port,
    secure: settings.secure,
    auth: settings.user ? { user: settings.user, pass: settings.password ?? '' } : undefined,
    // The local fake server offers no TLS; a real provider is reached with SMTP_SECURE=true or STARTTLS.
    ignoreTLS: !settings.secure && settings.host === '127.0.0.1',
  });
  return {
    async send(db, mail) {
      let status = 'sent';
      let error: string | null = null;
      let messageId: string | null = null;
      try {
        const info = await transport.sendMail({
          from: settings.from,
          to: mail.to,
          subject: mail.subject,
          text: mail.text,
          attachments: mail.attachments,
        });
        messageId = info.messageId ?? null;
      } catch (err) {
        status = 'failed';
        error = err instanceof Error ? err.message : String(err);
      }
      await db.insert(mailOutbox).values({
        companyId: mail.companyId,
        toAddress: mail.to,
        subject: mail.subject,
        bodyText: mail.text,
        status,
        error,
        smtpMessageId: messageId,
      });
      return error ? { ok: false, error } : { ok: true };
    },
    close: () => transport.close(),
  };
}
