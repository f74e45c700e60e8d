import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('boards', (t) => {
    t.increments('id').primary();
    t.string('title', 200).notNullable();
    t.string('family', 40).notNullable().defaultTo('ideal');
    t.integer('owner_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.string('created_at', 30).notNullable();
    t.string('updated_at', 30).notNullable();
  });
  await knex.schema.createTable('board_members', (t) => {
    t.integer('board_id').notNullable().references('id').inTable('boards').onDelete('CASCADE');
    t.integer('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.string('role', 10).notNullable(); // owner | editor | viewer
    t.string('created_at', 30).notNullable();
    t.primary(['board_id', 'user_id']);
    t.index(['user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('board_members');
  await knex.schema.dropTable('boards');
}
