import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoPassword } from '../../server/db/seed/demo-scenario.js';
import { openFollowUp } from '../../server/features/follow-ups/open-follow-up.js';
import { seriousAccessibilityProblems } from '../helpers/accessibility.js';
import { openBrowser, screenshot, signInAs } from '../helpers/browser.js';
import { startLiveStack, type LiveStack } from '../helpers/live-stack.js';

describe('the notice to the control authority', () => {
  let stack: LiveStack;
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  const title = 'Notify the control authority of the violation: Oil and grease at OF-001, browser test';

  beforeAll(async () => {
    stack = await startLiveStack({ withClient: true });
    browser = await openBrowser({ width: 1400, height: 900 });
    // A violation's notice follow-up as a compile opens it, with the facts of a real demo result.
    const [result] = await stack.dataSource.query(
      `SELECT r.id, p.id AS permit_id, d.site_id FROM lab_result r JOIN lab_sample ls ON ls.id = r.sample_id
         JOIN discharge_point d ON d.id = ls.discharge_point_id JOIN permit p ON p.site_id = d.site_id AND p.number = 'TCU-IU-0417' WHERE d.code = 'OF-001' ORDER BY ls.collected_at DESC LIMIT 1`,
    );
    await stack.dataSource.transaction((manager) =>
      openFollowUp(manager, {
        siteId: result.site_id,
        kind: 'notify-control-authority',
        sourceEntity: 'exceedance',
        sourceId: '00000000-0000-4000-8000-0000000b0a5e',
        title,
        dueAt: new Date(Date.now() + 20 * 3600 * 1000),
        awareAt: new Date(Date.now() - 4 * 3600 * 1000),
        awareSource: 'certificate BT-1 received (browser test)',
        facts: {
          permitId: result.permit_id,
          permitNumber: 'TCU-IU-0417',
          pointCode: 'OF-001',
          parameter: 'Oil and grease (HEM, Method 1664)',
          statistic: 'daily-maximum',
          date: '2026-06-20',
          shownValue: '143',
          limit: 100,
          unit: 'mg/L',
          resultIds: [result.id],
        },
      }),
    );
  });
  afterAll(async () => {
    await browser?.close();
    await stack?.close();
  });

  it('is drafted and sent by the coordinator, and the follow-up shows it sent and closed', async () => {
    const { page } = browser;
    await signInAs(page, stack.appUrl, 'coordinator@decant.test', demoPassword, 'Tamsin Creek Works');
    await page.goto(`${stack.appUrl}/follow-ups`);
    const row = page.locator('tr', { hasText: title });
    await row.locator('[data-test="draft-notice"]').click();
    await page.locator('[data-test="notice-facts"]').waitFor();
    expect(await page.locator('[data-test="notice-facts"]').textContent()).toContain('143 mg/L on 2026-06-20, limit 100 mg/L');
    await page.getByRole('textbox', { name: 'Cause, as far as it is known' }).fill('A coolant sump overflowed into the floor drain');
    await page.getByRole('textbox', { name: 'Corrective action taken or planned' }).fill('Drain sealed; level alarm fitted on the sump');
    await screenshot(page, 'notice-draft');
    expect(await seriousAccessibilityProblems(page, 'notice dialog')).toEqual([]);
    await page.click('[data-test="send-notice"]');
    await page.locator('[data-test="notice-sent"]').waitFor();
    expect(await page.locator('[data-test="notice-sent"]').textContent()).toContain('on time');
    await screenshot(page, 'notice-sent');
    await page.keyboard.press('Escape');
    await page.getByRole('button', { name: 'Done', exact: true }).click();
    const done = page.locator('tr', { hasText: title });
    await done.waitFor();
    expect(await done.textContent()).toMatch(/Notice sent to pretreatment@tamsincreek-utilities\.test on .+, on time/);
    await screenshot(page, 'notice-follow-up-closed');
    const [mail] = await stack.dataSource.query(
      `SELECT recipient, status FROM mail_outbox WHERE recipient = 'pretreatment@tamsincreek-utilities.test' AND event_key LIKE 'notice:%'`,
    );
    expect(mail).toBeDefined();
  });
});
