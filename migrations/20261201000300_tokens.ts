import type { Knex } from 'knex';

// Invitations and password resets: both are e-mailed links whose token is stored only as a SHA-256 hash.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('invitations', (t) => {
    t.increments('id').primary();
    t.integer('board_id').notNullable().references('id').inTable('boards').onDelete('CASCADE');
    t.string('email', 254).notNullable();
    t.string('role', 10).notNullable();
    t.string('token_hash', 64).notNullable().unique();
    t.integer('invited_by').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.string('created_at', 30).notNullable();
    t.string('expires_at', 30).notNullable();
    t.string('accepted_at', 30).nullable();
    t.integer('accepted_by').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.index(['board_id', 'email']);
  });
  await knex.schema.createTable('password_resets', (t) => {
    t.increments('id').primary();
    t.integer('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.string('token_hash', 64).notNullable().unique();
    t.string('created_at', 30).notNullable();
    t.string('expires_at', 30).notNullable();
    t.string('used_at', 30).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('password_resets');
  await knex.schema.dropTable('invitations');
}
