import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoPassword } from '../../server/db/seed/demo-scenario.js';
import { findPeriod } from '../../server/features/periods/periods.repository.js';
import { compileWithin } from '../../server/features/periods/periods.service.js';
import { signWithin } from '../../server/features/periods/sign-off.service.js';
import { openBrowser, screenshot, signInAs } from '../helpers/browser.js';
import { startLiveStack, type LiveStack } from '../helpers/live-stack.js';

describe('reports for the auditor', () => {
  let stack: LiveStack;
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  let periodId: string;
  beforeAll(async () => {
    stack = await startLiveStack({ withClient: true });
    browser = await openBrowser({ width: 1400, height: 900 });
    // A finished period of the east site, signed as the demo coordinator would (the second half of 2025: no test writes there).
    const [row] = await stack.dataSource.query(
      `SELECT rp.id FROM reporting_period rp JOIN permit p ON p.id = rp.permit_id JOIN site s ON s.id = p.site_id
        WHERE s.name = 'Orrin Flats Finishing' AND rp.starts_on = '2025-07-01'`,
    );
    periodId = row.id;
    const [coordinator] = await stack.dataSource.query(`SELECT id, email, name FROM app_user WHERE email = 'coordinator@decant.test'`);
    await stack.dataSource.transaction(async (manager) => {
      const summary = await compileWithin(manager, coordinator, periodId);
      await signWithin(manager, coordinator, (await findPeriod(manager, periodId))!, {
        compiledAt: summary.compiledAt,
        statementAccepted: true,
        acknowledged: true,
        acknowledgementNote: null,
        signerName: coordinator.name,
        signerTitle: 'EHS coordinator',
      });
    });
  });
  afterAll(async () => {
    await browser?.close();
    await stack?.close();
  });

  it('lands the auditor on Reports and downloads a signed period’s PDF, the file kept with its signature', async () => {
    const { page } = browser;
    await signInAs(page, stack.appUrl, 'auditor@decant.test', demoPassword, 'Orrin Flats Finishing');
    await page.goto(`${stack.appUrl}/`);
    await page.waitForURL(`${stack.appUrl}/reports`);
    const button = page.locator('[data-test="download-2025-07-01"]');
    await button.waitFor();
    expect(await button.textContent()).toContain('PDF, revision 1');
    await screenshot(page, 'reports-auditor');
    const [download] = await Promise.all([page.waitForEvent('download'), button.click()]);
    const bytes = readFileSync((await download.path())!);
    expect(bytes.subarray(0, 5).toString()).toBe('%PDF-');
    const [{ pack_sha256 }] = await stack.dataSource.query(`SELECT pack_sha256 FROM period_signature WHERE period_id = $1`, [periodId]);
    expect(createHash('sha256').update(bytes).digest('hex')).toBe(pack_sha256);
  });
});
