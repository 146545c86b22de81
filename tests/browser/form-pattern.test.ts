// Issue 14, item 3 (one form pattern): every form is a native <form> on React's useActionState whose
// action returns { ok, message?, fieldErrors? }. A route handler's refusal (the one error shape,
// DEVELOPERS.md "Conventions") shows beside its field with a general message above the button; what
// was typed stays (React resets a form after an `action` prop's transition, so the forms submit
// through onSubmit: react.dev, "<form>" reference, "Handle form submission with a Server Function"
// [memory]); the button is disabled while the action runs; no connection is said plainly.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, newContext, screenshot, signInWithPassword, PHONE } from '../support/browser';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { InspectionMeeting, rulesWith } from '../support/inspection-meeting';

let browser: Browser;
const meeting = new InspectionMeeting();

before(async () => {
  browser = await launchBrowser();
  await meeting.create(`Form Pattern Meeting ${Date.now()}`, []);
});
after(async () => {
  await browser?.close();
});

async function organiserOnMeeting(): Promise<Page> {
  const page = await (await newContext(browser, PHONE)).newPage();
  await signInWithPassword(page, DEMO.organiser, DEMO_PASSWORD);
  await page.goto(`/organise/events/${meeting.eventId}`);
  return page;
}

const classCount = async () =>
  Number(
    (await query<{ n: string }>('select count(*) as n from race_classes where event_id = $1', [meeting.eventId]))[0].n,
  );

test('a route handler refuses the new-class form: the error sits beside its field, the summary above the button, nothing typed is lost', async () => {
  const page = await organiserOnMeeting();
  const before = await classCount();
  await page.getByLabel('Class name').fill('X'); // the schema asks for at least 2 characters (server side only here)
  await page.getByLabel('Short code').fill('FP-1');
  await page.getByLabel('Description').fill('Written once, kept through a refusal');
  await page.getByRole('button', { name: 'Add class' }).click();

  const nameError = page.locator('[data-field-error="name"]');
  await nameError.waitFor();
  assert.match(await nameError.innerText(), /at least 2 characters/);
  assert.equal(await page.getByLabel('Class name').getAttribute('aria-invalid'), 'true');
  const form = page.locator('form').filter({ has: page.getByRole('button', { name: 'Add class' }) });
  const message = form.getByTestId('form-message');
  assert.match(await message.innerText(), /Check the fields marked above: nothing was saved yet/);
  assert.equal(await message.getAttribute('aria-live'), 'polite');
  const [m, b, e] = [
    await message.boundingBox(),
    await page.getByRole('button', { name: 'Add class' }).boundingBox(),
    await nameError.boundingBox(),
  ];
  assert.ok(m && b && e && e.y < m.y && m.y < b.y, 'field error, then the summary, then the button');
  assert.equal(await page.getByLabel('Short code').inputValue(), 'FP-1', 'what was typed stays');
  assert.equal(await page.getByLabel('Description').inputValue(), 'Written once, kept through a refusal');
  assert.equal(await page.getByLabel('Class name').inputValue(), 'X');
  assert.equal(await classCount(), before, 'nothing stored for the refused form');
  await screenshot(page, 'form-pattern-refused');
  await page.context().close();
});

test('the button is disabled while the action runs, and a lost connection is said without losing the form', async () => {
  const page = await organiserOnMeeting();
  const before = await classCount();
  await page.getByLabel('Class name').fill('Held Class');
  await page.getByLabel('Short code').fill('FP-2');
  // Hold the request so the pending state can be read, then drop it as a lost signal would.
  let release: () => void = () => {};
  const held = new Promise<void>((r) => {
    release = r;
  });
  await page.route(`**/api/events/${meeting.eventId}/classes`, async (route) => {
    await held;
    await route.abort('internetdisconnected');
  });
  await page.getByRole('button', { name: 'Add class' }).click();
  const busy = page.getByRole('button', { name: 'Adding…' });
  await busy.waitFor();
  assert.ok(await busy.isDisabled(), 'disabled while pending');
  release();
  const message = page
    .locator('form')
    .filter({ has: page.getByRole('button', { name: 'Add class' }) })
    .getByTestId('form-message');
  await message.filter({ hasText: /\S/ }).waitFor();
  assert.equal(await message.innerText(), 'No connection to the server: nothing was saved. Try again.');
  assert.equal(await page.getByLabel('Class name').inputValue(), 'Held Class');
  assert.equal(await page.getByLabel('Short code').inputValue(), 'FP-2');
  assert.ok(await page.getByRole('button', { name: 'Add class' }).isEnabled());
  assert.equal(await classCount(), before);

  // The connection returns: the same form, untouched, goes through.
  await page.unroute(`**/api/events/${meeting.eventId}/classes`);
  await page.getByRole('button', { name: 'Add class' }).click();
  await page.waitForURL(/\/classes\/[0-9a-f-]{36}$/);
  assert.equal(await classCount(), before + 1);
  await page.context().close();
});

test('confirm-step buttons are forms too: the entrant withdraws an unpaid entry; the organiser cancels one with a reason', async () => {
  const classId = await meeting.addClass('FPW', rulesWith());
  const [toWithdraw, toCancel] = [await meeting.addEntry(classId), await meeting.addEntry(classId)];
  await query(`update entries set status = 'awaiting_payment', paid_at = null where id = any($1::uuid[])`, [
    [toWithdraw.id, toCancel.id],
  ]);
  const statusOf = async (id: string) =>
    (
      await query<{ status: string; cancelled_reason: string | null }>(
        'select status, cancelled_reason from entries where id = $1',
        [id],
      )
    )[0];

  const entrant = await (await newContext(browser, PHONE)).newPage();
  await signInWithPassword(entrant, DEMO.entrant, DEMO_PASSWORD);
  await entrant.goto('/entries');
  const card = entrant.locator(`li[data-entry-id="${toWithdraw.id}"]`);
  await card.getByRole('button', { name: 'Withdraw' }).click();
  await card
    .getByRole('alertdialog', { name: 'Withdraw this entry?' })
    .getByRole('button', { name: 'Yes, withdraw' })
    .click();
  await card.getByTestId('entry-status').filter({ hasText: 'Withdrawn' }).waitFor();
  assert.equal((await statusOf(toWithdraw.id)).status, 'withdrawn');
  await entrant.context().close();

  const organiser = await (await newContext(browser, PHONE)).newPage();
  await signInWithPassword(organiser, DEMO.organiser, DEMO_PASSWORD);
  await organiser.goto(`/organise/events/${meeting.eventId}/entries`);
  const row = organiser.getByTestId('entries-table').locator('tr').filter({ hasText: toCancel.boatName });
  organiser.once('dialog', (d) => void d.accept('Hull does not match the declaration'));
  await row.getByRole('button', { name: 'Cancel' }).click();
  await row.filter({ hasText: 'Cancelled' }).waitFor();
  assert.deepEqual(await statusOf(toCancel.id), {
    status: 'cancelled',
    cancelled_reason: 'Hull does not match the declaration',
  });
  await organiser.context().close();
});
