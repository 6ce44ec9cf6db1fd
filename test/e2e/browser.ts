/**
 * Launches Debian's chromium through playwright-core for the browser tests: headless, no GPU,
 * no network beyond what the page asks for, and a fresh profile directory per launch.
 */
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext } from 'playwright-core';

/** A browser context and the profile directory to remove afterwards. */
export interface TestBrowser {
  context: BrowserContext;
  close(): Promise<void>;
}

/**
 * Starts chromium with a fresh `--user-data-dir`.
 * @param downloadsPath where downloads land (playwright keeps them until the context closes)
 */
export async function launchBrowser(): Promise<TestBrowser> {
  const profile = await mkdtemp(join(tmpdir(), 'sheaf-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    acceptDownloads: true,
    viewport: { width: 1400, height: 950 },
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  return {
    context,
    async close() {
      await context.close();
      await rm(profile, { recursive: true, force: true });
    },
  };
}
