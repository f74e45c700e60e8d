import type { ApiMail, ApiMailSummary } from '../../shared/api';
import type { Db } from '../db/knex';
import { findMail, listMail } from '../db/mail-messages';
import { notFound } from '../lib/errors';

export interface OutboxService {
  /** Newest first, at most `limit`. */
  list(limit?: number): Promise<ApiMailSummary[]>;
  get(id: number): Promise<ApiMail>;
}

export function createOutboxService(db: Db): OutboxService {
  return {
    async list(limit = 500) {
      return (await listMail(db, limit)).map((m) => ({ id: m.id, from: m.from_addr, to: m.to_addr, subject: m.subject, date: m.date }));
    },
    async get(id) {
      const m = await findMail(db, id);
      if (!m) throw notFound('message_not_found', 'No such message');
      return { id: m.id, from: m.from_addr, to: m.to_addr, subject: m.subject, date: m.date, text: m.text, html: m.html };
    },
  };
}
