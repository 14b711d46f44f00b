import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoPassword, demoPeople } from '../../server/db/seed/demo-scenario.js';
import { openBrowser, screenshot } from '../helpers/browser.js';
import { startLiveStack, type LiveStack } from '../helpers/live-stack.js';

// What each role's navigation shows, from the permission table's areas.
const expectedAreas: Record<string, string[]> = {
  administrator: ['Overview', 'Trail', 'Permit and limits', 'People and access'],
  coordinator: [
    'Overview',
    'Lab',
    'Oil log',
    'Shipments',
    'Periods',
    'Reports',
    'Follow-ups',
    'Trail',
    'Tank check',
    'Skimmer fit',
    'Set-up',
  ],
  operator: ['Overview', 'Lab', 'Oil log', 'Shipments', 'Follow-ups', 'Tank check', 'Skimmer fit', 'Permit and limits'],
  auditor: ['Overview', 'Lab', 'Oil log', 'Shipments', 'Periods', 'Reports', 'Follow-ups', 'Trail', 'Permit and limits'],
};

describe('signing in with a browser', () => {
  let stack: LiveStack;
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    stack = await startLiveStack({ withClient: true });
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await stack?.close();
  });

  for (const person of demoPeople) {
    it(`signs ${person.email} in through the provider's page, shows the ${person.role}'s areas, and signs out`, async () => {
      const { page } = browser;
      await page.context().clearCookies();
      await page.goto(`${stack.appUrl}/overview`);
      await page.waitForURL(/\/sign-in/);
      await page.getByText(person.email, { exact: true }).click();
      await page.waitForURL((url) => url.origin === stack.idpUrl);
      expect(await page.inputValue('#email')).toBe(person.email);
      await page.fill('#password', demoPassword);
      await page.click('button[type=submit]');
      await page.waitForURL(`${stack.appUrl}/overview`);
      const areas = page.locator('[data-test="areas"] .v-list-item-title');
      await areas.first().waitFor();
      expect(await areas.allTextContents()).toEqual(expectedAreas[person.role]);
      await page.getByText('Harlow Vale Precision Parts').first().waitFor();
      await screenshot(page, `overview-${person.email.split('@')[0]}`);

      await page.click('[data-test="user-menu"]');
      expect(await page.locator('[data-test="role-chip"]').textContent()).toMatch(/\S/);
      await page.click('[data-test="sign-out"]');
      await page.waitForURL(/\/sign-in\?signed-out=1/);
      await page.getByText('You are signed out.').waitFor();
      const me = await page.request.get(`${stack.appUrl}/api/me`);
      expect(me.status()).toBe(401);
    });
  }

  it('keeps a wrong password on the login page with a message', async () => {
    const { page } = browser;
    await page.context().clearCookies();
    await page.goto(`${stack.appUrl}/sign-in`);
    await page.getByText('coordinator@decant.test', { exact: true }).click();
    await page.waitForURL((url) => url.origin === stack.idpUrl);
    await page.fill('#password', 'not-the-password');
    await page.click('button[type=submit]');
    await page.getByRole('alert').waitFor();
    expect(await page.getByRole('alert').textContent()).toContain('do not match');
    expect(new URL(page.url()).origin).toBe(stack.idpUrl);
    await screenshot(page, 'wrong-password');
    const me = await page.request.get(`${stack.appUrl}/api/me`);
    expect(me.status()).toBe(401);
  });

  it('lets the administrator give a person a role from the people screen', async () => {
    const { page } = browser;
    await page.context().clearCookies();
    await page.goto(`${stack.appUrl}/sign-in`);
    await page.getByText('admin@decant.test', { exact: true }).click();
    await page.fill('#password', demoPassword);
    await page.click('button[type=submit]');
    await page.waitForURL(`${stack.appUrl}/overview`);
    await page.getByText('People and access').click();
    await page.getByText('operator@decant.test').waitFor();
    await screenshot(page, 'people');
    await page.click('[data-test="add-person"]');
    await page.getByRole('textbox', { name: 'E-mail', exact: true }).fill('operator@decant.test');
    await page.getByRole('textbox', { name: 'Name', exact: true }).fill('Duplicate');
    await page.click('[data-test="save-person"]');
    await page.getByText('already registered').waitFor();
    await screenshot(page, 'people-field-error');
  });
});
