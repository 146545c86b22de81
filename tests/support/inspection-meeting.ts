// A fresh meeting for inspection tests, so each test run owns its records (inspections are
// append-only: nothing can be cleaned up afterwards). Classes, rules and staff go through the
// real API as the demo organiser; boats and entries are inserted with SQL (entering and paying is
// tested elsewhere). The rule figures are chosen per test; none is taken from the demo data.
import assert from 'node:assert/strict';
import { randomBytes, randomUUID } from 'node:crypto';
import { HttpSession } from './http-session';
import { DEMO, DEMO_PASSWORD } from './env';
import { query } from './db';

export const rulesWith = (over: Record<string, unknown> = {}) => ({
  nozzle: { maxMm: 102, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 },
  power: { minKw: null, maxKw: null, defaultUncertaintyKw: 5 },
  weight: { minKg: null, includesDriver: true, defaultUncertaintyKg: 1 },
  decisionRule: 'iso14253',
  safetyItems: ['helmet'],
  parity: {
    pumpEfficiency: 0.9,
    nozzleLossCoefficient: 0.02,
    inletLossCoefficient: 0.2,
    wakeFraction: 0,
    referenceSpeedsMs: [10],
  },
  ...over,
});

export type TestEntry = { id: string; boatId: string; raceNumber: number; boatName: string; token: string };

export class InspectionMeeting {
  organiser = new HttpSession();
  eventId = '';
  private nextNumber = 100;

  /** Creates the meeting and gives the listed people their staff roles there. */
  async create(name: string, staff: { email: string; role: string }[]) {
    await this.organiser.signInWithPassword(DEMO.organiser, DEMO_PASSWORD);
    const { res, body } = await this.organiser.json('/api/events', {
      organisationId: '0b0e0000-0000-4000-8000-000000000001',
      name,
      venue: 'Test Reach',
      startsOn: '2027-05-01',
      endsOn: '2027-05-02',
      timeZone: 'Pacific/Auckland',
      status: 'entries_open',
      waterKind: 'fresh',
      waterTemperatureC: 15,
      waterDensityKgM3: null,
      protestWindowMinutes: 30,
      currency: 'NZD',
      entryFeeMinor: 10000,
      protestFeeMinor: 3000,
    });
    assert.equal(res.status, 201, JSON.stringify(body));
    this.eventId = body.data.id;
    for (const s of staff) {
      const r = await this.organiser.json(`/api/events/${this.eventId}/staff`, s);
      assert.equal(r.res.status, 201, JSON.stringify(r.body));
    }
    return this;
  }

  /** A class with rules published a day ago (so they are in force now), or only drafted. */
  async addClass(code: string, rules: Record<string, unknown>, opts: { publish?: boolean } = {}): Promise<string> {
    const c = await this.organiser.json(`/api/events/${this.eventId}/classes`, { name: `Class ${code}`, code });
    assert.equal(c.res.status, 201, JSON.stringify(c.body));
    const saved = await this.organiser.json(
      `/api/events/${this.eventId}/classes/${c.body.data.id}/rules`,
      { powerUnit: 'kW', rules },
      'PUT',
    );
    assert.equal(saved.res.status, 200, JSON.stringify(saved.body));
    if (opts.publish !== false) {
      const p = await this.organiser.json(`/api/events/${this.eventId}/classes/${c.body.data.id}/rules/publish`, {
        changeNote: 'test',
        effectiveFrom: new Date(Date.now() - 86_400_000).toISOString(),
      });
      assert.equal(p.res.status, 201, JSON.stringify(p.body));
    }
    return c.body.data.id;
  }

