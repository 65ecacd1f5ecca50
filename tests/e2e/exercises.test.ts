import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { exerciseSpecSchema } from '@shared/exercises/spec';
import { createJobWorker, type JobWorker } from '@server/platform/jobs';
import { reportJobHandlers } from '@server/modules/reports/jobs';
import { startAppContext, type AppContext } from '../support/app-context';
import { launchBrowser } from '../support/browser';
import { ensureClientBuilt } from '../../scripts/lib/client-build';
import { curveReferenceOf, referenceCsv, uploadForm, variantOf } from '../integration/reports-fixtures';

let ctx: AppContext;
let browser: Browser;
let courseId = 0;
/** a re-marking worker, as `npm start` runs one in-process (similarity jobs are not under test here) */
let worker: JobWorker;
const studentNumbers = ['3100001', '3100002', '3100003'];
/** the page loads its data in steps: give each step time */
const poll = <T,>(fn: () => Promise<T> | T) => expect.poll(fn, { timeout: 20_000, interval: 200 });

beforeAll(async () => {
  await ensureClientBuilt(() => {});
  ctx = await startAppContext({ client: 'static' });
  const k = ctx.db.knex;
  const [lec] = await k('users').insert({ oidc_issuer: ctx.issuer, oidc_subject: 'lec1', email: 'lec1@test.example', display_name: 'Lena Lecturer' });
  const [term] = await k('terms').insert({ name: 'Autumn 2026', starts_on: '2026-09-14', ends_on: '2026-12-18' });
  [courseId] = await k('courses').insert({ term_id: term, code: 'TST 410', title: 'Bonding in practice' });
  await k('course_staff').insert({ course_id: courseId, user_id: lec, role: 'lecturer' });
  for (const n of studentNumbers) {
    const [u] = await k('users').insert({ email: `s${n}@test.example`, display_name: `Student ${n}` });
    await k('enrolments').insert({ course_id: courseId, user_id: u, student_number: n });
  }
  worker = createJobWorker({ db: k, workerId: 'e2e-remark', handlers: { 'remark-exercise': reportJobHandlers()['remark-exercise'] }, pollIntervalMs: 200 });
  worker.start();
  browser = await launchBrowser();
});

afterAll(async () => {
  await worker?.stop();
  await browser?.close();
  await ctx?.close();
});

/** The lecturer uploads a report for each student (through the API), so that re-marking has work to show. */
async function uploadReportsForEveryone(exerciseId: number) {
  const k = ctx.db.knex;
  const revision = await k('exercises as e').join('exercise_revisions as r', 'r.id', 'e.current_revision_id').where('e.id', exerciseId).first('r.spec_json');
  const spec = exerciseSpecSchema.parse(typeof revision.spec_json === 'string' ? JSON.parse(revision.spec_json) : revision.spec_json);
  const lec = await ctx.signIn('lec1');
  const token = await ctx.csrf(lec);
  for (const n of studentNumbers) {
    const enrolment = await k('enrolments').where({ course_id: courseId, student_number: n }).first('id');
    const csv = referenceCsv(curveReferenceOf(spec, variantOf(spec, n)));
    const choice = { distanceColumn: 'A', energyColumns: spec.model.family === 'one-electron' ? spec.model.states.map((_, i) => String.fromCharCode(66 + i)) : ['B'], distanceUnit: 'bohr', energyUnit: 'hartree' };
    const r = await lec.json(`${ctx.baseUrl}/api/v1/exercises/${exerciseId}/reports?enrolmentId=${enrolment.id}`, { method: 'POST', headers: { 'x-csrf-token': token }, body: uploadForm({ name: `${n}.csv`, bytes: csv }, { choice }) });
    expect(r.status).toBe(201);
  }
}

async function signInAs(login: string, path: string): Promise<Page> {
  const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  await page.goto(`${ctx.baseUrl}${path}`);
  await page.waitForURL(/\/signin/);
  await page.getByRole('button', { name: /Sign in with your university account/ }).or(page.getByRole('link', { name: /Sign in with your university account/ })).click();
  await page.waitForURL(new RegExp(`^${ctx.issuer}/interaction/`));
  await page.getByLabel('University login').fill(login);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL(`${ctx.baseUrl}${path}`);
  return page;
}

