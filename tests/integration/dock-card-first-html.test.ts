// The dock opened for one boat (/inspect/<meeting>?race=N, the board's links): the boat's card and its record form
// come in the page's first HTML, for the meeting's scrutineer only; the form is shut (inert) until the page's
// script has started, so nothing typed or tapped before then is lost or sent as a plain form.
// What a scrutineer may open is the app's own rule (DEVELOPERS.md, permissions); the checks here are that nobody
// else gets a card through the page, and that a number with no boat gives the plain dock (common practice: an
// unknown identifier in a link is not an error page).
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { InspectionMeeting, rulesWith, type TestEntry } from '../support/inspection-meeting';

const meeting = new InspectionMeeting();
const otherMeeting = new InspectionMeeting();
let entry: TestEntry;
let otherEntry: TestEntry;

async function as(email: string) {
  const s = new HttpSession();
  await s.signInWithPassword(email, DEMO_PASSWORD);
  return s;
}

before(async () => {
  await meeting.create(`First HTML ${Date.now()}`, [{ email: DEMO.scrutineer, role: 'scrutineer' }]);
  entry = await meeting.addEntry(await meeting.addClass('FH', rulesWith()));
  // A meeting where the demo scrutineer holds no post.
  await otherMeeting.create(`First HTML elsewhere ${Date.now()}`, []);
  otherEntry = await otherMeeting.addEntry(await otherMeeting.addClass('FE', rulesWith()));
});

const hasCard = (html: string) => html.includes('data-testid="boat-card"');

test("the meeting's scrutineer gets the boat's card and a shut form in the first HTML", async () => {
  const res = await (await as(DEMO.scrutineer)).fetch(`/inspect/${meeting.eventId}?race=${entry.raceNumber}`);
  assert.equal(res.status, 200);
  const html = await res.text();
  assert.ok(hasCard(html), 'the card is in the HTML');
  assert.ok(html.includes(entry.boatName), 'with the boat');
  assert.ok(html.includes(`data-entry-id="${entry.id}"`), 'of this entry');
  const form = html.slice(html.indexOf('data-testid="inspection-form"'));
  assert.ok(html.includes('data-testid="inspection-form"'), 'the record form is in the HTML');
  const fieldset = form.match(/<fieldset[^>]*>/)?.[0] ?? '';
  assert.match(fieldset, /\binert=""/, 'its fields are shut (inert) until the script starts');
  assert.match(fieldset, /data-started="no"/);
  assert.ok(html.includes('Record inspection'), 'with its button');
});

test("a scanned tag's link (?tag=) and a repeated word (the first counts, as the screen reads it) give the card too", async () => {
  const s = await as(DEMO.scrutineer);
  const byTag = await s.fetch(`/inspect/${meeting.eventId}?tag=${encodeURIComponent(entry.token)}`);
  assert.equal(byTag.status, 200);
  const tagged = await byTag.text();
  assert.ok(hasCard(tagged) && tagged.includes(`data-entry-id="${entry.id}"`), 'the card by its tag');
  const twice = await s.fetch(`/inspect/${meeting.eventId}?race=${entry.raceNumber}&race=9999`);
  assert.equal(twice.status, 200);
  assert.ok(hasCard(await twice.text()), 'the first race number');
  for (const tag of ['not-a-tag', 'x'.repeat(3000)]) {
    const res = await s.fetch(`/inspect/${meeting.eventId}?tag=${tag}`);
    assert.equal(res.status, 200);
    assert.ok(!hasCard(await res.text()), `no card for tag ${tag.slice(0, 10)}`);
  }
});

test('a number with no boat, or not a number, gives the plain dock (the screen says why)', async () => {
  const s = await as(DEMO.scrutineer);
  for (const race of ['9999', 'abc', '-1', '1'.repeat(200)]) {
    const res = await s.fetch(`/inspect/${meeting.eventId}?race=${encodeURIComponent(race)}`);
    assert.equal(res.status, 200, `race=${race.slice(0, 10)}`);
    assert.ok(!hasCard(await res.text()), `no card for race=${race.slice(0, 10)}`);
  }
});

test('nobody else gets a card through the page: anonymous, an entrant, the scrutineer at a meeting not theirs', async () => {
  const path = `/inspect/${meeting.eventId}?race=${entry.raceNumber}`;
  const anonymous = await new HttpSession().fetch(path);
  assert.ok([303, 307].includes(anonymous.status), `anonymous: ${anonymous.status}`);
  assert.ok(!hasCard(await anonymous.text()));
  const entrant = await (await as(DEMO.entrant)).fetch(path);
  assert.notEqual(entrant.status, 200, `entrant: ${entrant.status}`);
  assert.ok(!hasCard(await entrant.text()));
  const elsewhere = await (
    await as(DEMO.scrutineer)
  ).fetch(`/inspect/${otherMeeting.eventId}?race=${otherEntry.raceNumber}`);
  assert.notEqual(elsewhere.status, 200, `another meeting's dock: ${elsewhere.status}`);
  const body = await elsewhere.text();
  assert.ok(!hasCard(body) && !body.includes(otherEntry.boatName), 'no card of another meeting');
});
