/**
 * Browser journey: a lecturer creates a course, gives it two sections and
 * imports a small roster through the wizard (a file with an error first:
 * apply stays disabled; then a clean one).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { startAppContext, type AppContext } from '../support/app-context';
import { launchBrowser, signInWithBrowser } from '../support/browser';
import { ensureClientBuilt } from '../../scripts/lib/client-build';

let ctx: AppContext;
let browser: Browser;

beforeAll(async () => {
  await ensureClientBuilt(() => {});
  ctx = await startAppContext({ client: 'static' });
  const k = ctx.db.knex;
  const [lec] = await k('users').insert({ oidc_issuer: ctx.issuer, oidc_subject: 'lec1', email: 'lec1@test.example', display_name: 'Lena Lecturer' });
  await k('users').insert({ oidc_issuer: ctx.issuer, oidc_subject: 'ta1', email: 'ta1@test.example', display_name: 'Tariq Assistant' });
  const [term] = await k('terms').insert({ name: 'Spring 2027', starts_on: '2027-01-11', ends_on: '2027-05-07' });
  // lec1 is already lecturer on a course, which is what lets a lecturer create courses
  const [earlier] = await k('courses').insert({ term_id: term, code: 'TST 410', title: 'Bonding in practice' });
  await k('course_staff').insert({ course_id: earlier, user_id: lec, role: 'lecturer' });
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await ctx?.close();
});

async function signInAs(login: string): Promise<Page> {
  return signInWithBrowser(browser, ctx, login);
}

const rows = async (table: string, courseId: number) => Number((await ctx.db.knex(table).where({ course_id: courseId }).count({ n: '*' }).first())!.n);
const csv = (lines: string[]) => ({ name: 'registrar.csv', mimeType: 'text/csv', buffer: Buffer.from(lines.join('\r\n')) });

describe('setting up a course in the browser', () => {
  it('a lecturer creates a course with two sections and imports a roster through the wizard', async () => {
    const page = await signInAs('lec1');

    // a new course
    await page.getByRole('link', { name: 'New course' }).click();
    await page.waitForURL(`${ctx.baseUrl}/courses/new`);
    await page.getByLabel('Course code').fill('TST 510');
    await page.getByLabel('Title').fill('Orbitals in the laboratory');
    await page.getByLabel('Term').selectOption({ label: 'Spring 2027 (2027-01-11 – 2027-05-07)' });
    await page.getByRole('button', { name: 'Create course' }).click();
    await page.waitForURL(/\/courses\/\d+\/sections$/);
    const courseId = Number(/courses\/(\d+)\//.exec(page.url())![1]);
    await expect.poll(() => page.getByRole('heading', { name: /TST 510/ }).count()).toBe(1);
    const tabs = page.getByRole('navigation', { name: 'Course pages' });
    for (const name of ['Sections', 'Roster', 'Exercises', 'Settings']) expect(await tabs.getByRole('link', { name }).count(), name).toBe(1);

    // two sections
    for (const [name, day, from, to] of [
      ['Lab A', 'Tuesday', '09:00', '12:00'],
      ['Lab B', 'Thursday', '14:00', '17:00'],
    ]) {
      await page.getByRole('button', { name: 'New section' }).click();
      const form = page.getByRole('form', { name: 'New section' });
      await form.getByLabel('Section name').fill(name);
      await form.getByLabel('Weekday').selectOption({ label: day });
      await form.getByLabel('Starts at').fill(from);
      await form.getByLabel('Ends at').fill(to);
      await form.getByLabel('Room').fill('C-204');
      await form.getByLabel('Capacity').fill('24');
      await form.getByRole('button', { name: 'Create section' }).click();
      await expect.poll(() => page.getByTestId('section-row').filter({ hasText: name }).count()).toBe(1);
    }
    await expect.poll(() => page.getByTestId('section-row').filter({ hasText: 'Thursday' }).filter({ hasText: '14:00–17:00' }).count()).toBe(1);
    expect(await rows('sections', courseId)).toBe(2);

    // the roster tab: nobody yet
    await tabs.getByRole('link', { name: 'Roster' }).click();
    await page.waitForURL(`${ctx.baseUrl}/courses/${courseId}/roster`);
    await page.getByRole('link', { name: 'Import roster' }).click();
    await page.waitForURL(`${ctx.baseUrl}/courses/${courseId}/roster/import`);

    // a file with a mistake: the wizard shows it and will not apply
    await page.getByLabel('Roster file (CSV or XLSX)').setInputFiles(
      csv(['Student number;Surname;First name;E-mail;Section', '2700001;Abara;Ines;ines.abara@students.example.org;Lab A', '2700002;Brandt;Jonas;;Lab B']),
    );
    await page.getByRole('button', { name: 'Read file' }).click();
    await expect.poll(() => page.getByTestId('mapping-table').count()).toBe(1);
    expect(await page.getByLabel('E-mail', { exact: true }).inputValue()).toBe('3');
    await page.getByRole('button', { name: 'Check rows' }).click();
    await expect.poll(() => page.getByTestId('preview-row').count()).toBe(2);
    await expect.poll(() => page.getByText('Row 3, column "E-mail" (D): is empty').count()).toBe(1);
    expect(await page.getByRole('button', { name: 'Apply import' }).isDisabled()).toBe(true);
    expect(await rows('enrolments', courseId)).toBe(0);

    // the corrected file
    await page.getByRole('button', { name: 'Back to columns' }).click();
    await page.getByRole('button', { name: 'Choose another file' }).click();
    await page.getByLabel('Roster file (CSV or XLSX)').setInputFiles(
      csv([
        'Student number;Surname;First name;E-mail;Section',
        '2700001;Abara;Ines;ines.abara@students.example.org;Lab A',
        '2700002;Brandt;Jonas;Jonas.Brandt@students.example.org;Lab B',
        '',
        '2700003; Costa ;Chiara;chiara.costa@students.example.org;lab b',
      ]),
    );
    await page.getByRole('button', { name: 'Read file' }).click();
    await expect.poll(() => page.getByTestId('mapping-table').count()).toBe(1);
    await page.getByRole('button', { name: 'Check rows' }).click();
    await expect.poll(() => page.locator('[data-testid="preview-row"][data-status="new"]').count()).toBe(3);
    expect(await page.getByRole('button', { name: 'Apply import' }).isDisabled()).toBe(false);
    await page.getByRole('button', { name: 'Apply import' }).click();
    await expect.poll(() => page.getByTestId('import-done').count()).toBe(1);
    await expect.poll(() => page.getByText(/The roster was updated from registrar\.csv/).count()).toBe(1);
    expect(await rows('enrolments', courseId)).toBe(3);
    expect(await rows('roster_imports', courseId)).toBe(1);

    // the roster table: three students, filtered by section through the URL, sorted by family name
    await page.getByRole('link', { name: 'Open the roster' }).click();
    await page.waitForURL(`${ctx.baseUrl}/courses/${courseId}/roster`);
    await expect.poll(() => page.getByTestId('roster-row').count()).toBe(3);
    await page.getByLabel('Section', { exact: true }).selectOption({ label: 'Lab B' });
    await expect.poll(() => page.getByTestId('roster-row').count()).toBe(2);
    expect(page.url()).toMatch(/section=\d+/);
    await page.getByTestId('sort-familyName').click();
    await page.getByTestId('sort-familyName').click();
    await expect.poll(() => page.getByTestId('roster-row').first().getAttribute('data-student-number')).toBe('2700003');
    expect(page.url()).toMatch(/sort=-familyName/);
    await page.close();
  });
});
