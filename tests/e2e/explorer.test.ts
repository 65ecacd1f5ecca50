import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFile } from 'node:fs/promises';
import type { Browser, Page } from 'playwright-core';
import { startAppContext, type AppContext } from '../support/app-context';
import { launchBrowser, signInWithBrowser } from '../support/browser';
import { ensureClientBuilt } from '../../scripts/lib/client-build';
import { seedLecturerAndStudentCourse } from '../support/seed-people';

let ctx: AppContext;
let browser: Browser;
/** the explorer's chunk loads lazily and computes in the page; the machine may be busy */
const slow = { timeout: 20_000 };
/** set EXPLORER_SCREENSHOTS=<folder> to keep screenshots of the explorer for a visual check */
const shots = process.env.EXPLORER_SCREENSHOTS;

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
  return signInWithBrowser(browser, ctx, login, { acceptDownloads: true, viewport: { width: 1280, height: 900 } });
}

describe('the Reference explorer', () => {
  it('a lecturer reads curves, switches units, downloads the curve data and draws the MO diagram of O2', async () => {
    const page = await signInAs('lec1');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Reference explorer' }).click();
    await page.waitForURL(`${ctx.baseUrl}/explorer`);
    await expect.poll(() => page.getByRole('heading', { name: 'Reference explorer' }).count(), slow).toBe(1);

    // default view: the one-electron bond, LCAO with ζ = 1, in bohr
    const re = page.getByTestId('analysis-re-lcao-bonding');
    // Re = 2.4928 a0 for ζ = 1 (science.md §1: 2.493, classic LCAO result; computed)
    await expect.poll(() => re.textContent(), slow).toBe('2.4928');
    const analysis = page.getByRole('table', { name: 'Analysis of the one-electron curves' });
    expect(await analysis.getByRole('columnheader').nth(1).textContent()).toBe('Re / a₀');
    // the exact curve's minimum sits at 1.9972 a0 (science.md §2: 1.997, Bates, Ledsham & Stewart 1953)
    expect(await page.getByTestId('analysis-re-exact-bonding').textContent()).toBe('1.9972');
    if (shots) {
      await page.screenshot({ path: `${shots}/explorer-one-electron.png`, fullPage: true });
      await page.getByTestId('explorer-curves').screenshot({ path: `${shots}/explorer-curves.png` });
    }

    // switch to ångström: the same minimum, converted (2.492830 a0 × 0.529177 Å/a0 = 1.3191 Å, CODATA 2018 bohr)
    await page.getByLabel('Distance unit').selectOption('angstrom');
    await expect.poll(() => re.textContent(), slow).toBe('1.3191');
    expect(await analysis.getByRole('columnheader').nth(1).textContent()).toBe('Re / Å');
    await expect.poll(() => new URL(page.url()).searchParams.get('du'), slow).toBe('angstrom');

    // the curve data as CSV, in the units on screen: a header naming them and one row per grid point
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download Bonding and antibonding curves data as CSV' }).click(),
    ]);
    expect(download.suggestedFilename()).toBe('bonding-and-antibonding-curves.csv');
    const csv = (await readFile(await download.path())).toString('utf8').replace(/^\uFEFF/, '');
    const lines = csv.trimEnd().split('\r\n');
    expect(lines[0]).toBe('R / angstrom,E LCAO σg / hartree,E LCAO σu* / hartree,E exact 1sσg / hartree,E exact 2pσu / hartree');
    // default grid: 75 points from 0.6 to 8 a0
    expect(lines.length - 1).toBe(75);
    const first = lines[1].split(',').map(Number);
    expect(first[0]).toBeCloseTo(0.6 * 0.529177210903, 9); // 0.6 a0 in Å (CODATA 2018)

    // the plot itself as SVG: the chart, its title and its legend in one file
    const [curveSvg] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download Bonding and antibonding curves as SVG' }).click(),
    ]);
    expect(curveSvg.suggestedFilename()).toBe('bonding-and-antibonding-curves.svg');
    const curveSvgText = await readFile(await curveSvg.path(), 'utf8');
    expect(curveSvgText.startsWith('<?xml')).toBe(true);
    expect(curveSvgText).toContain('>Bonding and antibonding curves</text>');
    expect(curveSvgText).toContain('>LCAO σg</text>');
    expect(curveSvgText).toContain('R / Å');
    expect((curveSvgText.match(/class="recharts-curve recharts-line-curve"/g) ?? []).length).toBe(4);

    // an MO diagram of O2
    await page.getByLabel('Model family').selectOption('diatomic');
    const species = page.getByLabel('Species');
    await species.fill('O2');
    const diagram = page.getByRole('img', { name: /^MO diagram of O₂/ });
    await expect.poll(() => diagram.count(), slow).toBe(1);
    // O2 ground term ³Σg⁻ and configuration …(1πg*)² (science.md §4, Huber & Herzberg 1979, from memory)
    expect(await diagram.getAttribute('aria-label')).toContain('(3σg)²(1πu)⁴(1πg*)²');
    expect(await diagram.getByTestId('term-symbol').textContent()).toBe('³Σg⁻');
    // bond order 2 (science.md §4)
    expect(await page.getByTestId('answer-bond-order').locator('.num').textContent()).toBe('2');
    // two electrons in the two 1πg* bars, one each (Hund's rule)
    expect(await diagram.locator('[data-mo-level="1πg*"] [data-electrons="1"]').count()).toBe(2);
    if (shots) {
      await page.screenshot({ path: `${shots}/explorer-o2.png`, fullPage: true });
      await page.getByTestId('mo-diagram-frame').screenshot({ path: `${shots}/explorer-o2-diagram.png` });
      await page.setViewportSize({ width: 820, height: 1100 });
      await page.screenshot({ path: `${shots}/explorer-o2-tablet.png`, fullPage: true });
      await page.setViewportSize({ width: 1280, height: 900 });
    }

    // the diagram downloads as SVG (with its term symbol) and as PNG (twice the SVG's pixel size)
    const [svgDownload] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download MO diagram of O₂ as SVG' }).click()]);
    expect(svgDownload.suggestedFilename()).toBe('mo-diagram-of-o2.svg');
    const svgText = await readFile(await svgDownload.path(), 'utf8');
    expect(svgText).toContain('data-mo-level="1πg*"');
    expect(svgText).toMatch(/data-testid="term-symbol"[^>]*>³Σ<tspan[^>]*>g<\/tspan><tspan[^>]*>⁻<\/tspan>/);
    const [pngDownload] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download MO diagram of O₂ as PNG' }).click()]);
    expect(pngDownload.suggestedFilename()).toBe('mo-diagram-of-o2.png');
    const png = await readFile(await pngDownload.path());
    expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]); // PNG signature (RFC 2083)
    const svgWidth = Number(/<svg[^>]* width="(\d+)"/.exec(svgText)![1]);
    expect(png.readUInt32BE(16)).toBe(2 * svgWidth); // IHDR width

    // the view is in the address: opening it again shows the same diagram
    const url = new URL(page.url());
    expect(url.searchParams.get('f')).toBe('diatomic');
    expect(url.searchParams.get('sp')).toBe('O2');
    await page.goto(url.toString());
    await expect.poll(() => page.getByRole('img', { name: /^MO diagram of O₂/ }).count(), slow).toBe(1);
    await page.close();
  });

  it('a Hückel graph with mistakes says where they are', async () => {
    const page = await signInAs('lec1');
    await page.goto(`${ctx.baseUrl}/explorer?f=huckel&hk=graph`);
    await page.getByLabel('Graph (JSON)').fill('{"atoms": ["C", "Q"], "bonds": [[0, 5]]}');
    const errors = page.getByTestId('explorer-graph-errors');
    await expect.poll(() => errors.textContent(), slow).toContain("atoms[1].type: unknown atom type 'Q'");
    expect(await errors.textContent()).toContain('bonds[0].to: atom index 5 is out of range');
    // benzene as a graph: levels α + 2β, α + β (×2), … (science.md §5)
    await page.getByLabel('Graph (JSON)').fill('{"name": "benzene", "atoms": ["C","C","C","C","C","C"], "bonds": [[0,1],[1,2],[2,3],[3,4],[4,5],[5,0]]}');
    const levels = page.getByRole('img', { name: /^Hückel levels of benzene/ });
    await expect.poll(() => levels.count(), slow).toBe(1);
    expect(await levels.getAttribute('aria-label')).toContain('α + 2β, α + β (×2), α − β (×2), α − 2β');
    if (shots) await page.screenshot({ path: `${shots}/explorer-huckel.png`, fullPage: true });
    await page.close();
  });

  it('students have no explorer', async () => {
    const page = await signInAs('stu1');
    expect(await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Reference explorer' }).count()).toBe(0);
    await page.goto(`${ctx.baseUrl}/explorer`);
    await expect.poll(() => page.getByRole('heading', { name: 'No access to this page' }).count(), slow).toBe(1);
    await page.close();
  });
});
