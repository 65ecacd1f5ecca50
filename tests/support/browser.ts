/** Debian's Chromium driven by playwright-core, headless, for journey tests. */
import { chromium, type Browser, type BrowserContextOptions, type Page } from 'playwright-core';
import { existsSync } from 'node:fs';

export async function launchBrowser(): Promise<Browser> {
  const executablePath = ['/usr/bin/chromium', '/usr/bin/chromium-browser'].find((p) => existsSync(p));
  if (!executablePath) throw new Error('Chromium not found: install Debian\'s `chromium` package (apt-get install chromium).');
  return chromium.launch({
    executablePath,
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'],
  });
}

/**
 * Opens a page and signs in through the app's sign-in screen and the stand-in
 * identity provider, the way a person does; ends on `path` (default /courses).
 */
export async function signInWithBrowser(
  browser: Browser,
  ctx: { baseUrl: string; issuer: string },
  login: string,
  options: BrowserContextOptions & { path?: string } = {},
): Promise<Page> {
  const { path = '/courses', ...pageOptions } = options;
  const page = await browser.newPage(pageOptions);
  await page.goto(`${ctx.baseUrl}${path}`);
  // not signed in: the app sends us to its sign-in screen
  await page.waitForURL(/\/signin/);
  await page.getByRole('button', { name: /Sign in with your university account/ }).click();
  // the identity provider's page
  await page.waitForURL(new RegExp(`^${ctx.issuer}/interaction/`));
  await page.getByLabel('University login').fill(login);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL(`${ctx.baseUrl}${path}`);
  return page;
}
