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

  it('lets the coordinator sign a finished period, signing in again at the provider first, and shows "signed by"', async () => {
    const { page } = browser;
    await signIn('coordinator@decant.test');
    // The second half of 2025: finished, and no other test writes into it.
    const [period] = await stack.dataSource.query(
      `SELECT rp.id FROM reporting_period rp JOIN permit p ON p.id = rp.permit_id WHERE p.number = 'TCU-IU-0417' AND rp.starts_on = '2025-07-01'`,
    );
    // The sign-in was 20 minutes ago: a signature needs a fresh one.
    await stack.dataSource.query(
      `UPDATE session SET sess = (sess::jsonb || jsonb_build_object('authenticatedAt', $1::bigint))::json
        WHERE sess::jsonb->>'userId' = (SELECT id::text FROM app_user WHERE email = 'coordinator@decant.test')`,
      [Date.now() - 20 * 60 * 1000],
    );
    await page.goto(`${stack.appUrl}/periods/${period.id}`);
    await page.locator('[data-test="draft"]').waitFor();
    await page.click('[data-test="open-sign"]');
    await page.locator('[data-test="reauthenticate"]').waitFor();
    await screenshot(page, 'period-sign-reauthenticate');
    await page.getByRole('link', { name: 'Sign in again' }).click();
    // The provider asks for the password again (prompt=login), whatever its own session says.
    await page.locator('#password').waitFor();
    await page.fill('#email', 'coordinator@decant.test');
    await page.fill('#password', demoPassword);
    await page.click('button[type=submit]');
    await page.locator('[data-test="statement"]').waitFor();
    expect(await page.locator('[data-test="statement"]').textContent()).toMatch(/^I certify under penalty of law/);
    if (await page.locator('[data-test="acknowledge"]').count()) await page.locator('[data-test="acknowledge"] input').check();
    await page.locator('[data-test="accept-statement"] input').check();
    await page.getByLabel('Title').fill('EHS coordinator');
    await screenshot(page, 'period-sign');
    await page.click('[data-test="sign"]');
    await page.locator('[data-test="signed-by"]').waitFor();
    expect(await page.locator('[data-test="signed-by"]').textContent()).toContain('Signed by Priya Raman, EHS coordinator');
    expect(await page.locator('[data-test="compile"]').count()).toBe(0);
    await page.locator('[data-test="revisions"]').getByText('Revision 1').waitFor();
    await screenshot(page, 'period-signed');

    await signIn('auditor@decant.test');
    await page.goto(`${stack.appUrl}/periods/${period.id}`);
    await page.locator('[data-test="signed-by"]').waitFor();
    for (const action of ['compile', 'open-sign', 'open-amend']) expect(await page.locator(`[data-test="${action}"]`).count()).toBe(0);
    await screenshot(page, 'period-signed-auditor');
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
