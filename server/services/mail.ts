import nodemailer from 'nodemailer';
import type { AppConfig } from '../config';
import type { Db } from '../db/knex';
import { startMailCatcher, type MailCatcher } from './mail-catcher';
import { secretLinksIn } from './mail-secrets';

/** One outgoing message: always a plain-text body and a simple HTML one. */
export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

/** Sends e-mail over SMTP, to `SMTP_URL` or to the built-in catcher. */
export interface Mailer {
  /** The SMTP server we send to. */
  smtpUrl: string;
  /** The built-in catcher, when it runs. */
  catcher?: MailCatcher;
  /** Sends and resolves once the server accepted it; failures are logged, never thrown (mail is best effort). */
  send(mail: OutgoingMail): Promise<boolean>;
  close(): Promise<void>;
}

export async function createMailer(config: AppConfig, db: Db): Promise<Mailer> {
  const catcher = config.smtpUrl ? undefined : await startMailCatcher(db, config.smtpCatcherPort, config.logErrors);
  const smtpUrl = config.smtpUrl ?? catcher!.url;
  if (catcher && config.logMailLinks) {
    // A local demo has no mailbox: the links hidden from the Outbox are printed here instead.
    catcher.onDelivery((m) => {
      for (const link of secretLinksIn(m.text)) console.log(`mail to ${m.to} ("${m.subject}"): ${link}`);
    });
  }
  const transport = catcher
    ? nodemailer.createTransport({ host: '127.0.0.1', port: catcher.port, secure: false, ignoreTLS: true })
    : nodemailer.createTransport(smtpUrl);
  // Sends still on the wire; close() lets them finish so no message is cut off at shutdown.
  const inFlight = new Set<Promise<boolean>>();
  const deliver = async (mail: OutgoingMail) => {
    try {
      await transport.sendMail({ from: config.mailFrom, ...mail });
      return true;
    } catch (err) {
      if (config.logErrors) console.error(`could not send mail "${mail.subject}" to ${mail.to}:`, err);
      return false;
    }
  };
  return {
    smtpUrl,
    catcher,
    send(mail) {
      const p = deliver(mail).finally(() => inFlight.delete(p));
      inFlight.add(p);
      return p;
    },
    async close() {
      await Promise.all([...inFlight]);
      transport.close();
      await catcher?.close();
    },
  };
}
