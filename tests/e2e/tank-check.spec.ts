import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoPassword } from '../../server/db/seed/demo-scenario.js';
import { seriousAccessibilityProblems } from '../helpers/accessibility.js';
import { openBrowser, screenshot, signInAs } from '../helpers/browser.js';
import { startLiveStack, type LiveStack } from '../helpers/live-stack.js';

describe('the tank check on screen', () => {
  let stack: LiveStack;
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    stack = await startLiveStack({ withClient: true });
    browser = await openBrowser({ width: 390, height: 844 });
  });
  afterAll(async () => {
    await browser?.close();
    await stack?.close();
  });

  it('lets the operator check a sump on the phone, in US units, and says it is an estimate', async () => {
    const { page } = browser;
    await signInAs(page, stack.appUrl, 'operator@decant.test', demoPassword);
    await page.goto(`${stack.appUrl}/tools/tank-check`);
    await page.locator('[data-test="estimate-caution"]').waitFor();
    await page.getByRole('button', { name: 'US units' }).click();
    await page.getByLabel('Length, ft').fill('6');
    await page.getByLabel('Width, ft').fill('3');
    await page.getByLabel('Working depth, ft').fill('3');
    await page.getByLabel('Flow through, US gal/min').fill('60');
    await page.getByLabel('Water temperature, °F').fill('60');
    await page.click('[data-test="run-check"]');
    const result = page.locator('[data-test="check-result"]');
    await result.waitFor();
    const text = (await result.textContent()) ?? '';
    expect(text).toContain('The water leaves too soon');
    expect(text).toMatch(/Oil of 150 µm needs \d+ min to surface; water stays \d+ min — too short/);
    expect(text).toContain('A smaller flow: at most');
    expect(text).toContain('does not replace a licensed engineer');
    expect(await page.locator('[data-test="estimate-caution"]').textContent()).toContain('lockout and confined-space rules');
    await result.scrollIntoViewIfNeeded();
    await screenshot(page, 'tank-check-phone');
    expect(await seriousAccessibilityProblems(page, 'tank check with a result (phone)')).toEqual([]);
  });
});
