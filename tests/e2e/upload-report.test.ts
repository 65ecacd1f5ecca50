/**
 * A student hands in a report in a real browser: picks a CSV whose header
 * names the wrong distance unit, sees what was read, corrects the unit,
 * drops a PDF write-up on its slot, confirms, and sees the report as
 * submitted in the version history with its automatic mark (the exercise
 * gives marks at once, the default): the checks with their feedback, the
 * total, marked provisional, and the plot against the reference — on the
 * upload page and on the report's own page.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { distanceFromBohr } from '@shared/chemistry/units';
import { startAppContext, type AppContext } from '../support/app-context';
import { launchBrowser } from '../support/browser';
import { ensureClientBuilt } from '../../scripts/lib/client-build';
import { createPublishedExercise, curveReferenceOf, curveSpec, minimalPdf, seedCourse, variantOf, type SeededCourse } from '../integration/reports-fixtures';

let ctx: AppContext;
let browser: Browser;
let seed: SeededCourse;
let exerciseId: number;
const spec = curveSpec();

beforeAll(async () => {
  await ensureClientBuilt(() => {});
  ctx = await startAppContext({ client: 'static' });
  seed = await seedCourse(ctx.db.knex, ctx.issuer);
  ({ exerciseId } = await createPublishedExercise(ctx.db.knex, seed.courseId, seed.users.lec1, spec));
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await ctx?.close();
});

/** The student's curve in bohr and hartree — under a header that wrongly says Å. */
function mislabelledCsv(): string {
  const reference = curveReferenceOf(spec, variantOf(spec, seed.studentNumbers.stu1));
  const lines = ['R / Å,E(sigma g) / Eh,E(sigma u) / Eh'];
  reference.grid.bohr.forEach((r, i) => lines.push([distanceFromBohr(r, 'bohr').toFixed(4), ...reference.curves.map((c) => c.energyHartree[i].toFixed(8))].join(',')));
  return lines.join('\n') + '\n';
}

