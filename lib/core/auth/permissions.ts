// The one permission table: every server action and route handler asks it.
// Roles are per event (organiser, chief_scrutineer, scrutineer, steward), per person
// (entrant: anyone signed in) or above any single meeting (admin, and appeal_body: the governing body's
// appeal body, which hears appeals against stewards' decisions of every meeting) or per series
// (series_secretary runs a series: its classes, rules, rounds, numbers and bulletins; series_steward reads its
// penalties and parity history). Framework-free so tests can read it.

export const ROLES = [
  'entrant',
  'scrutineer',
  'chief_scrutineer',
  'steward',
  'organiser',
  'admin',
  'appeal_body',
  'series_secretary',
  'series_steward',
] as const;
export type Role = (typeof ROLES)[number];

export const PERMISSIONS = {
  // Own account and own boats
  'account.view': [
    'entrant',
    'scrutineer',
    'chief_scrutineer',
    'steward',
    'organiser',
    'admin',
    'appeal_body',
    'series_secretary',
    'series_steward',
  ],
  'boat.manage_own': ['entrant'],
  'entry.submit_own': ['entrant'],
  'protest.lodge': ['entrant'],
  'appeal.lodge': ['entrant'], // a party to a penalty gives notice of appeal (the server checks who is a party)
  // Running a meeting
  'event.create': ['organiser', 'admin'],
  'event.edit': ['organiser'],
  'event.staff_manage': ['organiser'],
  'class.edit': ['organiser'],
  'entry.view_all': ['organiser', 'chief_scrutineer', 'steward'],
  'entry.cancel': ['organiser'],
  'tags.print': ['organiser', 'chief_scrutineer'],
  'report.publish': ['organiser'],
  'results.publish': ['organiser'],
  // At the dock
  'inspection.record': ['scrutineer', 'chief_scrutineer'],
  'inspection.board': ['scrutineer', 'chief_scrutineer', 'organiser'],
  'inspection.assign_reinspection': ['chief_scrutineer', 'steward'],
  // No pass, no start: the start list of a meeting day, and the organiser's recorded decisions on it
  'start_list.view': ['scrutineer', 'chief_scrutineer', 'steward', 'organiser'],
  'start_list.decide': ['organiser'],
  'instrument.manage': ['chief_scrutineer', 'organiser'],
  // The day's scrutineering schedule: slots opened, and any entry given one, by the chief scrutineer
  'schedule.manage': ['chief_scrutineer'],
  // Incidents on the water or ashore: recorded by the organiser or the chief scrutineer, read by the officials
  'incident.record': ['organiser', 'chief_scrutineer'],
  'incident.view': ['scrutineer', 'chief_scrutineer', 'steward', 'organiser'],
  // Parts held by the officials
  'custody.take': ['scrutineer', 'chief_scrutineer', 'steward'],
  'custody.release': ['chief_scrutineer', 'steward'],
  'custody.view': ['scrutineer', 'chief_scrutineer', 'steward', 'organiser'],
  // A boat's logbook: dated notes (damage, repairs) by the technical officials who may read it (entry.view_all)
  'boat.log_note': ['chief_scrutineer', 'steward'],
  // Protests
  'protest.decide': ['steward'],
  'protest.view_all': ['steward', 'organiser'],
  'audit.read': ['steward', 'organiser'],
  // The record chain (issue 24): a meeting's export bundle. It carries every chained row (the audit trail,
  // protest evidence), so only those who may read all of them (audit.read and protest.view_all) export it.
  'chain.export': ['steward', 'organiser'],
  // Penalties: the organiser keeps the meeting's catalogue (a series' later), a technical delegate reports to
  // the stewards without a protest, and the stewards impose penalties from an upheld protest or a report
  'penalty.catalogue_manage': ['organiser'],
  'technical_report.file': ['scrutineer', 'chief_scrutineer'],
  'penalty.apply': ['steward'],
  // Appeals to the governing body: its appeal body hears and decides them, for any meeting
  'appeal.hear': ['appeal_body'],
  // Series: an organiser (of the organisation that starts it) or the site administrator starts one and becomes
  // its secretary; the secretary runs it and publishes its technical bulletins; the series' officials read its
  // penalties and parity history; the governing body's exports (standings, penalties, appeals) go to the series'
  // officials and the appeal body. Standings are public, as published results are.
  'series.create': ['organiser', 'admin'],
  'series.manage': ['series_secretary'],
  'series.bulletin_publish': ['series_secretary'],
  'series.parity_view': ['series_secretary', 'series_steward'],
  'series.export': ['series_secretary', 'series_steward', 'appeal_body'],
  // Conflicts of interest: every official declares their own; stewards and the organiser read the whole register
  'interest.declare': ['scrutineer', 'chief_scrutineer', 'steward', 'organiser'],
  'interest.view_register': ['steward', 'organiser'],
  // Site
  'admin.manage_users': ['admin'],
  'dev.outbox': ['admin'], // the demo's outbox holds everyone's sign-in links
  'chain.check': ['admin'], // re-verify every record chain now, and see the last self-check
  'admin.view_metrics': ['admin'], // request timings by route, pool use, recording outcomes
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

export function roleCan(role: Role, permission: Permission): boolean {
  return (PERMISSIONS[permission] as readonly Role[]).includes(role);
}

export function rolesCan(roles: readonly Role[], permission: Permission): boolean {
  return roles.some((r) => roleCan(r, permission));
}

export function permissionsOf(role: Role): Permission[] {
  return (Object.keys(PERMISSIONS) as Permission[]).filter((p) => roleCan(role, p));
}
