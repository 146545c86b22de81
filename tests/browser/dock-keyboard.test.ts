// Keyboard-only journey through the dock form (WCAG 2.2 SC 2.1.1 Keyboard, 2.4.3 Focus Order,
// 2.4.7 Focus Visible, 4.1.3 Status Messages): from the dock screen, with Tab, arrow keys, typing,
// Space and Enter only (no clicks, no fill()), find a boat by race number, fill the readings, choose
// the uncertainty, tick the safety item, record, and hear the verdict: focus moves to the result,
// which sits in a live region. axe-core checks the form and the verdict on the way.
// Reference decision: ISO 14253-1:2017 zones, 101.93 mm against a 102.00 mm maximum with U 0.05 mm
// conforms (101.93 + 0.05 < 102.00).
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, newContext, PHONE, screenshot, signInWithPassword } from '../support/browser';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { InspectionMeeting, rulesWith, type TestEntry } from '../support/inspection-meeting';

let browser: Browser;
const meeting = new InspectionMeeting();
let entry: TestEntry;

before(async () => {
  browser = await launchBrowser();
  await meeting.create(`Keyboard Reach ${Date.now()}`, [{ email: DEMO.scrutineer, role: 'scrutineer' }]);
  entry = await meeting.addEntry(await meeting.addClass('KB', rulesWith()));
});
after(async () => {
  await browser?.close();
});

const focused = (page: Page) =>
  page.evaluate(() => {
    const el = document.activeElement as HTMLInputElement | null;
    return {
      id: el?.id ?? '',
      tag: el?.tagName ?? '',
      type: el?.type ?? '',
      label: (el?.labels?.[0]?.textContent ?? el?.textContent ?? '').trim(),
      checked: el?.checked ?? false,
      value: el?.value ?? '',
      outline: el ? getComputedStyle(el).outlineStyle : '',
    };
  });

/** Presses Tab until focus is on what `isTarget` recognises; fails after `max` presses (unreachable by keyboard). */
async function tabTo(
  page: Page,
  what: string,
  isTarget: (f: Awaited<ReturnType<typeof focused>>) => boolean,
  max = 80,
) {
  for (let i = 0; i < max; i++) {
    await page.keyboard.press('Tab');
    const f = await focused(page);
    if (isTarget(f)) {
      // SC 2.4.7: the keyboard focus is visible (the app's :focus-visible outline).
      assert.notEqual(f.outline, 'none', `${what} shows where the focus is`);
      return f;
    }
  }
  assert.fail(`${what} was not reached with ${max} presses of Tab`);
}
const byId = (id: string) => (f: { id: string }) => f.id === id;

test('dock form by keyboard only: find, fill, tick, record with Enter, the verdict announced', async () => {
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await signInWithPassword(page, DEMO.scrutineer, DEMO_PASSWORD);
  await page.goto(`/inspect/${meeting.eventId}`);
  await page.locator('h1').first().waitFor();

  await tabTo(page, 'the race number field', (f) => f.label === 'Race number or tag code');
  await page.keyboard.type(String(entry.raceNumber));
  await page.keyboard.press('Enter');
  await page.getByTestId('inspection-form').waitFor();
  await expectNoSeriousA11yViolations(page, 'the dock form');

  for (const [i, mm] of ['101.5', '101.93', '101.8'].entries()) {
    await tabTo(page, `reading ${i + 1}`, byId(`f-nozzle-readings-${i}-diameterMm`));
    await page.keyboard.type(mm);
  }
  // A radio group is one Tab stop; the arrow keys move the choice within it.
  let radio = await tabTo(page, 'the uncertainty choice', (f) => f.type === 'radio');
  for (let i = 0; i < 3 && radio.label !== 'I know U (type it)'; i++) {
    await page.keyboard.press(radio.label.startsWith('Class default') ? 'ArrowUp' : 'ArrowDown');
    radio = await focused(page);
  }
  assert.equal(radio.label, 'I know U (type it)');
  assert.ok(radio.checked, 'the arrow key chose it');
  await tabTo(page, 'U', byId('f-nozzle-expandedUncertaintyMm'));
  await page.keyboard.type('0.05');
  await tabTo(page, 'power', byId('f-power-declaredKw'));
  await page.keyboard.type('220');
  // A closed <select> changes with the arrow keys.
  await tabTo(page, 'power evidence', byId('f-power-evidenceKind'));
  for (let i = 0; i < 6 && !(await focused(page)).value; i++) await page.keyboard.press('ArrowDown');
  assert.notEqual((await focused(page)).value, '', 'an evidence kind chosen');
  const helmet = await tabTo(page, 'the helmet', (f) => f.type === 'checkbox' && /present and working/.test(f.label));
  assert.equal(helmet.checked, false);
  await page.keyboard.press('Space');
  assert.equal((await focused(page)).checked, true, 'Space ticks it');
  await tabTo(page, 'Record inspection', (f) => f.label === 'Record inspection');
  await page.keyboard.press('Enter');

  const verdict = page.getByTestId('verdict');
  await verdict.waitFor();
  assert.equal(await verdict.getAttribute('data-overall'), 'conforms', '101.93 mm with U 0.05 mm: conformity proven');
  // SC 4.1.3: the result reaches a screen reader without moving there by hand: focus moves to it and
  // it sits in a polite live region.
  await page.waitForFunction(() => document.activeElement?.id === 'dock-verdict');
  assert.equal(await page.locator('#dock-verdict').getAttribute('aria-live'), 'polite');
  assert.ok(await verdict.getByRole('note').isVisible(), 'the safety caution is shown with the verdict');
  await expectNoSeriousA11yViolations(page, 'the dock verdict');
  // The next boat is one Tab and Enter away.
  await tabTo(page, 'Next boat', (f) => f.label === 'Next boat');
  await page.keyboard.press('Enter');
  await verdict.waitFor({ state: 'detached' });
  await screenshot(page, 'a11y-dock-keyboard');
  await context.close();
});