describe('uploading a report', () => {
  it('a student uploads a CSV, corrects the distance unit, confirms, and sees the report as submitted with its automatic mark', async () => {
    const page = await browser.newPage();
    await page.goto(`${ctx.baseUrl}/my/exercises/${exerciseId}/upload`);
    await page.waitForURL(/\/signin/);
    await page.getByRole('button', { name: /Sign in with your university account/ }).or(page.getByRole('link', { name: /Sign in with your university account/ })).click();
    await page.waitForURL(new RegExp(`^${ctx.issuer}/interaction/`));
    await page.getByLabel('University login').fill('stu1');
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(`${ctx.baseUrl}/my/exercises/${exerciseId}/upload`);

    await expect.poll(() => page.getByRole('heading', { name: /Upload report: The one-electron bond/ }).count()).toBe(1);
    await expect.poll(() => page.getByTestId('versions-empty').count()).toBe(1);

    // choose the data file with the file input (what the "Choose data file" button opens)
    await page.getByLabel('Data file', { exact: true }).setInputFiles({ name: 'my-curve.csv', mimeType: 'text/csv', buffer: Buffer.from(mislabelledCsv()) });
    await expect.poll(() => page.getByRole('heading', { name: 'What was read' }).count()).toBe(1);
    const distanceUnit = page.getByLabel('Distance unit');
    // the header said Å, so that is what was read
    await expect.poll(() => distanceUnit.inputValue()).toBe('angstrom');
    await expect.poll(() => page.getByText('from the column header').count()).toBeGreaterThan(0);
    expect(await page.getByTestId('preview-plot').count()).toBe(1);

    // the student corrects it: the numbers are in bohr; the file is read again with that choice
    await distanceUnit.selectOption('bohr');
    await expect.poll(() => page.getByText('as you chose').count()).toBeGreaterThan(0);
    await expect.poll(() => distanceUnit.inputValue()).toBe('bohr');

    // the write-up is dropped on its slot
    const dataTransfer = await page.evaluateHandle((pdf) => {
      const dt = new DataTransfer();
      dt.items.add(new File([pdf], 'write-up.pdf', { type: 'application/pdf' }));
      return dt;
    }, minimalPdf);
    await page.getByTestId('writeup-drop-zone').dispatchEvent('drop', { dataTransfer });
    await expect.poll(() => page.getByTestId('writeup-drop-zone').getByText('write-up.pdf').count()).toBe(1);
    await expect.poll(() => page.getByTestId('upload-progress').count()).toBe(0);
    await expect.poll(() => distanceUnit.inputValue()).toBe('bohr');

    await page.getByRole('button', { name: 'Confirm and upload' }).click();
    const done = page.getByTestId('upload-done');
    await expect.poll(() => done.count(), { timeout: 15_000 }).toBe(1);
    expect(await done.textContent()).toContain('Version 1 submitted');
    expect(await done.textContent()).toContain('On time');

    expect(await done.textContent()).toContain('automatic mark is below');

    // what was stored: the corrected unit, the write-up, and a mark with full points (the file is the reference)
    const report = await ctx.db.knex('reports').where({ exercise_id: exerciseId, enrolment_id: seed.enrolments.stu1 }).first();
    const reading = typeof report.reading_json === 'string' ? JSON.parse(report.reading_json) : report.reading_json;
    expect(reading.units).toMatchObject({ distance: 'bohr', distanceSource: 'user' });
    expect(report.writeup_file_id).not.toBeNull();
    const mark = await ctx.db.knex('marks').where({ report_id: report.id }).first();
    const max = Number(mark.max_points);
    expect(max).toBeGreaterThan(0);
    expect(Number(mark.total)).toBe(max);

    const row = page.getByTestId('version-row');
    await expect.poll(() => row.count()).toBe(1);
    expect(await row.textContent()).toContain('Submitted');
    expect(await row.textContent()).toContain('my-curve.csv');
    // the student sees the automatic total, provisional until the report is returned
    expect(await row.textContent()).toContain(`${max} of ${max}`);
    expect(await row.textContent()).toContain('provisional');

    // the newest version's mark on the upload page: labelled automatic and provisional, a row per check with its feedback
    const newest = page.getByTestId('newest-mark');
    await expect.poll(() => newest.getByRole('heading', { name: /Automatic mark of version 1/ }).count()).toBe(1);
    expect(await newest.getByTestId('mark-total').textContent()).toContain(`${max} of ${max} points`);
    expect(await newest.getByTestId('mark-provisional-note').textContent()).toMatch(/provisional until an assistant returns the report/);
    const checks = newest.getByTestId('check-row');
    expect(await checks.count()).toBe(4); // curve RMS, Re, De, antibonding repulsive (the fixture's default scheme)
    for (const text of await checks.allTextContents()) expect(text.length).toBeGreaterThan(30);
    // and the plot of the student's points against the reference
    await expect.poll(() => newest.getByTestId('overlay-plot').count(), { timeout: 15_000 }).toBe(1);

    // the report's own page says the same
    await row.getByRole('link', { name: 'Open version 1' }).click();
    await page.waitForURL(`${ctx.baseUrl}/reports/${report.id}`);
    const view = page.getByTestId('mark-view');
    await expect.poll(() => view.count()).toBe(1);
    expect(await view.getAttribute('data-provisional')).toBe('true');
    expect(await view.getByRole('heading', { name: /Automatic mark/ }).textContent()).toContain('Provisional');
    expect(await view.getByTestId('mark-total').textContent()).toContain(`${max} of ${max} points`);
    await expect.poll(() => page.getByTestId('overlay-plot').count()).toBe(1);
    expect(await page.getByTestId('not-returned').count()).toBe(0);
    await page.close();
  });

  it('a file that cannot be read is refused on the page with its place, and nothing is stored', async () => {
    const page = await browser.newPage();
    await page.goto(`${ctx.baseUrl}/my/exercises/${exerciseId}/upload`);
    await page.waitForURL(/\/signin/);
    await page.getByRole('button', { name: /Sign in with your university account/ }).or(page.getByRole('link', { name: /Sign in with your university account/ })).click();
    await page.getByLabel('University login').fill('stu1');
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(`${ctx.baseUrl}/my/exercises/${exerciseId}/upload`);
    const before = await ctx.db.knex('reports').count({ n: '*' }).first();
    await page.getByLabel('Data file', { exact: true }).setInputFiles({ name: 'broken.csv', mimeType: 'text/csv', buffer: Buffer.from('R,E\n1.0,-0.5\n1.2,-0.55\n1.4,n/a\n1.6,-0.57\n1.8,-0.56\n2.0,-0.55\n') });
    const refusal = page.getByTestId('upload-refusal');
    await expect.poll(() => refusal.count()).toBe(1);
    expect(await refusal.textContent()).toMatch(/row 4/i);
    expect(await refusal.textContent()).toContain('Nothing was stored');
    expect(await page.getByRole('button', { name: 'Confirm and upload' }).count()).toBe(0);
    expect(await ctx.db.knex('reports').count({ n: '*' }).first()).toEqual(before);
    await page.close();
  });
});
