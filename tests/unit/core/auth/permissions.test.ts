// The one permission table: each role's allowed and denied permissions, written out here by
// hand from the product's role descriptions (common practice at race meetings, no single source:
// scrutineers inspect, stewards decide protests, organisers run the meeting and publish; parts taken
// into custody at the dock are released by the chief scrutineer or the stewards; notes in a boat's
// logbook are written by the chief scrutineer or the stewards, who may read it; the chief scrutineer
// runs the scrutineering schedule; the organiser or the chief scrutineer records incidents, which the
// meeting's officials read; the meeting's officials read the start list, and the organiser decides on it;
// a technical delegate reports to the stewards without a protest, the stewards impose penalties from the
// organiser's catalogue, and appeals against them go to the governing body's appeal body, which is no
// official of the meeting). A series (issue 22, item 3) is run by its secretary, who publishes its technical
// bulletins; its stewards read its penalties and parity history; the governing body's exports go to the
// series' officials and to the appeal body (common practice in series motorsport, no single source).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  PERMISSIONS,
  ROLES,
  permissionsOf,
  roleCan,
  rolesCan,
  type Permission,
  type Role,
} from '../../../../lib/core/auth/permissions';
import { navFor } from '../../../../lib/core/navigation';

const EXPECTED: Record<Role, Permission[]> = {
  entrant: ['account.view', 'boat.manage_own', 'entry.submit_own', 'protest.lodge', 'appeal.lodge'],
  scrutineer: [
    'account.view',
    'inspection.record',
    'inspection.board',
    'custody.take',
    'custody.view',
    'interest.declare',
    'incident.view',
    'start_list.view',
    'technical_report.file',
  ],
  chief_scrutineer: [
    'account.view',
    'entry.view_all',
    'tags.print',
    'inspection.record',
    'inspection.board',
    'inspection.assign_reinspection',
    'instrument.manage',
    'custody.take',
    'custody.release',
    'custody.view',
    'boat.log_note',
    'interest.declare',
    'schedule.manage',
    'incident.record',
    'incident.view',
    'start_list.view',
    'technical_report.file',
  ],
  steward: [
    'account.view',
    'entry.view_all',
    'inspection.assign_reinspection',
    'protest.decide',
    'protest.view_all',
    'audit.read',
    'custody.take',
    'custody.release',
    'custody.view',
    'boat.log_note',
    'interest.declare',
    'interest.view_register',
    'incident.view',
    'start_list.view',
    'penalty.apply',
    'chain.export',
  ],
  organiser: [
    'account.view',
    'event.create',
    'event.edit',
    'event.staff_manage',
    'class.edit',
    'entry.view_all',
    'entry.cancel',
    'tags.print',
    'report.publish',
    'results.publish',
    'inspection.board',
    'instrument.manage',
    'protest.view_all',
    'audit.read',
    'custody.view',
    'interest.declare',
    'interest.view_register',
    'incident.record',
    'incident.view',
    'start_list.view',
    'start_list.decide',
    'penalty.catalogue_manage',
    'series.create',
    'chain.export',
  ],
  admin: [
    'account.view',
    'event.create',
    'admin.manage_users',
    'dev.outbox',
    'admin.view_metrics',
    'series.create',
    'chain.check',
  ],
  appeal_body: ['account.view', 'appeal.hear', 'series.export'],
  series_secretary: ['account.view', 'series.manage', 'series.bulletin_publish', 'series.parity_view', 'series.export'],
  series_steward: ['account.view', 'series.parity_view', 'series.export'],
};

for (const role of ROLES) {
  test(`${role}: allowed exactly the expected permissions`, () => {
    assert.deepEqual(new Set(permissionsOf(role)), new Set(EXPECTED[role]));
  });
  test(`${role}: denied every other permission`, () => {
    for (const p of Object.keys(PERMISSIONS) as Permission[]) {
      if (!EXPECTED[role].includes(p)) assert.equal(roleCan(role, p), false, `${role} must not have ${p}`);
    }
  });
}

test('separation of duties: no one decides a protest and records an inspection with one role', () => {
  for (const role of ROLES) assert.ok(!(roleCan(role, 'protest.decide') && roleCan(role, 'inspection.record')), role);
});

