import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoPassword } from '../../server/db/seed/demo-scenario.js';
import { tinyPdf } from '../fixtures/lab.js';
import { openBrowser, screenshot, signInAs } from '../helpers/browser.js';
import { startLiveStack, type LiveStack } from '../helpers/live-stack.js';

describe('the oil log on a phone, and shipments', () => {
  let stack: LiveStack;
  let phone: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    stack = await startLiveStack({ withClient: true });
    phone = await openBrowser({ width: 390, height: 844 });
  });
  afterAll(async () => {
    await phone?.close();
    await stack?.close();
  });

  const signIn = (email: string) => signInAs(phone.page, stack.appUrl, email, demoPassword);

  it('lands the operator on the oil log and saves an entry in one screen', async () => {
    const { page } = phone;
    await signIn('operator@decant.test');
    await page.waitForURL(`${stack.appUrl}/oil-log`);
    await page.locator('[data-test="recent-entries"]').waitFor();
    const before = (await stack.dataSource.query('SELECT count(*)::int AS n FROM oil_log_entry'))[0].n;
    await page.fill('[data-test="oil-volume"] input', '2.4');
    await screenshot(page, 'phone-oil-log');
    await page.click('[data-test="save-oil"]');
    await page.getByText('Saved').first().waitFor();
    const after = (await stack.dataSource.query('SELECT count(*)::int AS n FROM oil_log_entry'))[0].n;
    expect(after).toBe(before + 1);
    const [entry] = await stack.dataSource.query('SELECT entered_volume, entered_unit FROM oil_log_entry ORDER BY created_at DESC LIMIT 1');
    expect([Number(entry.entered_volume), entry.entered_unit]).toEqual([2.4, 'gal']);
    // Nothing wider than the phone: a gloved thumb never scrolls sideways.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await screenshot(page, 'phone-oil-log-saved');
  });

  it('lets the operator record a shipment with its scan in one dialog on the phone', async () => {
    const { page } = phone;
    await page.goto(`${stack.appUrl}/shipments`);
    await page.click('[data-test="add-shipment"]');
    const dialog = page.getByRole('dialog');
    const number = `${100000000 + Math.floor(Math.random() * 800000000)}QZD`;
    await dialog.getByLabel('Document number').fill(number);
    await dialog.getByLabel('Transporter', { exact: true }).fill('Kestrel Fluid Haulers');
    await dialog.getByLabel('Transporter EPA ID').fill('ZZR000417233');
    await dialog.getByLabel('Receiving facility').fill('Marrowby Oil Recovery');
    await dialog.getByLabel('Facility EPA ID').fill('ZZD000982114');
    await dialog.getByLabel('Quantity', { exact: true }).fill('110');
    await dialog.locator('[data-test="new-shipment-scan"] input[type="file"]').setInputFiles({
      name: 'manifest.pdf',
      mimeType: 'application/pdf',
      buffer: tinyPdf,
    });
    await screenshot(page, 'phone-shipment-with-scan');
    await page.click('[data-test="save-shipment"]');
    await page.getByText('Shipment saved with its scan').first().waitFor();
    const [saved] = await stack.dataSource.query(
      `SELECT count(sf.file_id)::int AS scans FROM shipment s LEFT JOIN shipment_file sf ON sf.shipment_id = s.id WHERE s.document_number = $1 GROUP BY s.id`,
      [number],
    );
    expect(saved.scans).toBe(1);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  });

  it('shows the coordinator the overdue exception report of the shipment whose signed copy never came back', async () => {
    const { page } = phone;
    await page.setViewportSize({ width: 1400, height: 900 });
    await signIn('coordinator@decant.test');
    await page.waitForURL(`${stack.appUrl}/overview`);
    await page.goto(`${stack.appUrl}/shipments`);
    // The demo's north site is a large quantity generator: switch to it.
    await page.locator('.v-app-bar .v-select').click();
    await page.getByRole('option', { name: 'Tamsin Creek Works' }).click();
    await page.getByRole('button', { name: 'Overdue' }).click();
    await page
      .getByText(/Exception report: \d+ days overdue/)
      .first()
      .waitFor();
    await screenshot(page, 'shipments-overdue');
  });
});
