import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';
import type { Db } from '../db/knex';
import { nowIso } from '../db/knex';
import { insertMail } from '../db/mail-messages';
import { MASK_NOTE, maskSecretLinks } from './mail-secrets';

/** A message as the catcher received it over SMTP, live links included (never stored so). */
export interface CaughtMail {
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string;
}

/**
 * A real SMTP server on loopback that keeps every message it receives in `mail_messages`, with
 * password-reset tokens masked. Listeners see each delivery as received (the server console of a local
 * demo, tests reading the link the way a mailbox would).
 */
export interface MailCatcher {
  port: number;
  url: string;
  /** Calls `listener` with every message received, before it is stored; returns an unsubscribe. */
  onDelivery(listener: (mail: CaughtMail) => void): () => void;
  close(): Promise<void>;
}

function addressText(a: AddressObject | AddressObject[] | undefined): string {
  if (!a) return '';
  return (Array.isArray(a) ? a : [a]).map((x) => x.text).join(', ');
}

const MAX_MESSAGE_BYTES = 2 * 1024 * 1024;

/** Starts the catcher on 127.0.0.1 (`port` 0 = a free one). Only loopback clients can reach it. */
export async function startMailCatcher(db: Db, port: number, logErrors: boolean): Promise<MailCatcher> {
  const listeners = new Set<(mail: CaughtMail) => void>();
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    banner: 'Gatefold outbox',
    size: MAX_MESSAGE_BYTES,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (mail) => {
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address).join(', ');
          const from = addressText(mail.from) || (session.envelope.mailFrom ? session.envelope.mailFrom.address : '');
          const caught: CaughtMail = {
            from, to: addressText(mail.to) || envelopeTo, subject: mail.subject ?? '', text: mail.text ?? '', html: typeof mail.html === 'string' ? mail.html : '',
          };
          for (const l of listeners) {
            try {
              l(caught);
            } catch (err) {
              if (logErrors) console.error('a mail listener failed:', err);
            }
          }
          const text = maskSecretLinks(caught.text);
          const html = maskSecretLinks(caught.html);
          await insertMail(db, {
            messageId: mail.messageId,
            from,
            to: caught.to,
            subject: caught.subject,
            date: (mail.date ?? new Date()).toISOString(),
            text: text.masked ? `${MASK_NOTE}\n\n${text.text}` : text.text,
            html: html.masked ? html.text.replace(/<body([^>]*)>/, (m) => `${m}<p><em>${MASK_NOTE}</em></p>`) : html.text,
            now: nowIso(),
          });
          // Answer 250 only once the message is stored, so a sender that awaited sendMail can read it back.
          callback();
        })
        .catch((err: unknown) => {
          if (logErrors) console.error('mail catcher could not store a message:', err);
          callback(new Error('could not store the message'));
        });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => {
      server.off('error', reject);
      resolve();
    });
  });
  server.on('error', (err) => {
    if (logErrors) console.error('mail catcher error:', err);
  });
  const actual = (server.server.address() as AddressInfo).port;
  return {
    port: actual,
    url: `smtp://127.0.0.1:${actual}`,
    onDelivery(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
