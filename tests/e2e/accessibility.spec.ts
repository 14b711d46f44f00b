import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoPassword } from '../../server/db/seed/demo-scenario.js';
import { seriousAccessibilityProblems, type AxeProblem } from '../helpers/accessibility.js';
import { openBrowser, screenshot, signInAs } from '../helpers/browser.js';
import { startLiveStack, type LiveStack } from '../helpers/live-stack.js';

// Every screen, read by axe-core in both themes at desk and phone width. A screen that is not
// listed here has not been checked.
const widths = { desk: { width: 1280, height: 800 }, phone: { width: 390, height: 844 } } as const;
const themes = ['decantLight', 'decantDark'] as const;

const people = ['coordinator@decant.test', 'operator@decant.test', 'auditor@decant.test', 'admin@decant.test'];

describe('accessibility of every screen (axe-core, WCAG 2.1 AA: no serious or critical problem)', () => {
  let stack: LiveStack;
  let paths: Array<{ name: string; path: string; as: string; click?: { button: string; shows: string } }>;

  beforeAll(async () => {
    stack = await startLiveStack({ withClient: true });
    const [period] = await stack.dataSource.query(
      `SELECT rp.id FROM reporting_period rp JOIN permit p ON p.id = rp.permit_id JOIN site s ON s.id = p.site_id
        WHERE s.name = 'Orrin Flats Finishing' AND rp.starts_on <= current_date ORDER BY rp.starts_on DESC LIMIT 1`,
    );
    const [finished] = await stack.dataSource.query(
      `SELECT rp.id FROM reporting_period rp JOIN permit p ON p.id = rp.permit_id JOIN site s ON s.id = p.site_id
        WHERE s.name = 'Orrin Flats Finishing' AND rp.ends_on < current_date ORDER BY rp.starts_on DESC LIMIT 1`,
    );
    const [certificate] = await stack.dataSource.query(
      `SELECT c.id FROM lab_certificate c JOIN site s ON s.id = c.site_id WHERE s.name = 'Orrin Flats Finishing' ORDER BY c.received_on DESC LIMIT 1`,
    );
    const [equipment] = await stack.dataSource.query(
      `SELECT e.id FROM equipment e JOIN site s ON s.id = e.site_id WHERE s.name = 'Orrin Flats Finishing' ORDER BY e.name LIMIT 1`,
    );
    const coordinator = 'coordinator@decant.test';
    paths = [
      { name: 'overview', path: '/overview', as: coordinator },
      { name: 'lab', path: '/lab', as: coordinator },
      { name: 'certificate', path: `/lab/certificates/${certificate.id}`, as: coordinator },
      { name: 'certificate-form', path: '/lab/certificates/new', as: coordinator },
      { name: 'lab-import', path: '/lab/import', as: coordinator },
      { name: 'oil-log', path: '/oil-log', as: 'operator@decant.test' },
      { name: 'equipment', path: '/oil-log/equipment', as: coordinator },
      { name: 'equipment-detail', path: `/oil-log/equipment/${equipment.id}`, as: coordinator },
      { name: 'upkeep-check', path: `/oil-log/equipment/${equipment.id}/upkeep`, as: 'operator@decant.test' },
      { name: 'application-sheet', path: `/oil-log/equipment/${equipment.id}/sheet`, as: 'operator@decant.test' },
      { name: 'equipment-detail-auditor', path: `/oil-log/equipment/${equipment.id}`, as: 'auditor@decant.test' },
      { name: 'tank-check-prefilled', path: `/tools/tank-check?equipmentId=${equipment.id}`, as: coordinator },
      { name: 'shipments', path: '/shipments', as: coordinator },
      { name: 'periods', path: '/periods', as: coordinator },
      { name: 'period', path: `/periods/${period.id}`, as: coordinator },
      {
        name: 'period-sign',
        path: `/periods/${finished.id}`,
        as: coordinator,
        click: { button: '[data-test="open-sign"]', shows: '[data-test="statement"]' },
      },
      { name: 'flow-readings', path: '/periods/flow-readings', as: coordinator },
      { name: 'reports', path: '/reports', as: 'auditor@decant.test' },
      { name: 'follow-ups', path: '/follow-ups', as: coordinator },
      { name: 'mail', path: '/mail', as: coordinator },
      { name: 'tank-check', path: '/tools/tank-check', as: 'operator@decant.test' },
      { name: 'skimmer-fit', path: '/tools/skimmer-fit', as: coordinator },
      { name: 'setup', path: '/setup', as: coordinator },
      {
        name: 'limit-version',
        path: '/setup',
        as: coordinator,
        click: { button: '[data-test="change-limit"]', shows: '[data-test="version-day"]' },
      },
      {
        name: 'trail',
        path: '/trail',
        as: 'auditor@decant.test',
        click: { button: '[data-test="verify-chain"]', shows: '[data-test="chain-result"]' },
      },
      { name: 'people', path: '/setup/people', as: 'admin@decant.test' },
      {
        name: 'add-site',
        path: '/setup',
        as: coordinator,
        click: { button: '[data-test="add-site"]', shows: '[data-test="save-new-site"]' },
      },
      {
        name: 'equipment-form',
        path: '/oil-log/equipment',
        as: coordinator,
        click: { button: '[data-test="add-equipment"]', shows: '[role="dialog"] .v-card-title' },
      },
      {
        name: 'shipment-form',
        path: '/shipments',
        as: 'operator@decant.test',
        click: { button: '[data-test="add-shipment"]', shows: '[data-test="new-shipment-scan"]' },
      },
      {
        name: 'opening-balance',
        path: '/overview',
        as: coordinator,
        click: { button: '[data-test="set-opening-balance"]', shows: '[role="dialog"] .v-card-title' },
      },
      { name: 'permit-and-limits-auditor', path: '/setup', as: 'auditor@decant.test' },
      {
        name: 'shipment-auditor',
        path: '/shipments',
        as: 'auditor@decant.test',
        click: { button: 'main tbody tr', shows: '[data-test="shipment-facts"]' },
      },
      {
        name: 'lab-import-codes',
        path: '/lab/import',
        as: coordinator,
        click: { button: '[data-test="import-codes"] button', shows: '[data-test="import-codes"] code >> nth=0' },
      },
    ];
  });
  afterAll(async () => {
    await stack?.close();
  });

  for (const [widthName, viewport] of Object.entries(widths)) {
    it(`finds nothing serious at ${widthName} width, in both themes`, async () => {
      const browser = await openBrowser(viewport);
      const problems: AxeProblem[] = [];
      try {
        let signedInAs = '';
        // One sign-in per person, not per screen: the app allows 15 sign-ins per 5 minutes from one address.
        const byPerson = [...paths].sort((a, b) => people.indexOf(a.as) - people.indexOf(b.as));
        for (const screen of byPerson.filter((entry) => !process.env.A11Y_ONLY || process.env.A11Y_ONLY.split(',').includes(entry.name))) {
          if (screen.as !== signedInAs) {
            await signInAs(browser.page, stack.appUrl, screen.as, demoPassword);
            signedInAs = screen.as;
          }
          for (const theme of themes) {
            await browser.page.evaluate((name) => localStorage.setItem('decant.theme', name), theme);
            await browser.page.goto(`${stack.appUrl}${screen.path}`);
            await browser.page.locator('main h1').first().waitFor();
            await browser.page.waitForLoadState('networkidle');
            if (screen.click) {
              await browser.page.click(screen.click.button);
              await browser.page.locator(screen.click.shows).waitFor();
            }
            await screenshot(browser.page, `a11y-${screen.name}-${widthName}-${theme === 'decantDark' ? 'dark' : 'light'}`);
            problems.push(...(await seriousAccessibilityProblems(browser.page, `${screen.name} (${widthName}, ${theme})`)));
          }
        }
      } finally {
        await browser.close();
      }
      for (const problem of problems)
        console.log(`axe: ${problem.page} ${problem.rule} ${problem.targets.join(' | ')}\n${problem.details.join('\n')}`);
      expect(problems).toEqual([]);
    }, 300_000);
  }
});
