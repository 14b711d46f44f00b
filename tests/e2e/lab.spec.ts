import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoPassword } from '../../server/db/seed/demo-scenario.js';
import { openBrowser, screenshot, signInAs } from '../helpers/browser.js';
import { startLiveStack, type LiveStack } from '../helpers/live-stack.js';
import { tinyPdf } from '../fixtures/lab.js';

describe('the Lab area in a browser', () => {
  let stack: LiveStack;
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    stack = await startLiveStack({ withClient: true });
    browser = await openBrowser({ width: 1400, height: 900 });
  });
  afterAll(async () => {
    await browser?.close();
    await stack?.close();
  });

  const signIn = (email: string) => signInAs(browser.page, stack.appUrl, email, demoPassword);

  it('lets the coordinator upload a certificate whose result was analysed 30 days late, and shows the holding-time flag', async () => {
    const { page } = browser;
    await signIn('coordinator@decant.test');
    await page.goto(`${stack.appUrl}/lab/certificates/new`);
    await page.getByText('Sampling for oil and grease uses hazardous chemicals').waitFor();
    const pdfPath = join(tmpdir(), `decant-e2e-${Date.now()}.pdf`);
    writeFileSync(pdfPath, tinyPdf);
    await page.setInputFiles('[data-test="pdf-input"]', pdfPath);
    await page.getByRole('textbox', { name: 'Lab', exact: true }).fill('Browser Test Lab');
    await page.getByRole('textbox', { name: 'Lab accreditation number' }).fill('BT-1');
    await page.getByRole('textbox', { name: 'Report number' }).fill(`BT-${Date.now()}`);
    await page.getByLabel('Collected at').fill('2026-03-02T09:30');
    await page.getByRole('textbox', { name: 'Collected by' }).fill('E2E Sampler');
    await page.locator('[data-test="result-value"] input').fill('24.1');
    await page.locator('[data-test="analysed-at"] input').fill('2026-04-01T10:00');
    await screenshot(page, 'lab-new-certificate');
    await page.click('[data-test="save-certificate"]');
    await page.waitForURL(/\/lab\/certificates\/[0-9a-f-]{36}$/);
    await page.locator('[data-flag="holding-time"]').first().waitFor();
    expect(await page.locator('[data-flag="holding-time"]').count()).toBeGreaterThanOrEqual(2);
    expect(await page.getByText('Holding time').first().isVisible()).toBe(true);
    await screenshot(page, 'lab-certificate-holding-time');

    // The lab's reissued certificate moves the analysis inside the 28 days (Method 1664 Rev. B §8.5): correcting it clears the flag.
    const certificateUrl = page.url();
    await page.click('[data-test="correct"]');
    await page.waitForURL(/\/edit$/);
    await page.locator('[data-test="analysed-at"] input').fill('2026-03-20T10:00');
    await screenshot(page, 'lab-correct-certificate');
    await page.click('[data-test="save-certificate"]');
    await page.waitForURL(certificateUrl);
    await page.getByText('Corrected certificate').waitFor();
    expect(await page.locator('[data-flag="holding-time"]').count()).toBe(0);
  });

  it('lets the auditor read the Lab area without any way to change it', async () => {
    const { page } = browser;
    await signIn('auditor@decant.test');
    await page.goto(`${stack.appUrl}/lab`);
    await page.locator('tbody tr').first().waitFor();
    expect(await page.locator('[data-test="add-certificate"]').count()).toBe(0);
    await page.locator('tbody tr a').first().click();
    await page.waitForURL(/\/lab\/certificates\/[0-9a-f-]{36}$/);
    await page.getByText('Findings', { exact: true }).first().waitFor();
    expect(await page.locator('[data-test="correct"]').count()).toBe(0);
    await page.goBack();
    await page.goto(`${stack.appUrl}/lab?tab=results`);
    await page.locator('tbody tr').first().waitFor();
    await screenshot(page, 'lab-results-auditor');
  });
});
