import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoPassword } from '../../server/db/seed/demo-scenario.js';
import { openFollowUp } from '../../server/features/follow-ups/open-follow-up.js';
import { seriousAccessibilityProblems } from '../helpers/accessibility.js';
import { openBrowser, screenshot, signInAs } from '../helpers/browser.js';
import { startLiveStack, type LiveStack } from '../helpers/live-stack.js';

/** From an oil-and-grease exceedance, the coordinator looks for a cause in the equipment at that point. */
describe('a tank check started from an exceedance', () => {
  let stack: LiveStack;
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  const title = 'Repeat the sampling and submit the result: Oil and grease at OF-001, tools browser test';

  beforeAll(async () => {
    stack = await startLiveStack({ withClient: true });
    browser = await openBrowser({ width: 1400, height: 900 });
    const [site] = await stack.dataSource.query(`SELECT id FROM site WHERE name = 'Tamsin Creek Works'`);
    await stack.dataSource.transaction((manager) =>
      openFollowUp(manager, {
        siteId: site.id,
        kind: 'repeat-sampling',
        sourceEntity: 'exceedance',
        sourceId: '00000000-0000-4000-8000-0000000e0014',
        title,
        dueAt: new Date(Date.now() + 20 * 86_400_000),
        facts: { pointCode: 'OF-001', parameter: 'Oil and grease (HEM, Method 1664)' } as never,
      }),
    );
  });
  afterAll(async () => {
    await browser?.close();
    await stack?.close();
  });

  it('opens the tank check pre-filled from the separator at OF-001, keeps it, and the follow-up shows it as evidence', async () => {
    const { page } = browser;
    await signInAs(page, stack.appUrl, 'coordinator@decant.test', demoPassword, 'Tamsin Creek Works');
    await page.goto(`${stack.appUrl}/follow-ups`);
    await page.locator('tr', { hasText: title }).locator('[data-test="look-for-cause"]').click();
    await page.locator('[data-test="check-for-follow-up"]').waitFor();
    await expect.poll(() => page.getByLabel('Flow through, US gal/min').inputValue()).toBe('30');
    expect(await page.locator('[data-test="check-equipment"]').textContent()).toContain('Coalescing separator OWS-1');
    expect(await page.getByLabel('Water temperature, °F').inputValue()).toBe('50');
    await page.click('[data-test="run-check"]');
    const result = page.locator('[data-test="check-result"]');
    await result.waitFor();
    expect(await result.textContent()).toContain('The water leaves too soon');
    await page.click('[data-test="keep-check"]');
    await page.locator('[data-test="check-kept"]').waitFor();
    expect(await page.locator('[data-test="check-kept"]').textContent()).toContain('as evidence of the follow-up');
    await screenshot(page, 'tank-check-from-follow-up');
    expect(await seriousAccessibilityProblems(page, 'tank check from a follow-up')).toEqual([]);

    await page.goto(`${stack.appUrl}/follow-ups`);
    const row = page.locator('tr', { hasText: title });
    await row.locator('[data-test="tank-check-evidence"]').waitFor();
    expect(await row.locator('[data-test="tank-check-evidence"]').textContent()).toContain('A tank check is kept as evidence');
    const [kept] = await stack.dataSource.query(
      `SELECT tc.verdict, e.name FROM tank_check tc JOIN follow_up f ON f.id = tc.follow_up_id JOIN equipment e ON e.id = tc.equipment_id WHERE f.title = $1`,
      [title],
    );
    expect(kept).toEqual({ verdict: 'too-short', name: 'Coalescing separator OWS-1' });
  });
});
