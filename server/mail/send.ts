/**
 * Outgoing mail through nodemailer over SMTP. Locally (npm start, npm test) SMTP_HOST/SMTP_PORT
 * point at the mail catcher on loopback; in production at the team's relay (SMTP_USER/SMTP_PASSWORD
 * when it asks for a login, SMTP_SECURE=true for implicit TLS).
 */
import nodemailer, { type Transporter } from 'nodemailer';

export class MailConfigError extends Error {}

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  /** Files sent along (e.g. the PDF sizing sheet). */
  attachments?: { filename: string; content: Buffer; contentType?: string }[];
}

const holder = globalThis as unknown as { ampwardenMailer?: Transporter };

function transporter(): Transporter {
  if (!holder.ampwardenMailer) {
    const host = process.env.SMTP_HOST;
    const port = Number(process.env.SMTP_PORT ?? 587);
    if (!host) throw new MailConfigError('SMTP_HOST is not set: mail cannot be sent (npm start sets it for the local mail catcher)');
    const user = process.env.SMTP_USER;
    holder.ampwardenMailer = nodemailer.createTransport({
      host,
      port,
      secure: process.env.SMTP_SECURE === 'true',
      auth: user ? { user, pass: process.env.SMTP_PASSWORD ?? '' } : undefined,
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      socketTimeout: 20_000,
    });
  }
  return holder.ampwardenMailer;
}

export async function sendMail(mail: OutgoingMail): Promise<void> {
  await transporter().sendMail({
    from: process.env.MAIL_FROM ?? 'Ampwarden <no-reply@ampwarden.invalid>',
    to: mail.to,
    subject: mail.subject,
    text: mail.text,
    html: mail.html,
    attachments: mail.attachments,
  });
}

/** The address links in mail point at: the public URL of this app. */
export function appBaseUrl(): string {
  const base = process.env.NEXTAUTH_URL ?? process.env.APP_URL;
  if (!base) throw new MailConfigError('NEXTAUTH_URL is not set: links in mail need the public address of the app');
  return base.replace(/\/$/, '');
}
