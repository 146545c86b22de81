// The crew and gear input: dates must be real calendar days from 1900 to 2099 (ISO 8601 calendar
// dates; month lengths and leap years per the Gregorian calendar), names and numbers one line, licence
// and serial numbers printable letters and digits, one driver and one navigator at most, personal gear
// with a person and the boat's gear with the boat. Control characters anywhere in a body are refused
// by the body reader before this schema (findUnsafeText; Unicode Standard Annex #9 for the
// direction controls, CVE-2021-42574), and also fail the number pattern here.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { SaveCrewInput, RecordGearChecksInput, SetCrewRequirementsInput } from '../../../../lib/core/inputs/crew';
import { findUnsafeText } from '../../../../lib/core/inputs/text-safety';

const member = (over: Record<string, unknown> = {}) => ({
  role: 'driver',
  name: 'Ana Example',
  bornOn: '1990-06-15',
  licence: { issuedBy: 'Invented Body', grade: 'A', number: 'L-100', expiresOn: '2030-01-01' },
  medicalExpiresOn: '2030-01-01',
  gear: [{ kind: 'life_jacket', standard: 'ISO 12402-5', serial: 'LJ-1', dateKind: 'expires', dueOn: '2029-01-01' }],
  ...over,
});
const fields = (body: unknown) => {
  const r = SaveCrewInput.safeParse(body);
  return r.success ? [] : r.error.issues.map((i) => i.path.join('.'));
};

test('a full crew and boat gear pass', () => {
  const r = SaveCrewInput.parse({
    members: [member(), member({ role: 'navigator', name: 'Bo Example', gear: [] })],
    boatGear: [
      { kind: 'fire_extinguisher', standard: 'EN 3-7', serial: 'FX-1', dateKind: 'service_due', dueOn: '2028-02-29' },
    ],
  });
  assert.equal(r.members[0].isEntrant, false);
  assert.equal(r.members[1].guardian, null);
});

test('dates: year 0, 9999, 30 February, a common-year 29 February and text are refused', () => {
  for (const d of ['0000-01-01', '9999-12-31', '2027-02-30', '2027-02-29', 'tomorrow', '2027-5-1', '']) {
    assert.deepEqual(
      fields({ members: [member({ medicalExpiresOn: d })], boatGear: [] }),
      ['members.0.medicalExpiresOn'],
      d,
    );
  }
  assert.deepEqual(fields({ members: [member({ bornOn: '1899-12-31' })], boatGear: [] }), ['members.0.bornOn']);
  const ahead = new Date(Date.now() + 3 * 86_400_000).toISOString().slice(0, 10);
  assert.deepEqual(fields({ members: [member({ bornOn: ahead })], boatGear: [] }), ['members.0.bornOn']);
});

test('licence numbers: control characters, line breaks and symbols are refused', () => {
  for (const n of ['L\u0000100', 'L\u0007100', 'L-\n100', 'L\t100', '<b>1</b>', '-100', 'x'.repeat(41)]) {
    const body = {
      members: [member({ licence: { issuedBy: 'B', grade: 'A', number: n, expiresOn: '2030-01-01' } })],
      boatGear: [],
    };
    assert.ok(fields(body).includes('members.0.licence.number'), JSON.stringify(n));
  }
  // The body reader refuses the control characters first, naming the field.
  assert.deepEqual(findUnsafeText({ members: [{ licence: { number: 'L\u0000100' } }] }), {
    field: 'members.0.licence.number',
    codePoint: 'U+0000',
  });
});

test('one driver, one navigator, one "me"; gear on the right side; sizes capped', () => {
  assert.deepEqual(fields({ members: [member(), member()], boatGear: [] }), ['members.1.role']);
  assert.deepEqual(
    fields({ members: [member({ isEntrant: true }), member({ role: 'reserve', isEntrant: true })], boatGear: [] }),
    ['members.1.isEntrant'],
  );
  assert.deepEqual(
    fields({
      members: [
        member({
          gear: [{ kind: 'first_aid_kit', standard: 'x', serial: 'F1', dateKind: 'expires', dueOn: '2029-01-01' }],
        }),
      ],
      boatGear: [{ kind: 'helmet', standard: 'x', serial: 'H1', dateKind: 'expires', dueOn: '2029-01-01' }],
    }),
    ['members.0.gear.0.kind', 'boatGear.0.kind'],
  );
  assert.deepEqual(fields({ members: Array.from({ length: 9 }, () => member({ role: 'reserve' })), boatGear: [] }), [
    'members',
  ]);
  const id = '0b0e0000-0000-4000-8000-0000000000aa';
  assert.deepEqual(
    fields({ members: [member({ id, gear: [] }), member({ role: 'reserve', id, gear: [] })], boatGear: [] }),
    ['members.1.id'],
  );
  assert.deepEqual(fields({ members: 'all of them', boatGear: [] }), ['members']);
});

test('requirements and dock checks', () => {
  assert.equal(
    SetCrewRequirementsInput.safeParse({ classId: null, acceptedLicenceGrades: ['A'], navigatorRequired: true })
      .success,
    true,
  );
  assert.equal(
    SetCrewRequirementsInput.safeParse({ classId: null, acceptedLicenceGrades: ['A\nB'], navigatorRequired: true })
      .success,
    false,
  );
  assert.equal(
    SetCrewRequirementsInput.safeParse({ classId: 'x', acceptedLicenceGrades: [], navigatorRequired: true }).success,
    false,
  );
  assert.equal(
    RecordGearChecksInput.safeParse({ entryId: '0b0e0000-0000-4000-8000-0000000000aa', items: [] }).success,
    false,
  );
  assert.equal(
    RecordGearChecksInput.safeParse({
      entryId: '0b0e0000-0000-4000-8000-0000000000aa',
      items: [{ gearItemId: '0b0e0000-0000-4000-8000-0000000000ab', outcome: 'maybe' }],
    }).success,
    false,
  );
});