describe('authoring an exercise in the browser', () => {
  it('a lecturer writes an exercise, sees field messages and the live preview, publishes it and confirms re-marking of a change', async () => {
    const page = await signInAs('lec1', `/courses/${courseId}/exercises`);
    page.on('pageerror', (e) => console.error('[page error]', e.message));
    await page.getByTestId('exercises-empty').waitFor();
    await page.getByRole('link', { name: 'New exercise' }).click();
    await page.waitForURL(`${ctx.baseUrl}/courses/${courseId}/exercises/new`);

    // the live preview works before anything is saved: the default one-electron model, its curves and answer key
    await page.getByTestId('reference-preview').waitFor();
    await poll(() => page.getByTestId('answer-key-row').count()).toBe(4);

    // saving without a title: the message stands beside the field, nothing is created
    await page.getByRole('button', { name: 'Create draft' }).click();
    const title = page.getByLabel('Title', { exact: true });
    await poll(() => title.getAttribute('aria-invalid')).toBe('true');
    await poll(() => page.locator('[data-field="title"] [data-testid="field-error"]').textContent()).toContain('give the exercise a title');
    expect(await ctx.db.knex('exercises').count({ n: '*' }).first()).toMatchObject({ n: 0 });

    await title.fill('The one-electron bond (LCAO)');
    await page.getByLabel('Instructions (Markdown)').fill('Compute **both** curves.\n\n<script>window.__owned = 1</script>');
    // Markdown rendered, raw HTML dropped
    await poll(() => page.getByTestId('instructions-preview').locator('strong').textContent()).toBe('both');
    expect(await page.getByTestId('instructions-preview').locator('script').count()).toBe(0);

    // weights as shares that add up: four default checks of weight 10 each, one more of 20 (largest-remainder rounding)
    await page.getByLabel('Check to add').selectOption('manual');
    await page.getByRole('button', { name: 'Add check' }).click();
    const weights = page.getByLabel('Weight', { exact: true });
    await weights.last().fill('20');
    await poll(() => page.getByTestId('check-share').allTextContents()).toEqual(['16.7 %', '16.7 %', '16.7 %', '16.6 %', '33.3 %']);
    await poll(() => page.getByTestId('scheme-total').textContent()).toMatch(/100\.0/);

    await page.getByRole('button', { name: 'Create draft' }).click();
    await page.waitForURL(/\/exercises\/\d+$/);
    const exerciseId = Number(new URL(page.url()).pathname.split('/').pop());
    await poll(() => page.getByTestId('exercise-state').textContent()).toContain('Draft');

    // publish, through its confirmation
    await page.getByRole('button', { name: 'Publish…' }).click();
    const dialog = page.getByRole('dialog', { name: 'Publish this exercise?' });
    await dialog.getByRole('button', { name: 'Publish' }).click();
    await poll(() => page.getByTestId('exercise-state').textContent()).toContain('Published');
    await poll(() => page.getByTestId('editor-notice').textContent()).toContain('3 variants drawn');
    expect(await ctx.db.knex('variants').count({ n: '*' }).first()).toMatchObject({ n: 3 });

    // one student's stored variant, previewed with its reference
    await page.getByLabel('Student number').fill('3100002');
    await page.getByRole('button', { name: 'Show their variant' }).click();
    await poll(() => page.getByTestId('student-variant-note').textContent()).toMatch(/3100002.*stored with revision 1/);
    await page.getByTestId('reference-preview').waitFor();
    await poll(() => page.getByTestId('reference-re').textContent()).toMatch(/\d/);
    // the answer key now comes from the server, with the students who hold each variant
    await poll(() => page.getByTestId('answer-key-table').getByText(/student/).count()).toBeGreaterThan(0);

    // three reports are handed in (by the lecturer, for the students)
    await uploadReportsForEveryone(exerciseId);

    // a change to the published exercise asks before re-marking, then makes revision 2; automatic marks are held back from now on
    await page.getByLabel('Weight', { exact: true }).first().fill('30');
    const automaticMarks = page.getByLabel('Students see the automatic mark');
    expect(await automaticMarks.inputValue()).toBe('at-once');
    await automaticMarks.selectOption('on-return');
    await page.getByRole('button', { name: 'Save as new revision…' }).click();
    const remark = page.getByRole('dialog', { name: 'Save as revision 2 and re-mark?' });
    await remark.waitFor();
    expect(await ctx.db.knex('exercise_revisions').where({ exercise_id: exerciseId }).count({ n: '*' }).first()).toMatchObject({ n: 1 });
    await remark.getByRole('button', { name: 'Save and re-mark' }).click();
    await poll(() => page.getByTestId('editor-notice').textContent()).toContain('revision 2');
    const jobs = await ctx.db.knex('jobs').where({ kind: 'remark-exercise' });
    expect(jobs).toHaveLength(1);
    await poll(() => page.getByTestId('revision-row').count()).toBe(2);
    const revision2 = await ctx.db.knex('exercise_revisions').where({ exercise_id: exerciseId, revision_no: 2 }).first('spec_json');
    expect(exerciseSpecSchema.parse(typeof revision2.spec_json === 'string' ? JSON.parse(revision2.spec_json) : revision2.spec_json).automaticMarks).toBe('on-return');

    // the re-marking job's progress bar, polled until the worker has re-marked the three reports
    const bar = page.getByTestId('remark-progress').getByRole('progressbar', { name: /Re-marking the reports/ });
    await poll(() => bar.count()).toBe(1);
    await poll(() => bar.getAttribute('aria-valuenow')).toBe('100');
    await poll(() => bar.getAttribute('aria-label')).toBe('Re-marking the reports: done');
    expect(await bar.getAttribute('aria-valuetext')).toBe('3 of 3');
    await poll(() => page.getByTestId('remark-progress').getByRole('status').textContent()).toContain('3 reports processed');
    expect(await ctx.db.knex('jobs').where({ id: jobs[0].id }).first()).toMatchObject({ state: 'done', progress_done: 3, progress_total: 3 });
    expect(await ctx.db.knex('marks').where({ revision_id: (await ctx.db.knex('exercises').where({ id: exerciseId }).first()).current_revision_id }).count({ n: '*' }).first()).toMatchObject({ n: 3 });

    // the course's Exercises tab lists it with its state and due time
    await page.goto(`${ctx.baseUrl}/courses/${courseId}/exercises`);
    const row = page.getByTestId('exercise-row');
    await poll(() => row.count()).toBe(1);
    expect(await row.textContent()).toContain('Published');
    await page.close();
  });
});
