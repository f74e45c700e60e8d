import type { Knex } from 'knex';

// Reset links used to be stored readable in mail_messages (the admin Outbox). The catcher now stores them
// masked; this masks the ones already stored. The same rule as server/services/mail-secrets.ts, repeated
// here because migrations import no app code. Tokens themselves were always stored only as SHA-256 hashes.
const RESET_LINK = /(\/reset\/)([A-Za-z0-9_-]{8,})/g;
const MASKED = '$1hidden-see-server-console';

export async function up(knex: Knex): Promise<void> {
  const rows = (await knex('mail_messages').where('text', 'like', '%/reset/%').orWhere('html', 'like', '%/reset/%').select('id', 'text', 'html')) as {
    id: number;
    text: string;
    html: string;
  }[];
  for (const row of rows) {
    await knex('mail_messages').where({ id: row.id }).update({ text: row.text.replace(RESET_LINK, MASKED), html: row.html.replace(RESET_LINK, MASKED) });
  }
}

// Masked tokens cannot be restored; nothing to undo.
export async function down(): Promise<void> {}
