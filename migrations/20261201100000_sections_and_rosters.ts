import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sections', (t) => {
    t.increments('id').primary();
    t.integer('course_id').unsigned().notNullable().references('courses.id').onDelete('CASCADE');
    t.string('name', 80).notNullable();
    /** 1 = Monday … 7 = Sunday (ISO 8601) */
    t.tinyint('weekday').unsigned().nullable();
    t.string('starts_at', 5).nullable(); // HH:MM, local time of the course
    t.string('ends_at', 5).nullable();
    t.string('room', 80).nullable();
    t.integer('capacity').unsigned().nullable();
    t.boolean('archived').notNullable().defaultTo(false);
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
    t.unique(['course_id', 'name']);
  });
  await knex.schema.createTable('section_assistants', (t) => {
    t.integer('section_id').unsigned().notNullable().references('sections.id').onDelete('CASCADE');
    t.integer('user_id').unsigned().notNullable().references('users.id');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.primary(['section_id', 'user_id']);
    t.index(['user_id']);
  });
  await knex.schema.alterTable('enrolments', (t) => {
    t.integer('section_id').unsigned().nullable().references('sections.id');
    t.string('family_name', 120).nullable();
    t.string('given_name', 120).nullable();
    t.string('email', 320).nullable();
    t.timestamp('withdrawn_at').nullable();
  });
  await knex.schema.createTable('roster_imports', (t) => {
    t.increments('id').primary();
    t.integer('course_id').unsigned().notNullable().references('courses.id').onDelete('CASCADE');
    t.integer('actor_id').unsigned().notNullable().references('users.id');
    t.string('file_name', 255).notNullable();
    t.string('sha256', 64).notNullable();
    t.json('mapping_json').notNullable();
    t.json('summary_json').notNullable();
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('roster_imports');
  await knex.schema.alterTable('enrolments', (t) => {
    t.dropForeign(['section_id']);
    t.dropColumn('section_id');
    t.dropColumn('family_name');
    t.dropColumn('given_name');
    t.dropColumn('email');
    t.dropColumn('withdrawn_at');
  });
  await knex.schema.dropTable('section_assistants');
  await knex.schema.dropTable('sections');
}
