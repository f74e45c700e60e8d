import type { Knex } from 'knex';

// Saved states of a board (the history): the full Yjs state as one blob, with what the list shows.
// kind: named | automatic | before-restore | copied-from. A copy's first snapshot names its source
// (board and snapshot ids are kept as plain numbers: the source may be deleted later).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('snapshots', (t) => {
    t.increments('id').primary();
    t.integer('board_id').notNullable().references('id').inTable('boards').onDelete('CASCADE');
    t.string('name', 120).notNullable();
    t.integer('author_id').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.string('created_at', 30).notNullable();
    t.string('kind', 20).notNullable();
    t.integer('part_count').notNullable();
    t.integer('wire_count').notNullable();
    t.binary('state').notNullable();
    t.text('thumbnail_svg').notNullable();
    t.integer('source_board_id').nullable();
    t.string('source_board_title', 200).nullable();
    t.integer('source_snapshot_id').nullable();
    t.string('source_snapshot_name', 120).nullable();
    t.index(['board_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('snapshots');
}
