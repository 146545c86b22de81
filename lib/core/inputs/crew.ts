// What the entrant sends about the people on an entry and their dated safety gear, what the chief
// scrutineer's side sends about accepted licence grades, and what the dock sends when it confirms
// gear. One schema each, used by the forms and the server.
import { z } from 'zod';
import { isSingleLine } from './text-safety';
import {
  BOAT_GEAR_KINDS,
  CREW_LIMITS,
  CREW_ROLES,
  EARLIEST_DATE,
  GEAR_CHECK_OUTCOMES,
  GEAR_DATE_KINDS,
  GEAR_KINDS,
  LATEST_DATE,
  PERSONAL_GEAR_KINDS,
} from '../crew/crew-terms';

const line = (what: string, max: number, min = 1) =>
  z
    .string({ error: `Enter ${what} as text.` })
    .trim()
    .min(min, `Enter ${what}.`)
    .max(max, `Keep ${what} under ${max + 1} characters.`)
    .refine(isSingleLine, `Keep ${what} on one line.`);

/** A real calendar day between 1900 and 2099 (zod checks month lengths and leap years). */
const calendarDay = (what: string) =>
  z.iso
    .date({ error: `Give ${what} as a date (yyyy-mm-dd).` })
    // Zod runs a refinement after a failed format too: judge the range only of a date-shaped text (one message each).
    .refine(
      (d) => !/^\d{4}-\d{2}-\d{2}$/.test(d) || (d >= EARLIEST_DATE && d <= LATEST_DATE),
      `Give ${what} between 1900 and 2099.`,
    );

/** A list of at most `max`; refine (not .max, which zod also applies to a string's length) keeps one message. */
const list = <T extends z.ZodType>(item: T, max: number, tooMany: string, what: string) =>
  z.array(item, { error: `Send ${what} as a list.` }).refine((a) => a.length <= max, tooMany);

// Letters, digits and a few separators: what licence and serial numbers are printed with.
const CODE = /^[\p{L}\p{N}][\p{L}\p{N} ./-]*$/u;
const code = (what: string, max: number) =>
  line(what, max).refine((s) => CODE.test(s), `Use letters, digits, spaces, dots, slashes and hyphens in ${what}.`);

const id = z.uuid({ error: 'Not a known item.' });

export const GearItemInput = z.object({
  id: id.optional(),
  kind: z.enum(GEAR_KINDS, { error: 'Choose what the item is.' }),
  standard: line('the standard it is made to', 60),
  serial: code('the serial number', 60),
  dateKind: z.enum(GEAR_DATE_KINDS, { error: 'Say whether the date is an expiry or a service date.' }),
  dueOn: calendarDay('the expiry or service date'),
});
export type GearItemInput = z.infer<typeof GearItemInput>;

export const CrewMemberInput = z.object({
  id: id.optional(),
  role: z.enum(CREW_ROLES, { error: 'Choose driver, navigator or reserve.' }),
  name: line('the name', 120),
  /** The entrant's own account stands behind this person (the entrant drives, say). */
  isEntrant: z.boolean({ error: 'Say yes or no.' }).default(false),
  bornOn: calendarDay('the date of birth'),
  licence: z
    .object({
      issuedBy: line('the issuing body', 80),
      grade: code('the licence grade', 20),
      number: code('the licence number', 40),
      expiresOn: calendarDay('the licence expiry'),
    })
    .nullable()
    .default(null),
  medicalExpiresOn: calendarDay('the medical certificate’s expiry').nullable().default(null),
  guardian: z
    .object({
      name: line('the parent’s or guardian’s name', 120),
      consentOn: calendarDay('the date the consent was signed'),
    })
    .nullable()
    .default(null),
  gear: list(
    GearItemInput,
    CREW_LIMITS.gearPerMember,
    `At most ${CREW_LIMITS.gearPerMember} items per person.`,
    'the gear',
  ),
});
export type CrewMemberInput = z.infer<typeof CrewMemberInput>;

