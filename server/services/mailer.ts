/**
 * Outgoing mail through nodemailer. By default it goes to the in-process SMTP catcher
 * (server/services/mail-catcher.ts), which keeps every message in its organisation's outbox;
 * with SMTP_HOST set it goes to that server and nothing is kept (there is no outbox then).
 */
import nodemailer from 'nodemailer';
import type { Config } from '../env';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  /** The organisation the mail is sent for; its admins see it in their outbox. Omit for mail
   * about an account itself (a password reset), which no organisation sees. */
  organisationId?: number;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
}

/** Header that tells the local catcher which organisation's outbox a message belongs to. */
export const ORGANISATION_HEADER = 'x-fieldfile-organisation';

export function createMailer(config: Config, catcherPort: () => number): Mailer {
  const smtp = config.mail.smtp;
  return {
    async send({ organisationId, ...mail }) {
      const transport = smtp
        ? nodemailer.createTransport({
            host: smtp.host,
            port: smtp.port,
            secure: smtp.secure,
            auth: smtp.user ? { user: smtp.user, pass: smtp.pass ?? '' } : undefined,
          })
        : nodemailer.createTransport({ host: '127.0.0.1', port: catcherPort(), secure: false, ignoreTLS: true });
      // Only the local catcher reads the header; real recipients never see an organisation id.
      const headers = !smtp && organisationId !== undefined ? { [ORGANISATION_HEADER]: String(organisationId) } : undefined;
      try {
        await transport.sendMail({ from: config.mail.from, ...mail, headers });
      } finally {
        transport.close();
      }
    },
  };
}
