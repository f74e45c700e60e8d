import type { Knex } from 'knex';

// Every message the built-in SMTP catcher receives, parsed, for the admin outbox.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('mail_messages', (t) => {
    t.increments('id').primary();
    t.string('message_id', 300).nullable();
    t.string('from_addr', 500).notNullable();
    t.string('to_addr', 2000).notNullable();
    t.string('subject', 1000).notNullable();
    t.string('date', 30).notNullable();
    t.text('text').notNullable();
    t.text('html').notNullable();
    t.string('received_at', 30).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('mail_messages');
}
