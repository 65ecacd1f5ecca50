import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { startAppContext, type AppContext } from '../support/app-context';
import { launchBrowser, signInWithBrowser } from '../support/browser';
import { ensureClientBuilt } from '../../scripts/lib/client-build';
import { seedLecturerAndStudentCourse } from '../support/seed-people';

let ctx: AppContext;
let browser: Browser;

beforeAll(async () => {
  await ensureClientBuilt(() => {});
  ctx = await startAppContext({ client: 'static' });
  await seedLecturerAndStudentCourse(ctx.db.knex, ctx.issuer);
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await ctx?.close();
});

async function signInAs(login: string): Promise<Page> {
  return signInWithBrowser(browser, ctx, login);
}

describe('signing in with a browser', () => {
  it('a lecturer signs in and sees their dashboard and courses, without admin navigation', async () => {
    const page = await signInAs('lec1');
    const nav = page.getByRole('navigation', { name: 'Main' });
    await expect.poll(() => nav.getByRole('link', { name: 'Courses' }).count()).toBe(1);
    expect(await nav.getByRole('link', { name: 'People' }).count()).toBe(0);
    await expect.poll(() => page.getByText('TST 410').count()).toBeGreaterThan(0);
    await nav.getByRole('link', { name: 'Dashboard' }).click();
    await page.waitForURL(`${ctx.baseUrl}/`);
    await expect.poll(() => page.getByText('Lena Lecturer').count()).toBeGreaterThan(0);
    await page.close();
  });

  it('a student sees no staff navigation', async () => {
    const page = await signInAs('stu1');
    const nav = page.getByRole('navigation', { name: 'Main' });
    await expect.poll(() => nav.getByRole('link', { name: 'Dashboard' }).count()).toBe(1);
    expect(await nav.getByRole('link', { name: 'People' }).count()).toBe(0);
    expect(await nav.getByRole('link', { name: 'Audit log' }).count()).toBe(0);
    await page.close();
  });

  it('unknown client routes show the not-found page', async () => {
    const page = await signInAs('lec1');
    await page.goto(`${ctx.baseUrl}/no/such/page`);
    await expect.poll(() => page.getByRole('heading', { name: 'Page not found' }).count()).toBe(1);
    await page.close();
  });
});
