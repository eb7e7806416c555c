import type { Knex } from 'knex';

// Compare basket (issue 7): the curves a signed-in user has put side by side. A curve is one (x, y) pair of column
// names in one analysed file; anonymous visitors keep the same references in their browser instead.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('compare_items', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.uuid('id').primary();
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.uuid('version_id').notNullable().references('dataset_versions.id').onDelete('CASCADE');
    t.uuid('file_id').notNullable().references('files.id').onDelete('CASCADE');
    // Column names as the file analysis gives them (CurvePreview.x / .y); 190 keeps the unique key under 3072 bytes.
    t.string('x', 190).notNullable();
    t.string('y', 190).notNullable();
    t.dateTime('added_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.unique(['user_id', 'file_id', 'x', 'y'], { indexName: 'compare_items_user_curve' });
    t.index(['user_id', 'added_at'], 'compare_items_user_added');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('compare_items');
}
