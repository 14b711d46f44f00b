import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

export const screenshotDir = resolve(import.meta.dirname, '../e2e/screenshots');

/** Debian's chromium through playwright-core: never a downloaded browser. */
export async function openBrowser(
  viewport = { width: 1280, height: 800 },
): Promise<{ context: BrowserContext; page: Page; close(): Promise<void> }> {
  const profile = mkdtempSync(join(tmpdir(), 'decant-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(screenshotDir, { recursive: true });
  await page.screenshot({ path: join(screenshotDir, `${name}.png`), fullPage: true });
}

/** Signs a demo account in through the identity provider's own login page, as a person would. */
export async function signInAs(page: Page, appUrl: string, email: string, password: string, site?: string): Promise<void> {
  await page.context().clearCookies();
  await page.goto(`${appUrl}/sign-in`);
  await page.getByText(email, { exact: true }).click();
  await page.fill('#password', password);
  await page.click('button[type=submit]');
  await page.waitForURL(
    (url) => url.origin === new URL(appUrl).origin && !url.pathname.startsWith('/sign-in') && !url.pathname.startsWith('/api'),
  );
  if (site) {
    await page.locator('.v-app-bar .v-select').click();
    await page.getByRole('option', { name: site }).click();
  }
}
