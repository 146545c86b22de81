// Accessibility checks for browser tests: axe-core (Deque's rules engine, through @axe-core/playwright)
// over the rules tagged for WCAG 2.0, 2.1 and 2.2 levels A and AA. A test fails on any violation axe
// rates serious or critical (axe-core's impact scale: minor, moderate, serious, critical).
import assert from 'node:assert/strict';
import { AxeBuilder } from '@axe-core/playwright';
import type { Page } from 'playwright-core';

/** axe-core's tags for WCAG 2.2 levels A and AA (every 2.0 and 2.1 success criterion is in 2.2). */
export const WCAG_22_AA_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

/** One line per offending element: rule, impact, the element and axe's own explanation. */
function describe(v: { id: string; impact?: string | null; nodes: { target: unknown; failureSummary?: string }[] }) {
  return v.nodes.map(
    (n) => `${v.id} (${v.impact}) at ${JSON.stringify(n.target)}: ${(n.failureSummary ?? '').replace(/\s+/g, ' ')}`,
  );
}

/**
 * The WCAG 2.2 A/AA rules whose outcome depends on colours alone (SC 1.4.3 contrast, SC 1.4.1 links told
 * apart from text by colour): all a change of colour theme on the same page can alter.
 */
export const COLOUR_RULES = ['color-contrast', 'link-in-text-block'];

/**
 * Runs axe on the page as it stands; fails listing every serious or critical violation. `only: 'colour'`
 * runs just the colour rules (for a page already checked in full and then switched to another theme).
 */
export async function expectNoSeriousA11yViolations(
  page: Page,
  where = page.url(),
  { only }: { only?: 'colour' } = {},
) {
  // resultTypes (axe-core API, "Options parameter"): violations keep every offending element; passes, incomplete
  // and inapplicable rules are still listed but with at most one element each, which spares axe the unique
  // selector it would otherwise build for every passing element (most of its time on a long page).
  const builder = new AxeBuilder({ page }).options({ resultTypes: ['violations'] });
  const results = await (
    only === 'colour' ? builder.withRules(COLOUR_RULES) : builder.withTags(WCAG_22_AA_TAGS)
  ).analyze();
  const serious = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  assert.deepEqual(serious.flatMap(describe), [], `axe-core (WCAG 2.2 A/AA) on ${where}`);
  // The run really checked something: a page with no passes means axe never saw it.
  assert.ok(results.passes.length > 0, `axe-core checked nothing on ${where}`);
  return results;
}
