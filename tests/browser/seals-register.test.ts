// The seal register screen: the organiser issues a batch through the form, finds a seal by number and
// opens its history; a batch that overlaps numbers already in the register is refused with the
// clashing numbers named. The numbers are invented for this test.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { randomBytes } from 'node:crypto';
import type { Browser } from 'playwright-core';
import { launchBrowser, newContext, screenshot, signInWithPassword } from '../support/browser';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { InspectionMeeting } from '../support/inspection-meeting';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

test('register: issue a batch, find a seal, open its history; an overlapping batch names the clashes', async () => {
  const meeting = await new InspectionMeeting().create(`Seal Register Meeting ${Date.now()}`, []);
  const prefix = `R${randomBytes(3).toString('hex').toUpperCase()}-`;
  const context = await newContext(browser);
  const page = await context.newPage();
  await signInWithPassword(page, DEMO.organiser, DEMO_PASSWORD);
  await page.goto(`/inspect/${meeting.eventId}/board`);
  await page.getByRole('link', { name: 'Seals', exact: true }).click();
  await page.waitForURL(`**/inspect/${meeting.eventId}/seals`);
  await page.getByRole('heading', { name: 'Seal register' }).waitFor();

  const issue = async (first: string, last: string) => {
    await page.getByLabel('Prefix').fill(prefix);
    await page.getByLabel('First number').fill(first);
    await page.getByLabel('Last number').fill(last);
    await page.getByRole('button', { name: 'Issue the batch' }).click();
  };
  await issue('1', '12');
  await page.getByTestId('seal-batches').getByText(`${prefix}01 – ${prefix}12`).waitFor();
  assert.match(await page.getByTestId('seal-batches').innerText(), /12 seals, 0 used/);

  await issue('10', '14');
  const message = page.getByTestId('form-message');
  await message.getByText(/already in the register/).waitFor();
  assert.match(await message.innerText(), new RegExp(`${prefix}10, ${prefix}11, ${prefix}12`));

  await page.getByLabel('Find by number').fill(`${prefix}07`);
  await page.getByRole('button', { name: 'Find', exact: true }).click();
  const row = page.getByTestId('seal-list').locator(`[data-seal="${prefix}07"]`);
  await row.waitFor();
  assert.equal(await page.getByTestId('seal-list').locator('tbody tr').count(), 1, 'only the seal searched for');
  assert.match(await row.innerText(), /Unused/);
  await row.getByRole('link', { name: `${prefix}07` }).click();
  const history = page.getByTestId('seal-history');
  await history.waitFor();
  assert.match(await history.innerText(), /Unused: nothing recorded yet/);
  await screenshot(page, 'seals-register');
  await context.close();
});
