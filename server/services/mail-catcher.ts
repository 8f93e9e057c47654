/**
 * A local SMTP server (smtp-server) that accepts every message on 127.0.0.1 and stores it in
 * the outbox table, parsed by mailparser, under the organisation named in its header. It stands
 * in for a hosted mail service out of the box.
 */
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import type { AddressInfo } from 'node:net';
import type { Db } from '../../db/client';
import { insertMail } from '../repos/mail-repo';
import { ORGANISATION_HEADER } from './mailer';

export interface MailCatcher {
  port: number;
  close(): Promise<void>;
}

const MAX_MESSAGE_BYTES = 10 * 1024 * 1024;

function addressText(a: unknown): string {
  if (!a) return '';
  const list = Array.isArray(a) ? a : [a];
  return list.map((x: { text?: string }) => x.text ?? '').join(', ');
}

export function startMailCatcher(db: Db, port: number): Promise<MailCatcher> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    banner: 'Fieldfile mail catcher',
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((mail) => {
          const org = Number(mail.headers.get(ORGANISATION_HEADER));
          insertMail(db, {
            organisationId: Number.isInteger(org) && org > 0 ? org : null,
            transport: 'catcher',
            fromAddress: addressText(mail.from),
            toAddress: addressText(mail.to),
            subject: mail.subject ?? '(no subject)',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
          });
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => {
      const actual = (server.server.address() as AddressInfo).port;
      resolve({
        port: actual,
        close: () => new Promise<void>((r) => server.close(() => r())),
      });
    });
  });
}
