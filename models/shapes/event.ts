// Column enumerations of events and their staff (pure: models type their columns from these, and
// lib/core/constants.ts re-exports them under the names the rest of the app uses).
export const EVENT_STATUSES = ['draft', 'entries_open', 'entries_closed', 'racing', 'finished'] as const;
export type EventStatus = (typeof EVENT_STATUSES)[number];

export const EVENT_STAFF_ROLES = ['organiser', 'chief_scrutineer', 'scrutineer', 'steward'] as const;
export type EventStaffRole = (typeof EVENT_STAFF_ROLES)[number];
