/** Debian's Chromium driven by playwright-core, headless, for journey tests. */
import { chromium, type Browser } from 'playwright-core';
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
