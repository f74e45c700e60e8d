import type { Knex } from 'knex';

// The bring-up record of a board: what a builder saw on the bench for a vector (switch settings `vector`,
// lamps `observed`, `expected` as the board said then), who entered it and when. `step` orders the steps
// of a sequence on boards with storage. Rows go with the board.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('bringup_observations', (t) => {
    t.increments('id').primary();
    t.integer('board_id').notNullable().references('id').inTable('boards').onDelete('CASCADE');
    t.string('vector', 64).notNullable();
    t.string('observed', 64).notNullable();
    t.string('expected', 64).nullable();
    t.integer('step').nullable();
    t.integer('user_id').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.string('created_at', 30).notNullable();
    t.index(['board_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('bringup_observations');
}
