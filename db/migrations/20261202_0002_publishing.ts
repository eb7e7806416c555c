import type { Knex } from 'knex';

// Publishing (issue 5): review requests, who approved, one publication per version, once-only notices.

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('dataset_versions', (t) => {
    t.date('requested_embargo_until').nullable(); // the author's wish at submission; the curator decides at publication
    t.uuid('approved_by').nullable().references('users.id').onDelete('SET NULL');
    t.dateTime('published_notice_sent_at').nullable(); // "published, here is your DOI" mail queued (once)
    t.dateTime('embargo_notice_sent_at').nullable(); // "files are open now" mail queued (once)
    t.index(['state', 'embargo_until', 'embargo_notice_sent_at'], 'dataset_versions_embargo_sweep');
  });

  // One row per publication act: the primary key refuses a second publication of the same version.
  await knex.schema.createTable('version_publications', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.uuid('version_id').primary().references('dataset_versions.id').onDelete('CASCADE');
    t.uuid('dataset_id').notNullable().references('datasets.id').onDelete('CASCADE');
    t.uuid('approved_by').nullable().references('users.id').onDelete('SET NULL');
    t.date('embargo_until').nullable();
    t.dateTime('published_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.index(['dataset_id', 'published_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('version_publications');
  await knex.schema.alterTable('dataset_versions', (t) => {
    t.dropIndex(['state', 'embargo_until', 'embargo_notice_sent_at'], 'dataset_versions_embargo_sweep');
    t.dropForeign(['approved_by']);
    t.dropColumn('requested_embargo_until');
    t.dropColumn('approved_by');
    t.dropColumn('published_notice_sent_at');
    t.dropColumn('embargo_notice_sent_at');
  });
}
