/**
 * Outgoing mail through nodemailer. By default it goes to the in-process SMTP catcher
 * (server/services/mail-catcher.ts), which stores every message in the outbox; with SMTP_HOST
 * set it goes to that server and a copy is recorded in the outbox.
 */
import nodemailer from 'nodemailer';
import type { Db } from '../../db/client';
import { mailMessages } from '../../db/schema';
import type { Config } from '../env';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
}

export function createMailer(config: Config, db: Db, catcherPort: () => number): Mailer {
  const smtp = config.mail.smtp;
  return {
    async send(mail) {
      const transport = smtp
        ? nodemailer.createTransport({
            host: smtp.host,
            port: smtp.port,
            secure: smtp.secure,
            auth: smtp.user ? { user: smtp.user, pass: smtp.pass ?? '' } : undefined,
          })
        : nodemailer.createTransport({ host: '127.0.0.1', port: catcherPort(), secure: false, ignoreTLS: true });
      try {
        await transport.sendMail({ from: config.mail.from, ...mail });
      } finally {
        transport.close();
      }
      if (smtp) {
        db.insert(mailMessages)
          .values({ transport: 'smtp', fromAddress: config.mail.from, toAddress: mail.to, subject: mail.subject, text: mail.text, html: mail.html ?? null })
          .run();
      }
    },
  };
}