test('separation of duties: whoever imposes a penalty or decides a protest does not hear the appeal against it, and the appeal body runs nothing at a meeting', () => {
  assert.deepEqual(
    ROLES.filter((r) => roleCan(r, 'appeal.hear')),
    ['appeal_body'],
  );
  for (const role of ROLES)
    assert.ok(
      !(roleCan(role, 'appeal.hear') && (roleCan(role, 'penalty.apply') || roleCan(role, 'protest.decide'))),
      role,
    );
  for (const p of ['penalty.apply', 'protest.decide', 'results.publish', 'entry.view_all', 'protest.view_all'] as const)
    assert.equal(roleCan('appeal_body', p), false, p);
  // Penalties are imposed by the stewards only; a technical delegate reports but does not decide.
  assert.deepEqual(
    ROLES.filter((r) => roleCan(r, 'penalty.apply')),
    ['steward'],
  );
  assert.equal(rolesCan(['entrant', 'chief_scrutineer'], 'penalty.apply'), false);
});

test('conflicts of interest: every official of a meeting declares; only stewards and the organiser read the whole register; an entrant neither', () => {
  for (const role of ['scrutineer', 'chief_scrutineer', 'steward', 'organiser'] as const)
    assert.equal(roleCan(role, 'interest.declare'), true, role);
  assert.deepEqual(
    ROLES.filter((r) => roleCan(r, 'interest.view_register')),
    ['steward', 'organiser'],
  );
  assert.equal(rolesCan(['entrant', 'admin'], 'interest.declare'), false);
});

test('an entrant cannot record inspections or decide protests; a combination of roles adds up', () => {
  assert.equal(rolesCan(['entrant'], 'inspection.record'), false);
  assert.equal(rolesCan(['entrant'], 'protest.decide'), false);
  assert.equal(rolesCan(['entrant', 'scrutineer'], 'inspection.record'), true);
});

test('navigation shows each role only its areas', () => {
  const hrefs = (roles: Role[]) => navFor(roles).map((i) => i.href);
  assert.deepEqual(hrefs(['entrant']), ['/home', '/boats', '/entries', '/protests', '/calculator', '/account']);
  assert.ok(hrefs(['entrant', 'organiser']).includes('/organise'));
  assert.ok(!hrefs(['entrant', 'scrutineer']).includes('/organise'));
  assert.ok(hrefs(['entrant', 'admin']).includes('/admin'));
  assert.ok(!hrefs(['entrant', 'organiser']).includes('/admin'));
  for (const staff of ['scrutineer', 'chief_scrutineer', 'organiser'] as const)
    assert.ok(hrefs(['entrant', staff]).includes('/inspect'), staff);
  assert.ok(!hrefs(['entrant', 'steward']).includes('/inspect'));
  assert.ok(hrefs(['entrant', 'appeal_body']).includes('/appeals'));
  assert.ok(!hrefs(['entrant', 'steward', 'organiser', 'admin']).includes('/appeals'));
  for (const official of ['series_secretary', 'series_steward'] as const)
    assert.ok(hrefs(['entrant', official]).includes('/series'), official);
  assert.ok(!hrefs(['entrant', 'steward', 'organiser', 'admin', 'appeal_body']).includes('/series'));
});

test("the demo outbox (everyone's sign-in links) is the site administrator's alone", () => {
  for (const role of ROLES) assert.equal(roleCan(role, 'dev.outbox'), role === 'admin', role);
  assert.equal(
    rolesCan(
      ROLES.filter((r) => r !== 'admin'),
      'dev.outbox',
    ),
    false,
    'no combination of other roles adds up to it',
  );
});

test('series: only the secretary runs a series and publishes bulletins; its officials run nothing at a meeting; the appeal body exports but runs no series', () => {
  assert.deepEqual(
    ROLES.filter((r) => roleCan(r, 'series.manage')),
    ['series_secretary'],
  );
  assert.deepEqual(
    ROLES.filter((r) => roleCan(r, 'series.bulletin_publish')),
    ['series_secretary'],
  );
  for (const role of ['series_secretary', 'series_steward'] as const)
    for (const p of [
      'penalty.apply',
      'protest.decide',
      'results.publish',
      'entry.view_all',
      'appeal.hear',
      'class.edit',
    ] as const)
      assert.equal(roleCan(role, p), false, `${role} must not have ${p}`);
  assert.equal(roleCan('appeal_body', 'series.manage'), false);
  assert.equal(roleCan('appeal_body', 'series.export'), true);
  assert.equal(rolesCan(['entrant', 'series_steward'], 'series.bulletin_publish'), false);
});
