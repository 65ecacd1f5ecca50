/**
 * Browser journey: a student signs in, opens My exercises from the navigation
 * and downloads their personal template; the downloaded file is theirs.
 */
import ExcelJS from 'exceljs';
import { readFile } from 'node:fs/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { exerciseSpecSchema } from '@shared/exercises/spec';
import { startAppContext, type AppContext } from '../support/app-context';
import { launchBrowser, signInWithBrowser } from '../support/browser';
import { ensureClientBuilt } from '../../scripts/lib/client-build';

let ctx: AppContext;
let browser: Browser;
let exerciseId: number;

beforeAll(async () => {
  await ensureClientBuilt(() => {});
  ctx = await startAppContext({ client: 'static' });
  const k = ctx.db.knex;
  const [lec] = await k('users').insert({ oidc_issuer: ctx.issuer, oidc_subject: 'lec1', email: 'lec1@test.example', display_name: 'Lena Lecturer' });
  const [stu] = await k('users').insert({ oidc_issuer: ctx.issuer, oidc_subject: 'stu1', email: 'stu1@test.example', display_name: 'Stella Student' });
  const [stu2] = await k('users').insert({ oidc_issuer: ctx.issuer, oidc_subject: 'stu2', email: 'stu2@test.example', display_name: 'Sam Student' });
  const [term] = await k('terms').insert({ name: 'Spring 2027', starts_on: '2027-01-11', ends_on: '2027-05-07' });
  const [course] = await k('courses').insert({ term_id: term, code: 'TST 410', title: 'Bonding in practice' });
  const [other] = await k('courses').insert({ term_id: term, code: 'TST 520', title: 'Quiet course' });
  await k('course_staff').insert({ course_id: course, user_id: lec, role: 'lecturer' });
  const [section] = await k('sections').insert({ course_id: course, name: 'Thursday' });
  await k('enrolments').insert({ course_id: course, user_id: stu, student_number: '2400101', section_id: section, given_name: 'Stella', family_name: 'Starling' });
  await k('enrolments').insert({ course_id: other, user_id: stu2, student_number: '2400102' });
  const spec = exerciseSpecSchema.parse({
    title: 'Hydrogen molecule ion',
    model: {
      family: 'one-electron',
      method: 'lcao',
      za: { kind: 'fixed', value: 1 },
      zb: { kind: 'fixed', value: 1 },
      zeta: { kind: 'fixed', value: 1 },
      states: ['bonding', 'antibonding'],
      grid: { unit: 'bohr', start: 1, end: 6, step: 0.5 },
    },
    variantSeed: 'e2e',
    dueLocal: '2030-03-15T17:00',
    timeZone: 'Europe/Berlin',
    late: { graceMinutes: 0, penaltyPerDayPercent: 10, capPercent: 50 },
    scheme: { checks: [{ kind: 'curve-rms', id: 'rms', label: 'Curve RMS', weight: 1, full: 0.001, zero: 0.01 }] },
  });
  [exerciseId] = await k('exercises').insert({ course_id: course, state: 'published', created_by: lec });
  const [revision] = await k('exercise_revisions').insert({
    exercise_id: exerciseId,
    revision_no: 1,
    spec_json: JSON.stringify(spec),
    engine_version: 'test',
    created_by: lec,
    published_at: new Date(),
  });
  await k('exercises').where({ id: exerciseId }).update({ current_revision_id: revision });
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await ctx?.close();
});

async function signInAs(login: string): Promise<Page> {
  return signInWithBrowser(browser, ctx, login, { acceptDownloads: true });
}

describe('My exercises in a browser', () => {
  it('a student opens My exercises and downloads their own template', async () => {
    const page = await signInAs('stu1');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'My exercises' }).click();
    await page.waitForURL(`${ctx.baseUrl}/my/exercises`);
    const row = page.getByTestId('my-exercise-row');
    await expect.poll(() => row.count(), { timeout: 20_000 }).toBe(1);
    const text = await row.innerText();
    expect(text).toContain('Hydrogen molecule ion');
    expect(text).toContain('TST 410');
    expect(text).toContain('Za = 1, Zb = 1, ζ = 1');
    // 17:00 in Berlin on 15 March 2030 is still winter time, CET (IANA tz database)
    expect(text).toContain('Fri 15 Mar 2030, 17:00');
    expect(text).toMatch(/in \d+ years?/);
    expect(await page.getByRole('link', { name: 'Upload report: Hydrogen molecule ion' }).getAttribute('href')).toBe(`/my/exercises/${exerciseId}/upload`);

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download template: Hydrogen molecule ion' }).click(),
    ]);
    expect(download.suggestedFilename()).toBe(`TST410-ex${exerciseId}-2400101.xlsx`);
    const bytes = await readFile((await download.path())!);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(bytes as unknown as ArrayBuffer);
    expect(wb.getWorksheet('About')!.getCell('B7').value).toBe('2400101');
    expect(wb.getWorksheet('About')!.getCell('B6').value).toBe('Stella Starling');
    const meta = new Map<string, unknown>();
    wb.getWorksheet('bondmark-meta')!.eachRow((r) => meta.set(String(r.getCell(1).value), r.getCell(2).value));
    expect(meta.get('studentNumber')).toBe('2400101');
    expect(meta.get('exerciseId')).toBe(String(exerciseId));
    await page.close();
  });

  it('a student with no published exercises sees the empty state', async () => {
    const page = await signInAs('stu2');
    await page.goto(`${ctx.baseUrl}/my/exercises`);
    await expect.poll(() => page.getByTestId('my-exercises-empty').count(), { timeout: 20_000 }).toBe(1);
    expect(await page.getByTestId('my-exercises-empty').innerText()).toContain('No exercises yet');
    await page.close();
  });
});
