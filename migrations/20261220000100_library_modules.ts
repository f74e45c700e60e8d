import type { Knex } from 'knex';

// The team library: modules published from boards into their owner's library (decision 004). `content`
// is JSON text: the module first, then the modules it uses. `source_board_id`/`source_module_id` say
// where it was published from, so publishing that module again raises `version` instead of adding an entry.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('library_modules', (t) => {
    t.increments('id').primary();
    t.integer('owner_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.string('title', 200).notNullable();
    t.integer('version').notNullable().defaultTo(1);
    t.text('content').notNullable();
    t.integer('source_board_id').nullable().references('id').inTable('boards').onDelete('SET NULL');
    t.string('source_module_id', 64).nullable();
    t.string('created_at', 30).notNullable();
    t.string('updated_at', 30).notNullable();
    t.index(['owner_id']);
    t.index(['source_board_id', 'source_module_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('library_modules');
}
