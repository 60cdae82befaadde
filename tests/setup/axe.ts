import AxeBuilder from '@axe-core/playwright';
import type { Page } from 'playwright-core';

// axe-core's rules for WCAG 2.0, 2.1 and 2.2 at levels A and AA (Deque's axe-core rule tags).
const WCAG_AA = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

/** What axe-core finds against WCAG 2.2 AA on the page as it stands, one line per rule. */
export async function wcagViolations(page: Page): Promise<string[]> {
  const results = await new AxeBuilder({ page }).withTags(WCAG_AA).analyze();
  return results.violations.map(
    (violation) =>
      `${violation.id}: ${violation.help} (${violation.nodes.length}×, e.g. ${violation.nodes[0]?.target})`,
  );
}
