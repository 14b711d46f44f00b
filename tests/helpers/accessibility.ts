import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Page } from 'playwright-core';

// Evaluated through the browser's debugging protocol, so the app's CSP (script-src 'self') stays as it is.
const axeSource = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

export interface AxeProblem {
  page: string;
  rule: string;
  impact: string;
  help: string;
  targets: string[];
  details: string[];
}

/** Runs axe-core inside the page (WCAG 2.1 A and AA rules) and answers its serious and critical problems. */
export async function seriousAccessibilityProblems(page: Page, label: string): Promise<AxeProblem[]> {
  await page.evaluate(axeSource);
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (context: Document, options: object) => Promise<{ violations: unknown[] }> } }).axe;
    const result = await axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] } });
    return result.violations as Array<{
      id: string;
      impact: string;
      help: string;
      nodes: Array<{ target: string[]; html: string; failureSummary?: string }>;
    }>;
  });
  return violations
    .filter((violation) => violation.impact === 'serious' || violation.impact === 'critical')
    .map((violation) => ({
      page: label,
      rule: violation.id,
      impact: violation.impact,
      help: violation.help,
      targets: violation.nodes.slice(0, 5).map((node) => node.target.join(' ')),
      details: process.env.A11Y_DEBUG
        ? violation.nodes.slice(0, 2).map((node) => `${node.html.slice(0, 200)} :: ${node.failureSummary}`)
        : [],
    }));
}
