import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('terms', (t) => {
    t.increments('id').primary();
    t.string('name', 100).notNullable().unique();
    t.date('starts_on').notNullable();
    t.date('ends_on').notNullable();
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
  });
  await knex.schema.createTable('courses', (t) => {
    t.increments('id').primary();
    t.integer('term_id').unsigned().notNullable().references('terms.id');
    t.string('code', 32).notNullable();
    t.string('title', 200).notNullable();
    t.boolean('archived').notNullable().defaultTo(false);
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
    t.unique(['term_id', 'code']);
  });
  await knex.schema.createTable('course_staff', (t) => {
    t.integer('course_id').unsigned().notNullable().references('courses.id').onDelete('CASCADE');
    t.integer('user_id').unsigned().notNullable().references('users.id');
    t.enu('role', ['lecturer', 'assistant']).notNullable();
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.primary(['course_id', 'user_id', 'role']);
    t.index(['user_id']);
  });
  await knex.schema.createTable('enrolments', (t) => {
    t.increments('id').primary();
    t.integer('course_id').unsigned().notNullable().references('courses.id').onDelete('CASCADE');
    t.integer('user_id').unsigned().notNullable().references('users.id');
    t.string('student_number', 32).notNullable();
    t.enu('status', ['active', 'withdrawn']).notNullable().defaultTo('active');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
    t.unique(['course_id', 'user_id']);
    t.unique(['course_id', 'student_number']);
    t.index(['user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('enrolments');
  await knex.schema.dropTable('course_staff');
  await knex.schema.dropTable('courses');
  await knex.schema.dropTable('terms');
}
