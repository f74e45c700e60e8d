import type { Knex } from 'knex';

// The live board documents: each row one Yjs update, in the order the server applied them.
// A board's content is the merge of its rows; compaction replaces the rows by one.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('board_updates', (t) => {
    t.increments('id').primary();
    t.integer('board_id').notNullable().references('id').inTable('boards').onDelete('CASCADE');
    t.integer('seq').notNullable();
    t.binary('data').notNullable();
    // Who made the change (null for the server itself: import, seed, compaction, share-link guests never write).
    t.integer('user_id').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.string('created_at', 30).notNullable();
    t.unique(['board_id', 'seq']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('board_updates');
}
