// A chart that comes into view is drawn in the same commit that puts its container on the page (WhenVisible
// measures the box and components/fitted-chart.tsx starts recharts' ResponsiveContainer at that size), instead of
// an empty container first and the drawing in a second, ordinary update once the container has measured itself.
// Seen from the page with a MutationObserver (DOM Standard, "Interface MutationObserver": its callback runs after
// each batch of changes, so a container inserted empty and filled by a later render is seen empty first).
// recharts' class names (recharts-responsive-container, recharts-surface) are the library's documented markup.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser } from 'playwright-core';
import { launchBrowser, newContext, PHONE } from '../support/browser';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

test('the calculator chart: its container arrives with the drawing already in it, at the box size', async () => {
  const context = await newContext(browser, PHONE);
  await context.addInitScript(() => {
    const seen: { hadSurface: boolean; width: number }[] = [];
    (window as unknown as { chartContainersSeen: typeof seen }).chartContainersSeen = seen;
    new MutationObserver((records) => {
      for (const r of records)
        for (const n of r.addedNodes) {
          if (!(n instanceof Element)) continue;
          const containers = n.matches('.recharts-responsive-container')
            ? [n]
            : [...n.querySelectorAll('.recharts-responsive-container')];
          for (const c of containers)
            seen.push({
              hadSurface: c.querySelector('.recharts-wrapper > svg.recharts-surface') !== null,
              width: Number(c.querySelector('.recharts-wrapper > svg.recharts-surface')?.getAttribute('width') ?? 0),
            });
        }
    }).observe(document, { childList: true, subtree: true });
  });
  const page = await context.newPage();
  await page.goto('/calculator');
  const setup = page.getByRole('group', { name: 'Set-up 1' });
  await setup.getByLabel('Shaft power', { exact: true }).fill('300');
  await setup.getByLabel('Power unit').selectOption('kW');
  await setup.getByLabel('Nozzle exit diameter', { exact: true }).fill('100');
  await setup.getByLabel('Nozzle diameter unit').selectOption('mm');
  const chart = page.getByTestId('thrust-chart');
  await chart.scrollIntoViewIfNeeded();
  await chart.locator('.recharts-wrapper > svg.recharts-surface').waitFor();
  await chart.locator('path.recharts-line-curve').first().waitFor();

  const seen = await page.evaluate(
    () => (window as unknown as { chartContainersSeen: { hadSurface: boolean; width: number }[] }).chartContainersSeen,
  );
  const boxWidth = Math.round((await chart.boundingBox())!.width);
  assert.ok(seen.length >= 1, 'the chart container was added while the page was watched');
  assert.deepEqual(
    seen.map((s) => s.hadSurface),
    seen.map(() => true),
    `every chart container arrived with its drawing (${JSON.stringify(seen)})`,
  );
  assert.equal(seen[0].width, boxWidth, 'drawn at the width of its box');
  await context.close();
});
