import type { Knex } from 'knex';

// One entry per board module in each library: two first publishes of the same module at the same instant
// each inserted an entry at version 1. The unique index makes the database refuse the second insert (the
// publish then retries and raises the first entry's version). Rows already sharing a source (such a race,
// or a module that was published, then replaced by a copy of another entry and published into that one)
// keep the source only on the entry published last: that is where publishing the module goes next.
// Entries whose board was deleted have a NULL source, which unique indexes never count as equal.
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    update library_modules set source_board_id = null, source_module_id = null
    where source_board_id is not null and exists (
      select 1 from library_modules later
      where later.owner_id = library_modules.owner_id
        and later.source_board_id = library_modules.source_board_id
        and later.source_module_id = library_modules.source_module_id
        and (later.updated_at > library_modules.updated_at or (later.updated_at = library_modules.updated_at and later.id > library_modules.id)))`);
  await knex.schema.alterTable('library_modules', (t) => {
    t.unique(['owner_id', 'source_board_id', 'source_module_id'], { indexName: 'library_modules_source_unique' });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('library_modules', (t) => {
    t.dropUnique(['owner_id', 'source_board_id', 'source_module_id'], 'library_modules_source_unique');
  });
}
