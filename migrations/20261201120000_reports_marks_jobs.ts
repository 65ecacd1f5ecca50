import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  /** uploaded bytes, kept in the database with their digest; never changed */
  await knex.schema.createTable('stored_files', (t) => {
    t.increments('id').primary();
    t.string('sha256', 64).notNullable();
    t.integer('size_bytes').unsigned().notNullable();
    t.string('detected_type', 16).notNullable();
    t.string('file_name', 255).notNullable();
    t.specificType('content', 'LONGBLOB').notNullable();
    t.integer('uploaded_by').unsigned().notNullable().references('users.id');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.index(['sha256']);
  });
  /** one row per upload; a new upload is a new version, never an overwrite */
  await knex.schema.createTable('reports', (t) => {
    t.increments('id').primary();
    t.integer('exercise_id').unsigned().notNullable().references('exercises.id');
    t.integer('enrolment_id').unsigned().notNullable().references('enrolments.id');
    t.integer('variant_id').unsigned().notNullable().references('variants.id');
    t.integer('version_no').unsigned().notNullable();
    t.integer('data_file_id').unsigned().notNullable().references('stored_files.id');
    t.integer('writeup_file_id').unsigned().nullable().references('stored_files.id');
    /** what was read: columns, units, convention, warnings (and the points in atomic units) */
    t.json('reading_json').notNullable();
    t.integer('uploaded_by').unsigned().notNullable().references('users.id');
    t.timestamp('uploaded_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.enu('state', ['submitted', 'marked', 'returned']).notNullable().defaultTo('submitted');
    t.timestamp('returned_at').nullable();
    t.unique(['exercise_id', 'enrolment_id', 'version_no']);
    t.index(['exercise_id', 'state']);
  });
  /** automatic marks: append-only, the newest per report is current */
  await knex.schema.createTable('marks', (t) => {
    t.increments('id').primary();
    t.integer('report_id').unsigned().notNullable().references('reports.id');
    t.integer('revision_id').unsigned().notNullable().references('exercise_revisions.id');
    t.string('engine_version', 32).notNullable();
    t.decimal('points', 10, 3).notNullable();
    t.decimal('max_points', 10, 3).notNullable();
    t.decimal('late_penalty_percent', 6, 2).notNullable().defaultTo(0);
    t.decimal('total', 10, 3).notNullable();
    /** [{ id, kind, label, points, max, message, expected, found }] */
    t.json('checks_json').notNullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.index(['report_id', 'id']);
  });
  /** human changes to a check's points, with a reason: append-only */
  await knex.schema.createTable('adjustments', (t) => {
    t.increments('id').primary();
    t.integer('report_id').unsigned().notNullable().references('reports.id');
    t.string('check_id', 40).notNullable();
    t.decimal('points', 10, 3).notNullable();
    t.string('reason', 1000).notNullable();
    t.integer('adjusted_by').unsigned().notNullable().references('users.id');
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.index(['report_id', 'check_id']);
  });
  await knex.schema.createTable('similarity_flags', (t) => {
    t.increments('id').primary();
    t.integer('exercise_id').unsigned().notNullable().references('exercises.id');
    t.integer('report_id').unsigned().notNullable().references('reports.id');
    t.integer('other_report_id').unsigned().notNullable().references('reports.id');
    t.enu('kind', ['identical-numbers', 'near-identical-deviations']).notNullable();
    t.decimal('score', 12, 6).notNullable();
    t.string('detail', 500).notNullable();
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.integer('reviewed_by').unsigned().nullable().references('users.id');
    t.string('review_note', 1000).nullable();
    t.timestamp('reviewed_at').nullable();
    t.unique(['report_id', 'other_report_id', 'kind']);
  });
  /** background work (re-marking), claimed with SELECT … FOR UPDATE SKIP LOCKED */
  await knex.schema.createTable('jobs', (t) => {
    t.bigIncrements('id').primary();
    t.string('kind', 40).notNullable();
    t.json('payload_json').notNullable();
    t.enu('state', ['queued', 'running', 'done', 'failed']).notNullable().defaultTo('queued');
    t.integer('progress_done').unsigned().notNullable().defaultTo(0);
    t.integer('progress_total').unsigned().notNullable().defaultTo(0);
    t.integer('attempts').unsigned().notNullable().defaultTo(0);
    t.string('claimed_by', 100).nullable();
    /** a claim older than this is taken to be from a dead worker and may be taken over */
    t.timestamp('lease_until', { precision: 3 }).nullable();
    t.string('error', 2000).nullable();
    t.timestamp('run_after', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.index(['state', 'run_after']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('jobs');
  await knex.schema.dropTable('similarity_flags');
  await knex.schema.dropTable('adjustments');
  await knex.schema.dropTable('marks');
  await knex.schema.dropTable('reports');
  await knex.schema.dropTable('stored_files');
}
