import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoPassword } from '../../server/db/seed/demo-scenario.js';
import { openBrowser, screenshot, signInAs } from '../helpers/browser.js';
import { startLiveStack, type LiveStack } from '../helpers/live-stack.js';

describe('periods and follow-ups in a browser', () => {
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

  const signIn = (email: string) => signInAs(browser.page, stack.appUrl, email, demoPassword, 'Tamsin Creek Works');

  it('shows the coordinator a period with its exceedances, verdicts and the caution, and compiles it', async () => {
    const { page } = browser;
    await signIn('coordinator@decant.test');
    await page.goto(`${stack.appUrl}/periods`);
    const [period] = await stack.dataSource.query(
      `SELECT rp.id FROM reporting_period rp JOIN permit p ON p.id = rp.permit_id WHERE p.number = 'TCU-IU-0417' AND rp.starts_on <= (SELECT min(collected_on) FROM lab_sample s JOIN lab_result r ON r.sample_id = s.id WHERE r.value_reported = '150') ORDER BY rp.starts_on DESC LIMIT 1`,
    );
    await page.goto(`${stack.appUrl}/periods/${period.id}`);
    await page.locator('[data-test="caution"]').waitFor();
    expect(await page.locator('[data-test="caution"]').textContent()).toContain('the control authority decide');
    await page.getByText('Over limit').first().waitFor();
    await page.getByText('Significant noncompliance', { exact: true }).waitFor();
    expect(await page.getByRole('cell', { name: 'Met', exact: true }).count()).toBeGreaterThan(0);
    await page.click('[data-test="compile"]');
    await page.getByText('Compiled and saved').waitFor();
    await screenshot(page, 'period');
    await page.goto(`${stack.appUrl}/follow-ups`);
    await page.locator('tbody tr').first().waitFor();
    await screenshot(page, 'follow-ups');
  });

  it('lets the auditor read a period without compiling it', async () => {
    const { page } = browser;
    await signIn('auditor@decant.test');
    await page.goto(`${stack.appUrl}/periods`);
    await page.locator('tbody tr').first().click();
    await page.locator('[data-test="caution"]').waitFor();
    expect(await page.locator('[data-test="compile"]').count()).toBe(0);
  });
});
