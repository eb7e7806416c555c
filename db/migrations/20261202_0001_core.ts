import type { Knex } from 'knex';

// The core tables for the whole product (see ../shared/design/product.md).
// Ids are random UUIDs (char 36) so URLs never reveal counts or order.
// Every DATETIME column holds UTC.

function innodbUtf8(t: Knex.CreateTableBuilder): void {
  t.engine('InnoDB');
  t.charset('utf8mb4');
  t.collate('utf8mb4_unicode_ci');
}

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    innodbUtf8(t);
    t.uuid('id').primary();
    t.string('email', 254).notNullable().unique();
    t.string('name', 200).notNullable();
    t.string('password_hash', 255).nullable(); // null for accounts that only sign in by link or ORCID
    t.enum('site_role', ['admin', 'user']).notNullable().defaultTo('user');
    t.string('orcid', 19).nullable().unique();
    t.string('affiliation', 300).nullable();
    t.string('ror_id', 9).nullable();
    t.string('time_zone', 64).nullable();
    t.dateTime('email_verified_at').nullable();
    t.dateTime('disabled_at').nullable();
    t.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    t.dateTime('updated_at').notNullable().defaultTo(knex.fn.now());
  });

  // OAuth / OpenID Connect accounts linked to a user (ORCID sign-in).
  await knex.schema.createTable('accounts', (t) => {
    innodbUtf8(t);
    t.uuid('id').primary();
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('provider', 64).notNullable();
    t.string('provider_account_id', 190).notNullable();
    t.string('type', 32).notNullable();
    t.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    t.unique(['provider', 'provider_account_id']);
    t.index(['user_id']);
  });

  // One-time tokens for e-mail sign-in links (next-auth) and password resets; only hashes are kept.
  await knex.schema.createTable('verification_tokens', (t) => {
    innodbUtf8(t);
    t.string('identifier', 254).notNullable();
    t.string('token_hash', 64).notNullable().primary();
    t.enum('purpose', ['sign_in', 'password_reset']).notNullable();
    t.dateTime('expires_at').notNullable();
    t.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    t.index(['identifier', 'purpose']);
  });

  await knex.schema.createTable('groups', (t) => {
    innodbUtf8(t);
    t.uuid('id').primary();
    t.string('slug', 80).notNullable().unique();
    t.string('name', 200).notNullable();
    t.text('description').nullable();
    t.string('institution', 300).nullable();
    t.string('ror_id', 9).nullable();
    t.bigInteger('storage_quota_bytes').unsigned().notNullable().defaultTo(50 * 1024 ** 3);
    t.bigInteger('storage_used_bytes').unsigned().notNullable().defaultTo(0);
    t.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    t.dateTime('updated_at').notNullable().defaultTo(knex.fn.now());
  });

  await knex.schema.createTable('memberships', (t) => {
    innodbUtf8(t);
    t.uuid('group_id').notNullable().references('groups.id').onDelete('CASCADE');
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.enum('role', ['owner', 'curator', 'member']).notNullable();
    t.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    t.primary(['group_id', 'user_id']);
    t.index(['user_id']);
  });

  await knex.schema.createTable('group_invitations', (t) => {
    innodbUtf8(t);
    t.uuid('id').primary();
    t.uuid('group_id').notNullable().references('groups.id').onDelete('CASCADE');
    t.string('email', 254).notNullable();
    t.enum('role', ['owner', 'curator', 'member']).notNullable();
    t.string('token_hash', 64).notNullable().unique();
    t.uuid('invited_by').nullable().references('users.id').onDelete('SET NULL');
    t.dateTime('expires_at').notNullable();
    t.dateTime('accepted_at').nullable();
    t.dateTime('declined_at').nullable();
    t.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    t.index(['group_id', 'email']);
  });

  // A dataset stands for all its versions and carries the all-versions DOI.
  await knex.schema.createTable('datasets', (t) => {
    innodbUtf8(t);
    t.uuid('id').primary();
    t.uuid('group_id').notNullable().references('groups.id').onDelete('RESTRICT');
    t.string('concept_doi', 190).nullable().unique();
    t.uuid('created_by').nullable().references('users.id').onDelete('SET NULL');
    t.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    t.dateTime('updated_at').notNullable().defaultTo(knex.fn.now());
    t.index(['group_id']);
  });

  await knex.schema.createTable('dataset_versions', (t) => {
    innodbUtf8(t);
    t.uuid('id').primary();
    t.uuid('dataset_id').notNullable().references('datasets.id').onDelete('CASCADE');
    t.integer('version_number').unsigned().notNullable();
    t.enum('state', ['draft', 'in_review', 'published', 'withdrawn']).notNullable().defaultTo('draft');
    t.string('title', 500).notNullable();
    t.json('metadata').notNullable(); // the transport-dataset record (schemas/transport-dataset.schema.json)
    t.string('doi', 190).nullable().unique();
    t.enum('doi_state', ['none', 'reserved', 'pending', 'registered', 'findable']).notNullable().defaultTo('none');
    t.date('embargo_until').nullable(); // files open at 00:00 UTC on this date
    t.text('review_comment').nullable();
    t.text('withdrawal_reason').nullable();
    t.dateTime('submitted_at').nullable();
    t.dateTime('published_at').nullable();
    t.dateTime('withdrawn_at').nullable();
    t.uuid('created_by').nullable().references('users.id').onDelete('SET NULL');
    t.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    t.dateTime('updated_at').notNullable().defaultTo(knex.fn.now());
    t.unique(['dataset_id', 'version_number']);
    t.index(['state', 'published_at']);
  });

  // Content-addressed objects: each distinct SHA-256 is stored once.
  await knex.schema.createTable('blobs', (t) => {
    innodbUtf8(t);
    t.string('sha256', 64).primary();
    t.bigInteger('size_bytes').unsigned().notNullable();
    t.string('storage_key', 200).notNullable();
    t.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
  });

  await knex.schema.createTable('files', (t) => {
    innodbUtf8(t);
    t.uuid('id').primary();
    t.uuid('version_id').notNullable().references('dataset_versions.id').onDelete('CASCADE');
    t.string('name', 255).notNullable();
    t.enum('role', ['raw', 'processed', 'other']).notNullable().defaultTo('raw');
    t.string('media_type', 127).nullable();
    t.bigInteger('size_bytes').unsigned().notNullable();
    t.string('sha256', 64).nullable().references('blobs.sha256').onDelete('RESTRICT'); // null until verified
    t.enum('upload_state', ['pending', 'verified', 'failed']).notNullable().defaultTo('pending');
    t.string('upload_id', 255).nullable(); // multipart upload in progress
    t.string('staging_key', 255).nullable();
    t.enum('analysis_state', ['none', 'queued', 'running', 'done', 'failed']).notNullable().defaultTo('none');
    t.float('analysis_progress').notNullable().defaultTo(0);
    t.json('analysis').nullable(); // FileSummary from lib/transport (small: previews are downsampled)
    t.text('analysis_error').nullable();
    t.uuid('created_by').nullable().references('users.id').onDelete('SET NULL');
    t.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    t.dateTime('updated_at').notNullable().defaultTo(knex.fn.now());
    t.unique(['version_id', 'name']);
    t.index(['sha256']);
    t.index(['analysis_state']);
  });

  await knex.schema.createTable('reviewer_links', (t) => {
    innodbUtf8(t);
    t.uuid('id').primary();
    t.uuid('version_id').notNullable().references('dataset_versions.id').onDelete('CASCADE');
    t.string('label', 200).notNullable();
    t.string('token_hash', 64).notNullable().unique();
    t.boolean('anonymous').notNullable().defaultTo(false);
    t.dateTime('expires_at').notNullable();
    t.dateTime('revoked_at').nullable();
    t.dateTime('last_used_at').nullable();
    t.uuid('created_by').nullable().references('users.id').onDelete('SET NULL');
    t.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    t.index(['version_id']);
  });

  await knex.schema.createTable('api_tokens', (t) => {
    innodbUtf8(t);
    t.uuid('id').primary();
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('name', 120).notNullable();
    t.string('token_prefix', 12).notNullable(); // shown in lists so users can tell tokens apart
    t.string('token_hash', 64).notNullable().unique();
    t.json('scopes').notNullable();
    t.dateTime('expires_at').nullable();
    t.dateTime('last_used_at').nullable();
    t.dateTime('revoked_at').nullable();
    t.dateTime('created_at').notNullable().defaultTo(knex.fn.now());
    t.index(['user_id']);
  });

  await knex.schema.createTable('audit_log', (t) => {
    innodbUtf8(t);
    t.bigIncrements('id');
    t.string('action', 64).notNullable();
    t.enum('actor_kind', ['user', 'reviewer', 'token', 'system', 'anonymous']).notNullable();
    t.uuid('actor_user_id').nullable().references('users.id').onDelete('SET NULL');
    t.uuid('group_id').nullable().references('groups.id').onDelete('SET NULL');
    t.string('target_type', 40).nullable();
    t.string('target_id', 64).nullable();
    t.string('ip_hash', 64).nullable(); // hashed: the log never stores raw addresses
    t.json('details').nullable();
    t.dateTime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.index(['group_id', 'created_at']);
    t.index(['action', 'created_at']);
    t.index(['actor_user_id', 'created_at']);
  });

  // Transactional outbox: work that must follow a committed change (search index, DOI registration, mail).
  await knex.schema.createTable('outbox', (t) => {
    innodbUtf8(t);
    t.bigIncrements('id');
    t.string('topic', 64).notNullable();
    t.string('aggregate_id', 64).notNullable();
    t.json('payload').notNullable();
    t.integer('attempts').unsigned().notNullable().defaultTo(0);
    t.dateTime('next_attempt_at').nullable();
    t.dateTime('processed_at').nullable();
    t.text('last_error').nullable();
    t.dateTime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.index(['topic', 'processed_at', 'next_attempt_at']);
    t.index(['topic', 'id']);
  });

  await knex.schema.createTable('download_events', (t) => {
    innodbUtf8(t);
    t.bigIncrements('id');
    t.uuid('version_id').notNullable().references('dataset_versions.id').onDelete('CASCADE');
    t.uuid('file_id').nullable().references('files.id').onDelete('SET NULL');
    t.enum('kind', ['investigation', 'request']).notNullable(); // COUNTER Code of Practice for Research Data
    t.uuid('user_id').nullable().references('users.id').onDelete('SET NULL');
    t.uuid('reviewer_link_id').nullable().references('reviewer_links.id').onDelete('SET NULL');
    t.string('session_hash', 64).notNullable();
    t.boolean('is_robot').notNullable().defaultTo(false);
    t.boolean('counted').notNullable().defaultTo(true); // false when filtered as a double-click
    t.dateTime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.index(['version_id', 'created_at']);
    t.index(['session_hash', 'version_id', 'created_at']);
  });

  // Fixed-window counters for rate limits (sign-in attempts, API tokens, IPs), shared by all app instances.
  await knex.schema.createTable('rate_limit_hits', (t) => {
    innodbUtf8(t);
    t.string('bucket', 190).notNullable();
    t.dateTime('window_start').notNullable();
    t.integer('hits').unsigned().notNullable().defaultTo(0);
    t.primary(['bucket', 'window_start']);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of [
    'rate_limit_hits', 'download_events', 'outbox', 'audit_log', 'api_tokens', 'reviewer_links', 'files', 'blobs',
    'dataset_versions', 'datasets', 'group_invitations', 'memberships', 'groups', 'verification_tokens', 'accounts', 'users',
  ]) {
    await knex.schema.dropTableIfExists(table);
  }
}
