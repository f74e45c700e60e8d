import type { Knex } from 'knex';

// Photos of a board's real build: the files (re-encoded without metadata, and a thumbnail) live under
// UPLOAD_DIR/photos/board-<id>/ with names we choose; the row keeps the uploader, the shown name, the
// type, the size and the part the photo is attached to (null: the whole board).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('board_photos', (t) => {
    t.increments('id').primary();
    t.integer('board_id').notNullable().references('id').inTable('boards').onDelete('CASCADE');
    t.string('part_id', 64).nullable();
    t.integer('uploader_id').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.string('file_name', 80).notNullable();
    t.string('thumb_name', 80).notNullable();
    t.string('original_name', 200).notNullable();
    t.string('mime', 40).notNullable();
    t.integer('bytes').notNullable();
    t.integer('width').notNullable();
    t.integer('height').notNullable();
    t.string('caption', 200).notNullable().defaultTo('');
    t.string('created_at', 30).notNullable();
    t.index(['board_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('board_photos');
}
