// Series through the real HTTP API, the database and the mail fake (issue 22, items 3-5): a series of three
// rounds (three meetings in date order), points with a dropped round and a tie worked by hand, a stewards'
// penalty amending a round's results and so the standings, a technical bulletin reaching every entrant of
// the class, season numbers unique per class, the parity history across three rounds with a rule change
// between the second and third, and the exports. The points rule (points per place, lowest round dropped,
// points deducted after the drops, ties by count-back then the latest round) is common practice in
// motorsport series (no single source); places deducted moving a boat down is common practice in motorsport
// codes (no single source). Spread and coefficient of variation are checked against simple-statistics 7.12.1.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';
import * as ss from 'simple-statistics';
import { HttpSession } from '../support/http-session';
import { BASE_URL, DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { newPerson, type Person } from '../support/people';
import { firstLink, waitForMail } from '../support/mail';
import { extractPdfText } from '../support/pdf-text';

const CLUB = '0b0e0000-0000-4000-8000-000000000001'; // the demo club: the demo organiser organises for it
const PW = 'series-test-password';
const tag = randomUUID().slice(0, 6);
const RULES = {
  nozzle: { maxMm: 102, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 },
  power: { minKw: 150, maxKw: 300, defaultUncertaintyKw: 6 },
  weight: { minKg: null, includesDriver: true, defaultUncertaintyKg: 1 },
  decisionRule: 'iso14253',
  safetyItems: [],
  parity: {
    pumpEfficiency: 0.9,
    nozzleLossCoefficient: 0.02,
    inletLossCoefficient: 0.2,
    wakeFraction: 0,
    referenceSpeedsMs: [10],
  },
};

type Round = { eventId: string; classId: string; ruleVersionId: string; date: string; entries: Map<string, string> };
let secretary: HttpSession; // the demo organiser, who starts the series
let organiser: HttpSession;
let steward: HttpSession;
let chief: HttpSession;
let seriesSteward: Person;
let outsider: Person;
let seriesId: string;
let classId: string; // the series class
const owners: Person[] = [];
const boats: { id: string; name: string }[] = []; // W, X, Y, Z
const rounds: Round[] = [];

const person = (prefix: string) => newPerson(prefix, PW);
const signIn = async (email: string) => {
  const s = new HttpSession();
  assert.equal((await s.signInWithPassword(email, DEMO_PASSWORD)).status, 200, email);
  return s;
};
const userId = async (email: string) =>
  (await query<{ id: string }>('select id from users where email = $1', [email]))[0].id;
const S = () => `/api/series/${seriesId}`;
const C = () => `${S()}/classes/${classId}`;

/** A meeting of the demo club on `date` with one class (rules published through the API), the four boats entered. */
async function addRound(date: string, n: number): Promise<Round> {
  const [ev] = await query<{ id: string }>(
    `insert into events (organisation_id, name, slug, venue, starts_on, ends_on, time_zone, status)
     values ($1, $2, $3, 'Test Reach', $4, $4, 'UTC', 'racing') returning id`,
    [CLUB, `Series round ${n} ${tag}`, `series-${tag}-${n}`, date],
  );
  const staff = [
    [await userId(DEMO.organiser), 'organiser'],
    [await userId(DEMO.steward), 'steward'],
    [await userId(DEMO.chief), 'chief_scrutineer'],
  ];
  for (const [u, role] of staff)
    await query('insert into event_staff (event_id, user_id, role) values ($1, $2, $3)', [ev.id, u, role]);
  const cls = await organiser.json(`/api/events/${ev.id}/classes`, { name: `Series class ${n}`, code: `SR${n}` });
  assert.equal(cls.res.status, 201, JSON.stringify(cls.body));
  const cid = cls.body.data.id as string;
  await organiser.json(`/api/events/${ev.id}/classes/${cid}/rules`, { powerUnit: 'kW', rules: RULES }, 'PUT');
  const pub = await organiser.json(`/api/events/${ev.id}/classes/${cid}/rules/publish`, {
    changeNote: 'test',
    effectiveFrom: new Date(Date.now() - 86_400_000).toISOString(),
  });
  assert.equal(pub.res.status, 201, JSON.stringify(pub.body));
  const entries = new Map<string, string>();
  for (const [i, b] of boats.entries()) {
    const [e] = await query<{ id: string }>(
      `insert into entries (event_id, class_id, boat_id, entrant_id, race_number, status, fee_minor, currency)
       values ($1, $2, $3, $4, $5, 'entered', 0, 'NZD') returning id`,
      [ev.id, cid, b.id, owners[i].id, 11 * (i + 1)],
    );
    entries.set(b.id, e.id);
  }
  return { eventId: ev.id, classId: cid, ruleVersionId: pub.body.data.id, date, entries };
}

/** Publishes the organiser's results of a round: boats by index in finishing order (race numbers 11, 22, 33, 44). */
async function publishResults(r: Round, order: number[]) {
  const res = await organiser.json(`/api/events/${r.eventId}/results`, {
    classId: r.classId,
    rows: order.map((b, i) => ({ position: i + 1, raceNumber: 11 * (b + 1) })),
  });
  assert.equal(res.res.status, 201, JSON.stringify(res.body));
}

/** The stewards' penalty from a technical report, from a catalogue item of the round's meeting. */
async function penalise(r: Round, boat: number, kind: string, amount: number) {
  const item = await organiser.json(`/api/events/${r.eventId}/penalty-catalogue`, {
    code: `${kind === 'places_deducted' ? 'P' : 'D'}${amount}-${randomUUID().slice(0, 4)}`,
    kind,
    amount,
    label: `${kind.replace('_', ' ')} ${amount}`,
  });
  assert.equal(item.res.status, 201, JSON.stringify(item.body));
  const entryId = r.entries.get(boats[boat].id)!;
  const report = await chief.json(`/api/events/${r.eventId}/technical-reports`, {
    entryId,
    ruleReference: 'SR 2.1 nozzle exit maximum',
    facts: 'Nozzle exit measured over the class maximum at the post-race check.',
  });
  assert.equal(report.res.status, 201, JSON.stringify(report.body));
  const pen = await steward.json(`/api/events/${r.eventId}/penalties`, {
    entryId,
    catalogueItemId: item.body.data.id,
    technicalReportId: report.body.data.id,
    reason: 'Nozzle exit over the class maximum at the post-race check (SR 2.1).',
  });
  assert.equal(pen.res.status, 201, JSON.stringify(pen.body));
}

async function addInspection(r: Round, boat: number, readings: number[]) {
  const entryId = r.entries.get(boats[boat].id)!;
  await query(
    `insert into inspections (event_id, entry_id, boat_id, class_id, rule_version_id, recorded_by_id, idempotency_key, captured_at, measurements, results, overall_result)
     values ($1, $2, $3, $4, $5, $6, $7, now(), $8, $9, 'conforms')`,
    [
      r.eventId,
      entryId,
      boats[boat].id,
      r.classId,
      r.ruleVersionId,
      await userId(DEMO.chief),
      randomUUID(),
      JSON.stringify({
        nozzle: { readings: readings.map((d, i) => ({ diameterMm: d, angleDeg: i * 60 })) },
        power: { evidenceSeen: true },
      }),
      JSON.stringify([{ rule: 'nozzle_max', expandedUncertainty: 0.05, verdict: 'conforms' }]),
    ],
  );
}

const standings = async (s: HttpSession = new HttpSession()) => {
  const res = await s.fetch(`${C()}/standings`);
  assert.equal(res.status, 200);
  return (await res.json()).data as {
    rounds: { resultsVersion: number | null }[];
    competitors: Record<string, { boatName: string; seasonNumber: number | null }>;
    after: { rows: { competitorId: string; position: number; total: number; pointsDeducted: number }[] }[];
    penaltiesByBoat: Record<string, unknown[]>;
    tieRule: string;
  };
};
const table = (rows: { competitorId: string; position: number; total: number }[]) =>
  rows.map((r) => `${r.position} ${'WXYZ'[boats.findIndex((b) => b.id === r.competitorId)]} ${r.total}`);

before(async () => {
  [secretary, organiser, steward, chief] = await Promise.all(
    [DEMO.organiser, DEMO.organiser, DEMO.steward, DEMO.chief].map(signIn),
  );
  seriesSteward = await person('series-steward');
  outsider = await person('series-outsider');
  for (const [i, name] of ['W', 'X', 'Y', 'Z'].entries()) {
    owners.push(await person(`series-owner-${name.toLowerCase()}`));
    const [b] = await query<{ id: string }>(
      `insert into boats (owner_id, name, declared_nozzle_mm, declared_power_kw) values ($1, $2, 101, $3) returning id`,
      [owners[i].id, `Series ${name} ${tag}`, [240, 255, 230, 262][i]],
    );
    boats.push({ id: b.id, name: `Series ${name} ${tag}` });
  }
  const made = await secretary.json('/api/series', {
    name: `Test Cup ${tag}`,
    season: 2027,
    organisationIds: [CLUB],
  });
  assert.equal(made.res.status, 201, JSON.stringify(made.body));
  seriesId = made.body.data.id;
  // Appointing is an invitation to the address; the steward holds the role once they accept it.
  const off = await secretary.json(`${S()}/officials`, { email: seriesSteward.email, role: 'series_steward' });
  assert.equal(off.res.status, 201, JSON.stringify(off.body));
  const invitation = await waitForMail(seriesSteward.email, { subject: new RegExp(`invited to Test Cup ${tag}`) });
  const token = new URL(firstLink(invitation)).pathname.split('/').pop()!;
  assert.equal((await new HttpSession().acceptInvitation(token)).status, 200);
  const cls = await secretary.json(`${S()}/classes`, {
    code: 'SR',
    name: 'Series Runabout',
    pointsByPosition: [20, 15, 12, 10],
    droppedRounds: 1,
  });
  assert.equal(cls.res.status, 201, JSON.stringify(cls.body));
  classId = cls.body.data.id;
  // Listed out of date order on purpose: rounds are the meetings in date order.
  for (const [n, date] of [
    [2, '2027-02-14'],
    [1, '2027-01-10'],
    [3, '2027-03-07'],
  ] as const)
    rounds[n - 1] = await addRound(date, n);
  for (const r of rounds) {
    const link = await secretary.json(`${C()}/rounds`, { classId: r.classId });
    assert.equal(link.res.status, 201, JSON.stringify(link.body));
  }
});

test('points with a dropped round and a tie by count-back; a penalty amends the round results and the standings', async () => {
  // Table 20, 15, 12, 10 points for 1st to 4th; one round dropped (after n rounds, min(1, n - 1)).
  // R1: W X Y Z. R2: X W Z Y. R3 as the organiser published it: W Y X Z.
  await publishResults(rounds[0], [0, 1, 2, 3]);
  await publishResults(rounds[1], [1, 0, 3, 2]);
  await publishResults(rounds[2], [0, 2, 1, 3]);
  const before = await standings();
  assert.deepEqual(
    before.rounds.map((r) => r.resultsVersion),
    [1, 1, 1],
  );
  // By hand after R1 (no drop): W 20, X 15, Y 12, Z 10.
  assert.deepEqual(table(before.after[0].rows), ['1 W 20', '2 X 15', '3 Y 12', '4 Z 10']);
  // After R3, one drop: W 20 + 15 + 20 drops 15 -> 40; X 15 + 20 + 12 drops 12 -> 35;
  // Y 12 + 10 + 15 drops 10 -> 27; Z 10 + 12 + 10 drops R1's 10 (the earliest of equal) -> 22.
  assert.deepEqual(table(before.after[2].rows), ['1 W 40', '2 X 35', '3 Y 27', '4 Z 22']);

  // The stewards take two places from W at R3 (W Y X Z becomes Y X W Z) and deduct 3 points from X there.
  await penalise(rounds[2], 0, 'places_deducted', 2);
  await penalise(rounds[2], 1, 'points_deducted', 3);
  const after = await standings();
  assert.equal(after.rounds[2].resultsVersion, 3, 'two amended versions of R3');
  // R3 now Y 20, X 15, W 12, Z 10. W 20 + 15 + 12 drops 12 -> 35; X 15 + 20 + 15 drops R1's 15 -> 35, less 3 -> 32;
  // Y 12 + 10 + 20 drops 10 -> 32; Z 22 as before. X and Y tie at 32: one first place each;
  // second places X 2 (R1, R3), Y 0 -> X ahead.
  assert.deepEqual(table(after.after[2].rows), ['1 W 35', '2 X 32', '3 Y 32', '4 Z 22']);
  assert.equal(after.after[2].rows[1].pointsDeducted, 3);
  assert.equal(after.penaltiesByBoat[boats[0].id].length, 1, "W's penalty counted in its season");
  assert.match(after.tieRule, /count-back/);
  // Rounds before the penalty are unchanged.
  assert.deepEqual(table(after.after[1].rows), table(before.after[1].rows));
});

test("season race numbers: unique per series class, one per boat, only for a boat entered at the organisations' meetings; shown in the standings", async () => {
  for (const [i, n] of [7, 8, 9, 10].entries()) {
    const r = await secretary.json(`${C()}/race-numbers`, { boatId: boats[i].id, raceNumber: n });
    assert.equal(r.res.status, 201, JSON.stringify(r.body));
  }
  const count = async () =>
    Number(
      (
        await query<{ n: string }>('select count(*) as n from series_race_numbers where series_class_id = $1', [
          classId,
        ])
      )[0].n,
    );
  const taken = await secretary.json(`${C()}/race-numbers`, { boatId: randomUUID(), raceNumber: 7 });
  assert.equal(taken.res.status, 400, 'no such boat');
  const twice = await secretary.json(`${C()}/race-numbers`, { boatId: boats[0].id, raceNumber: 77 });
  assert.equal(twice.res.status, 409);
  assert.equal(twice.body.error.details[0].field, 'boatId');
  const [{ id: spare }] = await query<{ id: string }>(
    `insert into boats (owner_id, name, declared_nozzle_mm, declared_power_kw) values ($1, 'Spare', 101, 200) returning id`,
    [owners[0].id],
  );
  // A boat that never entered a meeting of the series' organisations (its id is no secret: standings show
  // boat ids): a number would put its owner on the class's bulletin mail. Refused with the same answer as a
  // boat that does not exist.
  const stranger = await secretary.json(`${C()}/race-numbers`, { boatId: spare, raceNumber: 70 });
  assert.equal(stranger.res.status, 400, JSON.stringify(stranger.body));
  assert.equal(stranger.body.error.details[0].field, 'boatId');
  assert.equal(stranger.body.error.details[0].message, taken.body.error.details[0].message, 'nothing told apart');
  const [{ id: spareEvent }] = await query<{ id: string }>(
    `insert into events (organisation_id, name, slug, venue, starts_on, ends_on, time_zone, status)
     values ($1, $2, $3, 'Test Reach', '2027-04-04', '2027-04-04', 'UTC', 'entries_open') returning id`,
    [CLUB, `Club day ${tag}`, `series-${tag}-club-day`],
  );
  const [{ id: spareClass }] = await query<{ id: string }>(
    `insert into race_classes (event_id, name, code) values ($1, 'Club', 'CL') returning id`,
    [spareEvent],
  );
  await query(
    `insert into entries (event_id, class_id, boat_id, entrant_id, race_number, status, fee_minor, currency)
     values ($1, $2, $3, $4, 99, 'entered', 0, 'NZD')`,
    [spareEvent, spareClass, spare, owners[0].id],
  );
  const dup = await secretary.json(`${C()}/race-numbers`, { boatId: spare, raceNumber: 7 });
  assert.equal(dup.res.status, 409);
  assert.equal(dup.body.error.details[0].field, 'raceNumber');
  assert.equal((await seriesSteward.s.json(`${C()}/race-numbers`, { boatId: spare, raceNumber: 70 })).res.status, 403);
  assert.equal(await count(), 4, 'nothing stored by the refused requests');
  const s = await standings();
  assert.equal(s.competitors[boats[2].id].seasonNumber, 9);
});

test('a technical bulletin reaches every entrant of the class, once each; only the secretary publishes; bulletins are append-only', async () => {
  const body = {
    title: `Nozzle gauge ${tag}`,
    body: 'From round 3 the nozzle exit is gauged with the go/no-go ring.',
    effectiveFrom: '2027-03-01',
  };
  for (const s of [seriesSteward.s, outsider.s, steward])
    assert.equal((await s.json(`${C()}/bulletins`, body)).res.status, 403);
  assert.equal((await new HttpSession().json(`${C()}/bulletins`, body)).res.status, 401);
  const bad = await secretary.json(`${C()}/bulletins`, { ...body, effectiveFrom: '1 March' });
  assert.equal(bad.res.status, 400);
  assert.equal(bad.body.error.details[0].field, 'effectiveFrom');
  const pub = await secretary.json(`${C()}/bulletins`, body);
  assert.equal(pub.res.status, 201, JSON.stringify(pub.body));
  assert.equal(pub.body.data.number, 1);
  assert.equal(pub.body.data.recipientCount, 4, 'the four entrants of the rounds, each once');
  for (const o of owners) {
    const mail = await waitForMail(o.email, {
      subject: new RegExp(`Technical bulletin 1 \\(SR\\): Nozzle gauge ${tag}`),
    });
    assert.match(mail.text, /go\/no-go ring/);
    assert.match(mail.text, /licensed officials decide/);
  }
  const queued = await query<{ to_address: string }>(
    `select to_address from mail_outbox where kind = 'series_bulletin' and subject like $1`,
    [`%Nozzle gauge ${tag}`],
  );
  assert.deepEqual(queued.map((q) => q.to_address).sort(), owners.map((o) => o.email).sort(), 'no one else');
  const list = await (await fetch(`${BASE_URL}${C()}/bulletins`)).json();
  assert.equal(list.data[0].title, body.title);
  await assert.rejects(
    query(`update series_bulletins set title = 'x' where id = $1`, [pub.body.data.id]),
    /append-only/,
  );
});

test('parity history across three rounds with a rule change between the second and third', async () => {
  // Series rules: version 1 from the start of the season, version 2 (a smaller nozzle) from 1 March,
  // between R2 (14 February) and R3 (7 March).
  const v1 = await secretary.json(`${C()}/rules`, { rules: RULES, effectiveFrom: '2027-01-01' });
  assert.equal(v1.res.status, 201, JSON.stringify(v1.body));
  const noNote = await secretary.json(`${C()}/rules`, { rules: RULES, effectiveFrom: '2027-03-01' });
  assert.equal(noNote.res.status, 400);
  const early = await secretary.json(`${C()}/rules`, { rules: RULES, effectiveFrom: '2026-12-01', changeNote: 'x' });
  assert.equal(early.res.status, 400);
  const v2 = await secretary.json(`${C()}/rules`, {
    rules: { ...RULES, nozzle: { ...RULES.nozzle, maxMm: 100.5 } },
    effectiveFrom: '2027-03-01',
    changeNote: 'Nozzle maximum 100.5 mm',
  });
  assert.equal(v2.res.status, 201, JSON.stringify(v2.body));
  assert.equal(v2.body.data.version, 2);

  const readings = [
    [
      [101.2, 101.3, 101.25],
      [99.8, 99.9, 99.85],
      [101.9, 101.85, 101.95],
      [98.7, 98.75, 98.72],
    ],
    [
      [101.1, 101.2, 101.15],
      [99.7, 99.8, 99.75],
      [101.8, 101.9, 101.85],
      [98.9, 98.95, 98.92],
    ],
    [
      [100.3, 100.4, 100.35],
      [99.9, 100.0, 99.95],
      [100.4, 100.45, 100.5],
      [99.6, 99.65, 99.62],
    ],
  ];
  const published: {
    summary: { spreadPercent: number; coefficientOfVariationPercent: number };
    boats: { id: string; staticThrustN: number }[];
  }[] = [];
  for (const [i, r] of rounds.entries()) {
    for (let b = 0; b < 4; b++) await addInspection(r, b, readings[i][b]);
    const pub = await organiser.json(`/api/events/${r.eventId}/classes/${r.classId}/report/publish`, {
      note: 'series',
    });
    assert.equal(pub.res.status, 201, JSON.stringify(pub.body));
    const rep = await (await fetch(`${BASE_URL}/api/reports/${pub.body.data.publicId}`)).json();
    published.push(rep.data.results.parity);
  }
  for (const s of [outsider.s, steward]) assert.equal((await s.fetch(`${C()}/parity-history`)).status, 403);
  const res = await seriesSteward.s.fetch(`${C()}/parity-history`);
  assert.equal(res.status, 200);
  const h = (await res.json()).data as {
    rounds: {
      roundId: string;
      spreadPercent: number;
      coefficientOfVariationPercent: number;
      deviationsPercent: Record<string, number>;
    }[];
    ruleChanges: { version: number; afterRoundIndex: number }[];
  };
  assert.deepEqual(
    h.rounds.map((r) => r.roundId),
    rounds.map((r) => r.classId),
  );
  for (const [i, f] of h.rounds.entries()) {
    const t = published[i].boats.map((b) => b.staticThrustN);
    const med = ss.median(t);
    // The report's own figures and simple-statistics agree with the history's.
    assert.ok(Math.abs(f.spreadPercent - published[i].summary.spreadPercent) < 1e-9);
    assert.ok(Math.abs(f.spreadPercent - ((ss.max(t) - ss.min(t)) / med) * 100) < 1e-9);
    assert.ok(Math.abs(f.coefficientOfVariationPercent - (ss.sampleStandardDeviation(t) / ss.mean(t)) * 100) < 1e-9);
    for (const [b, boat] of boats.entries()) {
      const entryId = rounds[i].entries.get(boat.id)!;
      const x = published[i].boats.find((p) => p.id === entryId)!.staticThrustN;
      assert.ok(Math.abs(f.deviationsPercent[boat.id] - ((x - med) / med) * 100) < 1e-9, `boat ${b} round ${i + 1}`);
    }
  }
  assert.deepEqual(
    h.ruleChanges.map((c) => [c.version, c.afterRoundIndex]),
    [[2, 1]],
    'marked between R2 and R3',
  );
  await assert.rejects(
    query(`update series_rule_versions set change_note = 'x' where series_class_id = $1`, [classId]),
    /append-only/,
  );
});

test('refused input stores nothing: a round from another organisation, a second series of one name, a rising points table, a class code twice', async () => {
  const [{ id: otherClub }] = await query<{ id: string }>(
    `insert into organisations (name, slug) values ('Series Other Club', $1) returning id`,
    [`series-other-${tag}`],
  );
  const [{ id: otherEvent }] = await query<{ id: string }>(
    `insert into events (organisation_id, name, slug, venue, starts_on, ends_on, time_zone) values ($1, 'Elsewhere', $2, 'Far', '2027-04-01', '2027-04-01', 'UTC') returning id`,
    [otherClub, `series-other-ev-${tag}`],
  );
  const [{ id: otherClass }] = await query<{ id: string }>(
    `insert into race_classes (event_id, name, code) values ($1, 'Other', 'OT') returning id`,
    [otherEvent],
  );
  const refused = await secretary.json(`${C()}/rounds`, { classId: otherClass });
  assert.equal(refused.res.status, 400);
  assert.equal(refused.body.error.details[0].field, 'classId');
  assert.equal((await seriesSteward.s.json(`${C()}/rounds`, { classId: otherClass })).res.status, 403);
  assert.equal(
    (await organiser.json(`/api/series`, { name: 'Not mine', season: 2027, organisationIds: [otherClub] })).res.status,
    403,
  );
  const again = await secretary.json('/api/series', { name: `test cup ${tag}`, season: 2027, organisationIds: [CLUB] });
  assert.equal(again.res.status, 409, 'one series of a name per season (any case)');
  const classes = async () =>
    Number(
      (await query<{ n: string }>('select count(*) as n from series_classes where series_id = $1', [seriesId]))[0].n,
    );
  const before = await classes();
  const rising = await secretary.json(`${S()}/classes`, { code: 'BAD', name: 'Bad', pointsByPosition: [10, 12] });
  assert.equal(rising.res.status, 400);
  assert.equal(rising.body.error.details[0].field, 'pointsByPosition');
  assert.equal(
    (await secretary.json(`${S()}/classes`, { code: 'sr', name: 'Same code', pointsByPosition: [5] })).res.status,
    409,
  );
  assert.equal(await classes(), before, 'nothing stored');
  const [{ sc }] = await query<{ sc: string | null }>('select series_class_id as sc from race_classes where id = $1', [
    otherClass,
  ]);
  assert.equal(sc, null, 'nothing stored');
});

test('exports: standings, penalties and appeals as CSV and PDF for the series officials and the appeal body; not for others', async () => {
  const appealBody = await signIn(DEMO.appealBody);
  // What the exports must carry, read from the public standings and the database at this moment.
  const now = await standings();
  const top = now.after.at(-1)?.rows[0];
  const [{ n: penaltyCount }] = await query<{ n: string }>(
    `select count(*) as n from penalties p join entries e on e.id = p.entry_id join race_classes rc on rc.id = e.class_id
      where rc.series_class_id = $1`,
    [classId],
  );
  for (const [who, s] of [
    ['secretary', secretary],
    ['series steward', seriesSteward.s],
    ['appeal body', appealBody],
  ] as const) {
    const csv = await s.fetch(`${S()}/exports/standings.csv`);
    assert.equal(csv.status, 200, who);
    assert.match(csv.headers.get('content-type') ?? '', /text\/csv/);
    const lines = (await csv.text()).trim().split('\r\n');
    assert.equal(lines[0], 'class,position,season_number,boat,total,gross,dropped,deducted,rounds,penalties');
    if (top) {
      const c = now.competitors[top.competitorId];
      const head = `SR,${top.position},${c.seasonNumber ?? ''},${c.boatName},${top.total},`;
      assert.ok(lines[1].startsWith(head), `${lines[1]} starts with ${head}`);
    }
    assert.equal(lines.length - 1, now.after.at(-1)?.rows.length ?? 0, who);
  }
  const pens = await (await secretary.fetch(`${S()}/exports/penalties.csv`)).text();
  assert.equal(pens.trim().split('\r\n').length, 1 + Number(penaltyCount), 'header and each penalty at the rounds');
  const appeals = await secretary.fetch(`${S()}/exports/appeals.csv`);
  assert.equal(appeals.status, 200);
  const pdf = await seriesSteward.s.fetch(`${S()}/exports/standings.pdf`);
  assert.equal(pdf.status, 200);
  assert.equal(pdf.headers.get('content-type'), 'application/pdf');
  const text = (await extractPdfText(new Uint8Array(await pdf.arrayBuffer()))).join('\n');
  assert.match(text, /Standings: Test Cup/);
  assert.match(text, /count-back/);
  for (const s of [outsider.s, steward, owners[0].s])
    assert.equal((await s.fetch(`${S()}/exports/standings.csv`)).status, 403);
  assert.equal((await new HttpSession().fetch(`${S()}/exports/standings.csv`)).status, 401);
  assert.equal((await secretary.fetch(`${S()}/exports/entrants.csv`)).status, 404);
});

test('screens: the public series page shows the standings with the tie rule and the caution; the parity history page is for the series officials', async () => {
  const page = await new HttpSession().fetch(`/series/${seriesId}`);
  assert.equal(page.status, 200);
  const html = await page.text();
  assert.match(html, new RegExp(`Test Cup ${tag}`));
  assert.match(html, /count-back/);
  assert.match(html, /licensed officials decide/);
  assert.equal((await new HttpSession().fetch(`/series/${randomUUID()}`)).status, 404);
  const parity = await seriesSteward.s.fetch(`/series/${seriesId}/classes/${classId}/parity`);
  assert.equal(parity.status, 200);
  const shown = (await parity.text()).replace(/<!-- -->/g, ''); // React's markers between text nodes
  assert.match(shown, /Parity history: Series Runabout \(SR\)/);
  assert.match(shown, /rules v2 from 2027-03-01/);
  const refused = await outsider.s.fetch(`/series/${seriesId}/classes/${classId}/parity`);
  assert.doesNotMatch(await refused.text(), /Coefficient of variation/);
});

/** RFC 4180 cells of a CSV text (quoted cells with "" inside; CRLF between records). */
function csvCells(text: string): string[][] {
  const rows: string[][] = [[]];
  let cell = '';
  let quoted = false;
  const end = () => {
    rows.at(-1)!.push(cell);
    cell = '';
  };
  for (let k = 0; k < text.length; k++) {
    const ch = text[k];
    if (quoted && ch === '"' && text[k + 1] === '"') {
      cell += '"';
      k++;
    } else if (ch === '"') quoted = !quoted;
    else if (!quoted && ch === ',') end();
    else if (!quoted && ch === '\r' && text[k + 1] === '\n') {
      end();
      rows.push([]);
      k++;
    } else cell += ch;
  }
  return rows.filter((r) => r.length);
}

test("exports: a boat name an entrant typed as a formula is never a formula in the governing body's spreadsheet", async () => {
  // An entrant controls their boat's name, and the standings export carries it to the series' officials.
  // OWASP ASVS 5.0 requirement 1.2.10 (a cell beginning with = + - @ tab or NUL gets a leading apostrophe)
  // and OWASP "CSV Injection" (from memory: a cell must not begin with one of these after a field separator
  // either, such as ";" where a spreadsheet splits on it): the hostile names stay one text cell each.
  const names = ["@SUM(1+1)*cmd|' /C calc'!A0", "Gale;=1+cmd|' /C calc'!A0"];
  for (const [i, name] of names.entries()) {
    const renamed = await owners[i].s.json(`/api/boats/${boats[i].id}`, { name }, 'PATCH');
    assert.equal(renamed.res.status, 200, JSON.stringify(renamed.body));
  }
  const res = await secretary.fetch(`${S()}/exports/standings.csv`);
  assert.equal(res.status, 200);
  const text = await res.text();
  const cells = csvCells(text);
  const boatColumn = cells[0].indexOf('boat');
  assert.deepEqual(
    cells
      .slice(1)
      .map((r) => r[boatColumn])
      .filter((b) => names.some((n) => b.endsWith(n)))
      .sort(),
    ["'@SUM(1+1)*cmd|' /C calc'!A0", "Gale;=1+cmd|' /C calc'!A0"],
  );
  assert.ok(text.includes(`,"Gale;=1+cmd|' /C calc'!A0",`), 'the cell with a semicolon is quoted');
  for (const row of cells) for (const c of row) assert.doesNotMatch(c, /^[=+\-@\t\r]/, `formula cell ${c}`);
  // Split where a spreadsheet set to ";" would split: no piece outside quotes begins a formula.
  for (const line of text.split('\r\n'))
    for (const piece of line.replace(/"(?:[^"]|"")*"/g, 'Q').split(';'))
      assert.doesNotMatch(piece, /^[=+\-@]/, `a ";" spreadsheet would read a formula in ${line}`);
});

test('a round at a meeting still in draft is not announced on the public series page or standings until the meeting opens', async () => {
  const [{ id: draftEvent }] = await query<{ id: string }>(
    `insert into events (organisation_id, name, slug, venue, starts_on, ends_on, time_zone, status)
     values ($1, $2, $3, 'Test Reach', '2027-05-02', '2027-05-02', 'UTC', 'draft') returning id`,
    [CLUB, `Unannounced round ${tag}`, `series-${tag}-draft`],
  );
  const [{ id: draftClass }] = await query<{ id: string }>(
    `insert into race_classes (event_id, name, code) values ($1, 'Series class 4', 'SR4') returning id`,
    [draftEvent],
  );
  const link = await secretary.json(`${C()}/rounds`, { classId: draftClass });
  assert.equal(link.res.status, 201, JSON.stringify(link.body));
  const anonymous = new HttpSession();
  const shown = async () => {
    const series = (await (await anonymous.fetch(S())).json()).data as { classes: { rounds: { eventId: string }[] }[] };
    const inStandings = (await standings(anonymous)).rounds as unknown as { eventId: string }[];
    const page = await (await anonymous.fetch(`/series/${seriesId}`)).text();
    return {
      api: series.classes.some((c) => c.rounds.some((r) => r.eventId === draftEvent)),
      standings: inStandings.some((r) => r.eventId === draftEvent),
      page: page.includes(`Unannounced round ${tag}`),
    };
  };
  assert.deepEqual(await shown(), { api: false, standings: false, page: false }, 'the draft meeting stays unannounced');
  await query(`update events set status = 'entries_open' where id = $1`, [draftEvent]);
  assert.deepEqual(await shown(), { api: true, standings: true, page: true }, 'listed once the meeting is open');
});
