import type { Db } from './knex';

export interface MailRow {
  id: number;
  message_id: string | null;
  from_addr: string;
  to_addr: string;
  subject: string;
  date: string;
  text: string;
  html: string;
}

export async function insertMail(
  db: Db,
  m: { messageId?: string; from: string; to: string; subject: string; date: string; text: string; html: string; now: string },
): Promise<number> {
  const [row] = await db('mail_messages')
    .insert({
      message_id: m.messageId ?? null, from_addr: m.from, to_addr: m.to, subject: m.subject,
      date: m.date, text: m.text, html: m.html, received_at: m.now,
    })
    .returning('id');
  return typeof row === 'object' ? (row as { id: number }).id : (row as number);
}

/** Newest first (by arrival order, which the id keeps). */
export async function listMail(db: Db, limit: number): Promise<Omit<MailRow, 'text' | 'html'>[]> {
  return db('mail_messages').select('id', 'message_id', 'from_addr', 'to_addr', 'subject', 'date').orderBy('id', 'desc').limit(limit);
}

export async function findMail(db: Db, id: number): Promise<MailRow | undefined> {
  return db<MailRow>('mail_messages').where({ id }).first();
}
