import type { Knex } from 'knex';

// Share links of a board (class mode): guests open a board read-only with a link's token. Only the
// SHA-256 of the token is stored; revoking deletes the row. Links go with the board.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('share_links', (t) => {
    t.increments('id').primary();
    t.integer('board_id').notNullable().references('id').inTable('boards').onDelete('CASCADE');
    t.string('token_hash', 64).notNullable().unique();
    t.integer('created_by').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.string('created_at', 30).notNullable();
    t.string('expires_at', 30).nullable();
    t.index(['board_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('share_links');
}
