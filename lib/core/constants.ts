// Enumerations shared by models, validations and screens (no framework imports).
// Column enumerations live with the models (models/shapes/, which import nothing from lib/).
export { EVENT_STATUSES, EVENT_STAFF_ROLES, type EventStatus, type EventStaffRole } from '../../models/shapes/event';

// Safety items commonly checked on jet boats (common practice; the local rulebook governs).
export const SAFETY_ITEMS = {
  kill_switch: 'Kill switch and lanyard',
  helmet: 'Helmet',
  life_jacket: 'Life jacket or race jacket',
  harness: 'Harness',
  roll_cage: 'Roll cage',
  fire_extinguisher: 'Fire extinguisher',
  first_aid_kit: 'First-aid kit',
  tow_point: 'Tow point',
} as const;
export type SafetyItem = keyof typeof SAFETY_ITEMS;
export const SAFETY_ITEM_KEYS = Object.keys(SAFETY_ITEMS) as SafetyItem[];

export const POWER_EVIDENCE = { dyno_sheet: 'Dyno sheet', maker_rating: "Maker's rating", none: 'None yet' } as const;

export const CURRENCIES = ['NZD', 'AUD', 'USD', 'GBP', 'EUR', 'CAD'] as const;
