// Words and limits for the people on an entry and their dated safety gear. Zod-free: the dock's and the
// entrant's client code import it.
import { SAFETY_ITEMS } from '../constants';

export const CREW_ROLES = ['driver', 'navigator', 'reserve'] as const;
export type CrewRole = (typeof CREW_ROLES)[number];
export const CREW_ROLE_LABELS: Record<CrewRole, string> = {
  driver: 'Driver',
  navigator: 'Navigator',
  reserve: 'Reserve',
};
/** Roles that ride in the boat and so must wear the personal gear the class requires. */
export const ON_BOARD_ROLES: readonly CrewRole[] = ['driver', 'navigator'];

/** Worn by each person on board. */
export const PERSONAL_GEAR_KINDS = ['helmet', 'harness', 'life_jacket'] as const;
/** Carried by the boat. */
export const BOAT_GEAR_KINDS = ['fire_extinguisher', 'first_aid_kit'] as const;
export const GEAR_KINDS = [...PERSONAL_GEAR_KINDS, ...BOAT_GEAR_KINDS] as const;
export type GearKind = (typeof GEAR_KINDS)[number];
export type PersonalGearKind = (typeof PERSONAL_GEAR_KINDS)[number];
export type BoatGearKind = (typeof BOAT_GEAR_KINDS)[number];
/** The class's own safety item words (lib/core/constants.ts), so the rules and the gear name an item alike. */
export const GEAR_KIND_LABELS: Record<GearKind, string> = {
  helmet: SAFETY_ITEMS.helmet,
  harness: SAFETY_ITEMS.harness,
  life_jacket: SAFETY_ITEMS.life_jacket,
  fire_extinguisher: SAFETY_ITEMS.fire_extinguisher,
  first_aid_kit: SAFETY_ITEMS.first_aid_kit,
};
/** Examples shown beside the standard field; real standards under their own names. */
export const GEAR_STANDARD_HINTS: Record<GearKind, string> = {
  helmet: 'the standard on its label',
  harness: 'the standard or maker’s specification',
  life_jacket: 'e.g. ISO 12402-5',
  fire_extinguisher: 'e.g. EN 3-7',
  first_aid_kit: 'the kit’s specification',
};

/** A date on an item is either when it expires or when its next service is due. */
export const GEAR_DATE_KINDS = ['expires', 'service_due'] as const;
export type GearDateKind = (typeof GEAR_DATE_KINDS)[number];
export const GEAR_DATE_KIND_LABELS: Record<GearDateKind, string> = {
  expires: 'Expires on',
  service_due: 'Service due on',
};

/** What the scrutineer found at the dock for one item on one meeting day. */
export const GEAR_CHECK_OUTCOMES = ['confirmed', 'not_presented', 'not_as_declared'] as const;
export type GearCheckOutcome = (typeof GEAR_CHECK_OUTCOMES)[number];
export const GEAR_CHECK_OUTCOME_LABELS: Record<GearCheckOutcome, string> = {
  confirmed: 'Seen, as declared',
  not_presented: 'Not presented',
  not_as_declared: 'Not as declared',
};

/** Under this age on a meeting day a person needs a guardian's consent (common practice, no source; the local rulebook decides). */
export const ADULT_AGE_YEARS = 18;

export const CREW_LIMITS = {
  members: 8,
  gearPerMember: 6,
  boatGear: 6,
  licenceGrades: 20,
} as const;
/** Calendar dates outside these years are refused: nothing real is dated year 0 or 9999. */
export const EARLIEST_DATE = '1900-01-01';
export const LATEST_DATE = '2099-12-31';