  /** A boat owned by `ownerEmail` (the demo entrant by default), entered in the class, with a current tag. */
  async addEntry(classId: string, opts: { ownerEmail?: string; declaredPowerKw?: number } = {}): Promise<TestEntry> {
    const [owner] = await query<{ id: string }>('select id from users where email = $1', [
      opts.ownerEmail ?? DEMO.entrant,
    ]);
    const raceNumber = this.nextNumber++;
    const boatName = `Test Boat ${raceNumber} ${randomBytes(2).toString('hex')}`;
    const [boat] = await query<{ id: string }>(
      `insert into boats (owner_id, name, hull_number, declared_nozzle_mm, declared_power_kw, power_evidence)
       values ($1, $2, $3, 101.5, $4, 'dyno_sheet') returning id`,
      [owner.id, boatName, `T-${raceNumber}`, opts.declaredPowerKw ?? 220],
    );
    const [entry] = await query<{ id: string }>(
      `insert into entries (event_id, class_id, boat_id, entrant_id, race_number, status, fee_minor, currency, paid_at)
       values ($1, $2, $3, $4, $5, 'entered', 10000, 'NZD', now()) returning id`,
      [this.eventId, classId, boat.id, owner.id, raceNumber],
    );
    const token = randomBytes(18).toString('base64url');
    await query('insert into boat_tags (boat_id, token) values ($1, $2)', [boat.id, token]);
    return { id: entry.id, boatId: boat.id, raceNumber, boatName, token };
  }

  /**
   * An accepted protest against the entry with the re-inspection a steward ordered for it (SQL: lodging,
   * paying and ordering are tested in the protest tests). Returns the task's id, which a record of kind
   * "protest" must name.
   */
  async addProtestTask(entryId: string, requestedChecks: string[] | null = null): Promise<string> {
    const [lodger] = await query<{ id: string }>('select id from users where email = $1', [DEMO.organiser]);
    const [protest] = await query<{ id: string }>(
      `insert into protests (event_id, lodged_by_id, against_entry_id, matter_key, rule_reference, grounds, requested_checks,
                             status, fee_minor, currency, window_deadline, paid_at)
       values ($1, $2, $3, $4, 'RC 2.1', 'Measure the boat again.', $5::jsonb, 'accepted', 3000, 'NZD', now() + interval '1 hour', now())
       returning id`,
      [this.eventId, lodger.id, entryId, `entry:${entryId}:${randomUUID()}`, JSON.stringify(requestedChecks)],
    );
    const [task] = await query<{ id: string }>(
      `insert into reinspections (event_id, entry_id, reason, requested_by_id, protest_id, created_at, updated_at)
       values ($1, $2, 'Ordered by the protest committee.', $3, $4, now(), now()) returning id`,
      [this.eventId, entryId, lodger.id, protest.id],
    );
    return task.id;
  }
}

/** A valid record body: three readings (the largest given), typed U 0.05 mm, helmet ticked. */
export function inspectionBody(entryId: string, largestMm: number, over: Record<string, unknown> = {}) {
  return {
    idempotencyKey: randomUUID(),
    entryId,
    kind: 'pre_race',
    capturedAt: new Date().toISOString(),
    device: 'integration test',
    nozzle: {
      readings: [
        { diameterMm: 101.5, angleDeg: 0 },
        { diameterMm: largestMm, angleDeg: 60 },
        { diameterMm: 101.8, angleDeg: 120 },
      ],
      expandedUncertaintyMm: 0.05,
    },
    power: { declaredKw: 220, evidenceSeen: true },
    safety: { helmet: true },
    ...over,
  };
}

/**
 * A scratch meeting as the page benchmark and the page profile open it: the demo scrutineer on its staff, a class with
 * published rules, two entries, and a conforming record (101.9 mm) of the first, so its boat card lists one.
 */
export async function meetingWithRecordedBoat(name: string, classCode: string) {
  const meeting = new InspectionMeeting();
  await meeting.create(name, [{ email: DEMO.scrutineer, role: 'scrutineer' }]);
  const classId = await meeting.addClass(classCode, rulesWith());
  const entry = await meeting.addEntry(classId);
  await meeting.addEntry(classId);
  const scrutineer = new HttpSession();
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
  const rec = await scrutineer.json(`/api/events/${meeting.eventId}/inspections`, inspectionBody(entry.id, 101.9));
  if (rec.res.status !== 201) throw new Error(`recording failed: ${JSON.stringify(rec.body)}`);
  return { meeting, classId, entry };
}
