import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('exercises', (t) => {
    t.increments('id').primary();
    t.integer('course_id').unsigned().notNullable().references('courses.id').onDelete('CASCADE');
    t.enu('state', ['draft', 'published', 'closed']).notNullable().defaultTo('draft');
    /** the revision students and marking use now (the latest published one; for drafts the latest) */
    t.integer('current_revision_id').unsigned().nullable();
    t.integer('created_by').unsigned().notNullable().references('users.id');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
    t.index(['course_id', 'state']);
  });
  await knex.schema.createTable('exercise_revisions', (t) => {
    t.increments('id').primary();
    t.integer('exercise_id').unsigned().notNullable().references('exercises.id').onDelete('CASCADE');
    t.integer('revision_no').unsigned().notNullable();
    /** the ExerciseSpec (shared/exercises/spec.ts) as JSON */
    t.json('spec_json').notNullable();
    /** which engine produced the frozen references (bumped when the engine's results change) */
    t.string('engine_version', 32).notNullable();
    t.integer('created_by').unsigned().notNullable().references('users.id');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    /** set when published: from then on the revision is frozen */
    t.timestamp('published_at').nullable();
    t.unique(['exercise_id', 'revision_no']);
  });
  await knex.schema.alterTable('exercises', (t) => {
    t.foreign('current_revision_id').references('exercise_revisions.id');
  });
  /** each student's variant of a revision, drawn once and kept */
  await knex.schema.createTable('variants', (t) => {
    t.increments('id').primary();
    t.integer('revision_id').unsigned().notNullable().references('exercise_revisions.id').onDelete('CASCADE');
    t.integer('enrolment_id').unsigned().notNullable().references('enrolments.id');
    t.string('variant_key', 120).notNullable();
    t.json('variant_json').notNullable();
    /** random token written into the personal template, to match uploads to student and exercise */
    t.string('template_token', 32).notNullable().unique();
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.unique(['revision_id', 'enrolment_id']);
  });
  await knex.schema.createTable('extensions', (t) => {
    t.increments('id').primary();
    t.integer('exercise_id').unsigned().notNullable().references('exercises.id').onDelete('CASCADE');
    t.integer('enrolment_id').unsigned().notNullable().references('enrolments.id');
    t.integer('extra_minutes').unsigned().notNullable();
    t.string('reason', 500).notNullable();
    t.integer('granted_by').unsigned().notNullable().references('users.id');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.index(['exercise_id', 'enrolment_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('extensions');
  await knex.schema.dropTable('variants');
  await knex.schema.alterTable('exercises', (t) => t.dropForeign(['current_revision_id']));
  await knex.schema.dropTable('exercise_revisions');
  await knex.schema.dropTable('exercises');
}
