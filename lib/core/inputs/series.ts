// One zod schema per series input, shared by the forms and the route handlers.
import { z } from 'zod';
import { ClassRules } from './class-rules';
import { email } from './auth';
import { SERIES_OFFICIAL_ROLES } from '../../../models/shapes/series';

export { SERIES_OFFICIAL_ROLES };
export type { SeriesOfficialRole } from '../../../models/shapes/series';

const text = (min: number, max: number, tooShort: string) =>
  z.string({ error: tooShort }).trim().min(min, tooShort).max(max, `Keep this under ${max} characters.`);
const oneLine = (v: string) => !/[\r\n]/.test(v);
const day = (what: string) => z.iso.date({ error: `Give ${what} as a date (YYYY-MM-DD).` });

export const CreateSeriesInput = z.strictObject({
  name: text(3, 120, 'Name the series (at least 3 characters).').refine(oneLine, 'One line.'),
  season: z
    .number({ error: 'Give the season as a year.' })
    .int('Give the season as a year.')
    .min(2000, 'Give the season as a year.')
    .max(2200, 'Give the season as a year.'),
  organisationIds: z
    .array(z.uuid({ error: 'Choose an organisation.' }), {
      error: 'Choose the organisations whose meetings are rounds.',
    })
    .min(1, 'Choose at least one organisation whose meetings are rounds.')
    .max(20, 'At most 20 organisations.'),
});
export type CreateSeriesInput = z.infer<typeof CreateSeriesInput>;

// Appointing is by invitation to the address (whether or not it has an account): the same answer either way.
export const AppointSeriesOfficialInput = z.strictObject({
  email,
  role: z.enum(SERIES_OFFICIAL_ROLES, { error: 'Choose secretary or steward.' }),
});
export type AppointSeriesOfficialInput = z.infer<typeof AppointSeriesOfficialInput>;

export const CreateSeriesClassInput = z.strictObject({
  code: z
    .string({ error: 'Give the class a short code (for example "J1").' })
    .trim()
    .regex(/^[A-Za-z0-9][A-Za-z0-9-]{0,11}$/, 'Use up to 12 letters, digits or hyphens.'),
  name: text(2, 120, 'Name the class.').refine(oneLine, 'One line.'),
  pointsByPosition: z
    .array(z.number().int('Points are whole numbers.').min(0, 'Points are 0 or more.').max(1000, 'At most 1000.'), {
      error: 'Give the points for each place, first place first.',
    })
    .min(1, 'Give the points for at least first place.')
    .max(100, 'At most 100 places.')
    .refine((t) => t.every((p, i) => i === 0 || p <= t[i - 1]), 'A lower place may not score more than a higher one.'),
  droppedRounds: z
    .number({ error: 'Give the number of dropped rounds.' })
    .int('A whole number.')
    .min(0, 'At least 0.')
    .max(20, 'At most 20.')
    .default(0),
});
export type CreateSeriesClassInput = z.infer<typeof CreateSeriesClassInput>;

export const PublishSeriesRulesInput = z.strictObject({
  rules: ClassRules,
  effectiveFrom: day('the date the rules take effect'),
  changeNote: z.string().trim().max(2000, 'Keep this under 2000 characters.').default(''),
});

export const LinkRoundInput = z.strictObject({
  classId: z.uuid({ error: "Choose the meeting's class that is a round." }),
});

export const AssignRaceNumberInput = z.strictObject({
  boatId: z.uuid({ error: 'Choose the boat.' }),
  raceNumber: z
    .number({ error: 'Give the race number.' })
    .int('A whole number.')
    .min(1, 'From 1 to 9999.')
    .max(9999, 'From 1 to 9999.'),
});

export const PublishBulletinInput = z.strictObject({
  title: text(3, 200, 'Give the bulletin a title.').refine(oneLine, 'One line.'),
  body: text(10, 20000, 'Write the bulletin (at least 10 characters).'),
  effectiveFrom: day('the date the bulletin takes effect'),
});