export const SaveCrewInput = z
  .object({
    members: list(
      CrewMemberInput,
      CREW_LIMITS.members,
      `At most ${CREW_LIMITS.members} people per entry.`,
      'the people',
    ),
    boatGear: list(
      GearItemInput,
      CREW_LIMITS.boatGear,
      `At most ${CREW_LIMITS.boatGear} items on the boat.`,
      'the boat’s gear',
    ),
  })
  .superRefine((v, ctx) => {
    const today = new Date(Date.now() + 86_400_000).toISOString().slice(0, 10); // a day's grace for the zones
    for (const role of ['driver', 'navigator'] as const) {
      const at = v.members.map((m, i) => (m.role === role ? i : -1)).filter((i) => i >= 0);
      for (const i of at.slice(1))
        ctx.addIssue({ code: 'custom', path: ['members', i, 'role'], message: `An entry has one ${role}.` });
    }
    const entrants = v.members.map((m, i) => (m.isEntrant ? i : -1)).filter((i) => i >= 0);
    for (const i of entrants.slice(1))
      ctx.addIssue({ code: 'custom', path: ['members', i, 'isEntrant'], message: 'Only one person can be you.' });
    const ids = new Set<string>();
    const seen = (itemId: string | undefined, path: (string | number)[]) => {
      if (!itemId) return;
      if (ids.has(itemId)) ctx.addIssue({ code: 'custom', path, message: 'This item is listed twice.' });
      ids.add(itemId);
    };
    v.members.forEach((m, i) => {
      seen(m.id, ['members', i, 'id']);
      if (m.bornOn > today)
        ctx.addIssue({ code: 'custom', path: ['members', i, 'bornOn'], message: 'A date of birth cannot be ahead.' });
      if (m.guardian && m.guardian.consentOn > today)
        ctx.addIssue({
          code: 'custom',
          path: ['members', i, 'guardian', 'consentOn'],
          message: 'The consent cannot be signed on a day still ahead.',
        });
      m.gear.forEach((g, j) => {
        seen(g.id, ['members', i, 'gear', j, 'id']);
        if (!(PERSONAL_GEAR_KINDS as readonly string[]).includes(g.kind))
          ctx.addIssue({
            code: 'custom',
            path: ['members', i, 'gear', j, 'kind'],
            message: 'This item belongs to the boat: list it with the boat’s gear.',
          });
      });
    });
    v.boatGear.forEach((g, j) => {
      seen(g.id, ['boatGear', j, 'id']);
      if (!(BOAT_GEAR_KINDS as readonly string[]).includes(g.kind))
        ctx.addIssue({
          code: 'custom',
          path: ['boatGear', j, 'kind'],
          message: 'This item is worn by a person: list it with that person.',
        });
    });
  });
export type SaveCrewInput = z.infer<typeof SaveCrewInput>;

/** The licence grades a class (or, with classId null, the whole meeting) accepts. An empty list accepts any grade. */
export const SetCrewRequirementsInput = z.object({
  classId: z.uuid({ error: 'Choose a class of this meeting, or none for the whole meeting.' }).nullable(),
  acceptedLicenceGrades: list(
    code('a licence grade', 20),
    CREW_LIMITS.licenceGrades,
    `At most ${CREW_LIMITS.licenceGrades} grades.`,
    'the grades',
  ),
  navigatorRequired: z.boolean({ error: 'Say yes or no.' }),
});
export type SetCrewRequirementsInput = z.infer<typeof SetCrewRequirementsInput>;

/** The dock confirms what it saw of each item of one entry's gear, for the meeting day it is recorded on. */
export const RecordGearChecksInput = z.object({
  entryId: z.uuid({ error: 'Choose a boat of this meeting.' }),
  items: list(
    z.object({
      gearItemId: id,
      outcome: z.enum(GEAR_CHECK_OUTCOMES, { error: 'Choose what was found.' }),
      note: line('the note', 300, 0).default(''),
    }),
    CREW_LIMITS.members * CREW_LIMITS.gearPerMember + CREW_LIMITS.boatGear,
    'Too many items.',
    'the items',
  ).refine((a) => a.length >= 1, 'Confirm at least one item.'),
});
export type RecordGearChecksInput = z.infer<typeof RecordGearChecksInput>;

/** An official signs people of one entry on for today. */
export const SignOnCrewInput = z.object({
  entryId: z.uuid({ error: 'Choose a boat of this meeting.' }),
  crewMemberIds: list(
    z.uuid({ error: 'Not a known person.' }),
    CREW_LIMITS.members,
    'Too many people.',
    'the people',
  ).refine((a) => a.length >= 1, 'Choose at least one person.'),
});
export type SignOnCrewInput = z.infer<typeof SignOnCrewInput>;
