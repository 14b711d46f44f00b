import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoPassword } from '../../server/db/seed/demo-scenario.js';
import { openBrowser, screenshot, signInAs } from '../helpers/browser.js';
import { startLiveStack, type LiveStack } from '../helpers/live-stack.js';

/** Controls that would change a record: buttons named for writing, and inputs of a form that are neither disabled nor read-only. */
async function writeControls(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const writeVerb =
      /^(save|add|record|edit|delete|remove|close follow-up|compile|sign|amend|attach|upload|import|correct|draft notice|keep|fill in|change|send|retire|mark|new|check this tank|record upkeep)/i;
    const visible = (el: Element) => {
      const box = (el as HTMLElement).getBoundingClientRect();
      return box.width > 0 && box.height > 0;
    };
    const found: string[] = [];
    for (const el of Array.from(document.querySelectorAll('main button, main a[role="button"], main .v-btn, [role="dialog"] .v-btn'))) {
      const text = (el.textContent ?? '').trim().replace(/\s+/g, ' ');
      if (!visible(el) || (el as HTMLButtonElement).disabled || el.getAttribute('aria-disabled') === 'true') continue;
      if (writeVerb.test(text)) found.push(`button “${text}”`);
    }
    for (const el of Array.from(
      document.querySelectorAll('main form input, main form textarea, [role="dialog"] form input, [role="dialog"] form textarea'),
    )) {
      const input = el as HTMLInputElement;
      if (input.type === 'hidden' || !visible(input) || input.disabled || input.readOnly) continue;
      found.push(`input “${input.labels?.[0]?.textContent?.trim() ?? input.name ?? input.type}”`);
    }
    return [...new Set(found)];
  });
}

describe('the auditor reads, never writes, on screen', () => {
  let stack: LiveStack;
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  let paths: Array<{ name: string; path: string; open?: string }>;

  beforeAll(async () => {
    stack = await startLiveStack({ withClient: true });
    browser = await openBrowser({ width: 1280, height: 900 });
    const one = async (sql: string) => ((await stack.dataSource.query(sql))[0] as { id: string }).id;
    const north = `(SELECT id FROM site WHERE name = 'Tamsin Creek Works')`;
    const certificate = await one(`SELECT id FROM lab_certificate WHERE site_id = ${north} ORDER BY received_on DESC LIMIT 1`);
    const equipment = await one(`SELECT id FROM equipment WHERE site_id = ${north} ORDER BY name LIMIT 1`);
    const period = await one(
      `SELECT rp.id FROM reporting_period rp JOIN permit p ON p.id = rp.permit_id WHERE p.site_id = ${north} AND rp.ends_on < current_date ORDER BY rp.starts_on DESC LIMIT 1`,
    );
    paths = [
      { name: 'overview', path: '/overview' },
      { name: 'lab', path: '/lab' },
      { name: 'certificate', path: `/lab/certificates/${certificate}` },
      { name: 'oil-log', path: '/oil-log' },
      { name: 'equipment', path: '/oil-log/equipment' },
      { name: 'equipment-detail', path: `/oil-log/equipment/${equipment}` },
      { name: 'shipments', path: '/shipments', open: 'main tbody tr' },
      { name: 'periods', path: '/periods' },
      { name: 'period', path: `/periods/${period}` },
      { name: 'reports', path: '/reports' },
      { name: 'follow-ups', path: '/follow-ups' },
      { name: 'trail', path: '/trail' },
      { name: 'permit-and-limits', path: '/setup' },
    ];
  });
  afterAll(async () => {
    await browser?.close();
    await stack?.close();
  });

  it('finds no enabled write control on any screen the auditor opens, and reaches the permit and its limits from the navigation', async () => {
    const { page } = browser;
    await signInAs(page, stack.appUrl, 'auditor@decant.test', demoPassword, 'Tamsin Creek Works');
    await page.getByRole('navigation', { name: 'Areas' }).getByRole('link', { name: 'Permit and limits' }).click();
    await page.locator('[data-test="site-facts"]').waitFor();
    const found: Record<string, string[]> = {};
    for (const { name, path, open } of paths) {
      await page.goto(`${stack.appUrl}${path}`);
      await page.locator('main h1').first().waitFor();
      await page.waitForLoadState('networkidle');
      if (open) {
        await page.locator(open).first().click();
        await page.locator('[role="dialog"]').first().waitFor();
        await page.waitForLoadState('networkidle');
        await screenshot(page, `auditor-${name}-opened`);
      }
      const controls = await writeControls(page);
      if (controls.length) found[name] = controls;
    }
    expect(found).toEqual({});
  });
});
