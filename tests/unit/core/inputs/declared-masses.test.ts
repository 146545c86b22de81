import { test } from 'node:test';
import assert from 'node:assert/strict';
import { DeclareMassesInput } from '../../../../lib/core/inputs/declared-masses';

// The bounds are sanity limits of this project (common practice, no source): crew 30–400 kg, fuel 0–200 kg.
test('declared masses: numbers within the bounds or null; both keys always sent; nothing else', () => {
  assert.deepEqual(DeclareMassesInput.parse({ crewKg: 150.5, fuelKg: 0 }), { crewKg: 150.5, fuelKg: 0 });
  assert.deepEqual(DeclareMassesInput.parse({ crewKg: null, fuelKg: null }), { crewKg: null, fuelKg: null });
  assert.deepEqual(DeclareMassesInput.parse({ crewKg: 30, fuelKg: 200 }), { crewKg: 30, fuelKg: 200 });
  assert.deepEqual(DeclareMassesInput.parse({ crewKg: 400, fuelKg: 25 }), { crewKg: 400, fuelKg: 25 });
  const refused = (body: unknown) => {
    const r = DeclareMassesInput.safeParse(body);
    assert.equal(r.success, false, JSON.stringify(body));
    return r.error!.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join(' | ');
  };
  assert.match(refused({ crewKg: 29.9, fuelKg: null }), /^crewKg: The crew mass is at least 30 kg/);
  assert.match(refused({ crewKg: 400.1, fuelKg: null }), /^crewKg: .*at most 400 kg: check the unit/);
  assert.match(refused({ crewKg: null, fuelKg: -1 }), /^fuelKg: The fuel mass is at least 0 kg/);
  assert.match(refused({ crewKg: null, fuelKg: 200.5 }), /^fuelKg: .*at most 200 kg/);
  assert.match(refused({ crewKg: '150', fuelKg: null }), /^crewKg: Enter the crew mass in kilograms/);
  assert.match(refused({ crewKg: Number.NaN, fuelKg: null }), /^crewKg: /);
  assert.match(refused({ crewKg: Number.POSITIVE_INFINITY, fuelKg: null }), /^crewKg: /);
  assert.match(refused({ crewKg: 150 }), /^fuelKg: /);
  assert.match(refused({ crewKg: 150, fuelKg: 20, entrantId: 'x' }), /entrantId/);
  refused([150, 20]);
  refused(null);
});

// The browser's check (declared-masses-check.ts, no zod) against the server's zod schema: the same verdict and
// the same words for every value the form can produce (a number, null for an empty field, NaN for a typed word).
test('the form’s zod-free check gives the server schema’s answer and words, value by value', async () => {
  const { checkDeclaredMasses } = await import('../../../../lib/core/inputs/declared-masses-check');
  const { fieldErrors } = await import('../../../../lib/core/errors');
  const values = [
    null,
    Number.NaN,
    Infinity,
    -Infinity,
    -1,
    0,
    0.1,
    29.9,
    30,
    150.5,
    199.99,
    200,
    200.01,
    400,
    400.1,
    1e9,
  ];
  let compared = 0;
  for (const crewKg of values) {
    for (const fuelKg of values) {
      const server = DeclareMassesInput.safeParse({ crewKg, fuelKg });
      const phone = checkDeclaredMasses({ crewKg, fuelKg });
      const label = JSON.stringify({ crewKg: String(crewKg), fuelKg: String(fuelKg) });
      assert.equal(phone.ok, server.success, label);
      if (server.success && phone.ok) assert.deepEqual(phone.data, server.data, label);
      if (!server.success && !phone.ok) assert.deepEqual(phone.fieldErrors, fieldErrors(server.error), label);
      compared++;
    }
  }
  assert.equal(compared, values.length ** 2);
});
