import type { Knex } from 'knex';

// Part uploads go straight to object storage, so there is no multipart upload id to keep; what the server must
// remember until verification is the SHA-256 the uploader declared.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('files', (t) => {
    t.string('declared_sha256', 64).nullable().after('sha256');
    t.dropColumn('upload_id');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('files', (t) => {
    t.dropColumn('declared_sha256');
    t.string('upload_id', 255).nullable();
  });
}
