import nodemailer from 'nodemailer';
import type { Logger } from 'pino';
import type { Config } from '../../config.ts';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html: string;
  /** The department the message is about: the development outbox shows it to that department's admins. */
  departmentId?: string;
  /** What kind of message this is (invitation, password-reset, run-finished, …), as a header for tools. */
  kind: string;
}

export interface Mailer {
  /** Sends one message; rejects when the mail server refuses it or cannot be reached. */
  send(message: MailMessage): Promise<void>;
  /** Sends without waiting; a failure is logged, never thrown (notices that must not hold up a request). */
  sendInBackground(message: MailMessage): void;
  close(): void;
}

export const DEPARTMENT_HEADER = 'X-Tidefield-Department';
export const KIND_HEADER = 'X-Tidefield-Message';

/**
 * E-mail through nodemailer over SMTP. Against the local stand-in the server offers no
 * STARTTLS, so nothing is upgraded on loopback; against a real server nodemailer upgrades with
 * STARTTLS when offered (or uses implicit TLS with SMTP_SECURE on port 465).
 */
export function createMailer(config: Pick<Config, 'SMTP_HOST' | 'SMTP_PORT' | 'SMTP_SECURE' | 'SMTP_USER' | 'SMTP_PASSWORD' | 'MAIL_FROM'>, logger: Logger): Mailer {
  const transport = nodemailer.createTransport({
    host: config.SMTP_HOST,
    port: config.SMTP_PORT,
    secure: config.SMTP_SECURE,
    auth: config.SMTP_USER ? { user: config.SMTP_USER, pass: config.SMTP_PASSWORD ?? '' } : undefined,
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  });

  async function send(message: MailMessage): Promise<void> {
    await transport.sendMail({
      from: config.MAIL_FROM,
      to: message.to,
      subject: message.subject,
      text: message.text,
      html: message.html,
      headers: { [KIND_HEADER]: message.kind, ...(message.departmentId ? { [DEPARTMENT_HEADER]: message.departmentId } : {}) },
    });
    logger.info({ kind: message.kind }, 'e-mail sent');
  }

  return {
    send,
    sendInBackground(message) {
      send(message).catch((error: unknown) => logger.error({ err: error, kind: message.kind }, 'e-mail could not be sent'));
    },
    close: () => transport.close(),
  };
}
